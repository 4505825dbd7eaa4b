import { createServer, connect, type Server, type Socket } from 'node:net';
import type { AddressInfo } from 'node:net';
import { afterAll, describe, expect, it } from 'vitest';
import type { DataSource } from 'typeorm';
import { createApp } from '../../../server/app';
import { createDataSource, initializeDataSource } from '../../../server/data-source';
import { ProductEntity } from '../../../server/entities/product.entity';
import { In } from 'typeorm';
import { signedIn, testDataSource, testEnv, type Client } from '../support/test-app';
import { productBody, tag } from '../planning/support/planning-fixtures';

/**
 * The database goes away for 10 s under read and write load and comes back. The app sits behind a TCP relay to the
 * test database; cutting the relay drops every open connection and refuses new ones, as a stopped MariaDB does
 * (`npm run drill:database` stops a real private MariaDB for the same check). Meanwhile every request ends with a
 * success or a 503 database_unavailable in JSON — never a 500, never a hang — and once the database is back the
 * same app, not restarted, answers again; every write that was answered 201 is in the database afterwards.
 */

const OUTAGE_MS = 10_000;
const BEFORE_MS = 1_500;
const AFTER_MS = 4_000;
/** No request may take longer than this: the pool's wait is bounded at 3 s and a connection attempt at 2 s here. */
const REQUEST_BOUND_MS = 8_000;

/** A TCP relay that can be cut (open connections dropped, new ones refused) and restored on the same port. */
async function startRelay(host: string, port: number) {
  const sockets = new Set<Socket>();
  let server: Server | null = null;
  let relayPort = 0;
  const listen = () =>
    new Promise<void>((resolve, reject) => {
      const next = createServer((inbound) => {
        const outbound = connect(port, host);
        sockets.add(inbound);
        sockets.add(outbound);
        const drop = () => {
          inbound.destroy();
          outbound.destroy();
          sockets.delete(inbound);
          sockets.delete(outbound);
        };
        for (const socket of [inbound, outbound]) socket.on('error', drop).on('close', drop);
        inbound.pipe(outbound);
        outbound.pipe(inbound);
      });
      next.once('error', reject);
      next.listen(relayPort, '127.0.0.1', () => {
        relayPort = (next.address() as AddressInfo).port;
        server = next;
        resolve();
      });
    });
  await listen();
  return {
    get port() {
      return relayPort;
    },
    async cut() {
      const closing = server;
      server = null;
      for (const socket of sockets) socket.destroy();
      await new Promise<void>((resolve) => (closing ? closing.close(() => resolve()) : resolve()));
    },
    restore: listen,
  };
}

type Outcome = { at: number; ms: number; status: number; code?: string; retryAfter?: string; id?: number };

let relayed: DataSource | null = null;
let relay: Awaited<ReturnType<typeof startRelay>> | null = null;
afterAll(async () => {
  await relayed?.destroy().catch(() => undefined);
  await relay?.cut();
});

