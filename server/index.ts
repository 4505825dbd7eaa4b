import { resolve } from 'node:path';
import { createApp } from './app';
import { createServices } from './compose-services';
import { createDataSource, initializeDataSource } from './data-source';
import { loadEnv } from './env';

const env = loadEnv();
const dataSource = await initializeDataSource(createDataSource(env.DATABASE_URL, { logging: env.DB_LOGGING }));
const services = createServices(dataSource, env);
const app = createApp({
  dataSource,
  env,
  services,
  clientDir: env.NODE_ENV === 'production' ? resolve(import.meta.dirname, '..', 'dist', 'client') : undefined,
});

const server = app.listen(env.PORT, env.HOST, () => {
  console.log(`Benchwire is running at http://${env.HOST}:${env.PORT}  (Ctrl-C stops it)`);
});

let closing = false;
async function shutdown() {
  if (closing) return;
  closing = true;
  server.close();
  server.closeIdleConnections();
  await dataSource.destroy().catch(() => {});
  process.exit(0);
}
process.on('SIGINT', shutdown);
process.on('SIGTERM', shutdown);
