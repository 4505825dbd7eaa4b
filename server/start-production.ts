// `npm start`'s server process: migrate (and seed the demo into an empty database), then serve.
import { DatabaseSetupError, setUpDatabase } from './database-setup';

try {
  await setUpDatabase(process.env.DATABASE_URL, { seed: true });
} catch (error) {
  if (!(error instanceof DatabaseSetupError)) throw error;
  console.error(error.message);
  process.exit(1);
}
await import('./index');