describe('the database stopped for 10 s under load', () => {
  it('answers 503 database_unavailable meanwhile, recovers without a restart, and loses no acknowledged write', async () => {
    const direct = new URL(testEnv().DATABASE_URL);
    relay = await startRelay(direct.hostname, Number(direct.port || 3306));
    const viaRelay = new URL(direct);
    viaRelay.hostname = '127.0.0.1';
    viaRelay.port = String(relay.port);
    relayed = await initializeDataSource(
      createDataSource(viaRelay.toString(), { poolSize: 10, connectTimeoutMs: 2_000 }),
      {
        acquireTimeoutMs: 3_000,
      },
    );
    const app = createApp({ dataSource: relayed, env: testEnv() });
    const { agent: editor } = await signedIn(app, 'editor');
    const { agent: writer } = await signedIn(app, 'writer');
    const platform = `Helix-1700 ${tag()}`;

    const start = Date.now();
    const end = start + BEFORE_MS + OUTAGE_MS + AFTER_MS;
    const outcomes: { read: Outcome[]; write: Outcome[] } = { read: [], write: [] };
    const timedOut: string[] = [];
    async function loop(kind: 'read' | 'write', agent: Client) {
      while (Date.now() < end) {
        const at = Date.now() - start;
        const call =
          kind === 'read'
            ? agent.get('/api/catalog/products').query({ limit: 5 })
            : agent.post('/api/catalog/products').send(productBody(platform));
        try {
          const response = await call.timeout(REQUEST_BOUND_MS + 4_000);
          outcomes[kind].push({
            at,
            ms: Date.now() - start - at,
            status: response.status,
            code: response.body?.error?.code,
            retryAfter: response.headers['retry-after'],
            id: response.status === 201 ? response.body.id : undefined,
          });
        } catch (error) {
          timedOut.push(`${kind} at ${at} ms: ${(error as Error).message}`);
        }
        // A short pause so a refused request does not spin.
        await new Promise((resolve) => setTimeout(resolve, 50));
      }
    }
    const load = Promise.all([
      ...Array.from({ length: 4 }, () => loop('read', writer)),
      ...Array.from({ length: 2 }, () => loop('write', editor)),
    ]);
    await new Promise((resolve) => setTimeout(resolve, BEFORE_MS));
    await relay.cut();
    const cutAt = Date.now() - start;
    await new Promise((resolve) => setTimeout(resolve, OUTAGE_MS));
    await relay.restore();
    const restoredAt = Date.now() - start;
    await load;

    const all = [...outcomes.read, ...outcomes.write];
    expect(timedOut, 'requests that got no answer').toEqual([]);
    expect(all.filter((o) => o.ms > REQUEST_BOUND_MS)).toEqual([]);
    // Only successes and the database's own 503: no 500, no other error.
    expect(all.filter((o) => ![200, 201, 503].includes(o.status))).toEqual([]);
    const unavailable = all.filter((o) => o.status === 503);
    expect(unavailable.length, 'the outage was seen').toBeGreaterThan(0);
    expect(unavailable.every((o) => o.code === 'database_unavailable' && o.retryAfter === '5')).toBe(true);
    // Requests started well inside the outage all failed cleanly; none started before it succeeded after a hang.
    expect(all.filter((o) => o.at > cutAt + 500 && o.at + o.ms < restoredAt && o.status !== 503)).toEqual([]);
    // Back within 5 s of the database, and every request of the last 2 s succeeded (reads and writes).
    const firstBack = all.filter((o) => o.at >= restoredAt && o.status < 300).sort((a, b) => a.at - b.at)[0];
    expect(firstBack, 'a success after the database came back').toBeTruthy();
    expect(firstBack.at - restoredAt).toBeLessThan(5_000);
    const lastTwoSeconds = all.filter((o) => o.at > end - start - 2_000);
    expect(lastTwoSeconds.length).toBeGreaterThan(0);
    expect(lastTwoSeconds.filter((o) => o.status >= 300)).toEqual([]);
    expect(outcomes.write.some((o) => o.at > restoredAt && o.status === 201)).toBe(true);

    // Every write answered 201 is in the database (read directly, not through the relay).
    const acknowledged = outcomes.write.filter((o) => o.status === 201).map((o) => o.id!);
    expect(acknowledged.length).toBeGreaterThan(0);
    const stored = await (await testDataSource()).getRepository(ProductEntity).findBy({ id: In(acknowledged) });
    expect(stored.map((p) => p.id).sort((a, b) => a - b)).toEqual([...acknowledged].sort((a, b) => a - b));
    console.log(
      `[outage] ${all.length} requests: ${all.filter((o) => o.status < 300).length} succeeded, ${unavailable.length} answered 503; ` +
        `slowest ${Math.max(...all.map((o) => o.ms))} ms; back ${firstBack.at - restoredAt} ms after the database; ` +
        `${acknowledged.length} acknowledged writes all stored`,
    );
  }, 60_000);
});
