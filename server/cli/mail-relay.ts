// The local mail relay as its own process: `npm start`, `npm run dev` and `npm test` start it (scripts/lib/mail-relay.mjs)
// unless SMTP_URL names a real relay. It keeps every message in the database DATABASE_URL names.
//   MAIL_RELAY_PORT         port on 127.0.0.1 (default 2525; 0 picks a free one)
//   MAIL_RELAY_FAIL_AFTER   accept this many messages, then answer MAIL_RELAY_FAIL_COUNT (default 50) with 451
import { databaseRelayStore, startLocalRelay } from '../mail/local-relay';

const databaseUrl = process.env.DATABASE_URL;
if (!databaseUrl) {
  console.error('[mail relay] DATABASE_URL is missing: the relay keeps messages in the app database.');
  process.exit(1);
}
const failAfter = process.env.MAIL_RELAY_FAIL_AFTER ? Number(process.env.MAIL_RELAY_FAIL_AFTER) : undefined;
const relay = await startLocalRelay({
  store: databaseRelayStore(databaseUrl),
  port: Number(process.env.MAIL_RELAY_PORT ?? 2525),
  failAfter,
  failCount: failAfter === undefined ? undefined : Number(process.env.MAIL_RELAY_FAIL_COUNT ?? 50),
});
console.log(`[mail relay] listening at ${relay.url}; messages appear in the dev inbox`);

async function stop() {
  await relay.close().catch(() => {});
  process.exit(0);
}
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
