// `npm start`'s server process: migrate (and seed the demo into an empty database), then serve.
import { setUpDatabase } from './database-setup';

await setUpDatabase(process.env.DATABASE_URL, { seed: true });
await import('./index');
