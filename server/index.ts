import { existsSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { createApp } from './app';
import { createServices } from './compose-services';
import { createDataSource, initializeDataSource } from './data-source';
import { loadEnv } from './env';

const env = loadEnv();
const dataSource = await initializeDataSource(createDataSource(env.DATABASE_URL, { logging: env.DB_LOGGING }));
const services = createServices(dataSource, env);
// The built client is dist/client: beside dist/server when this is the built server, under the project root
// when it runs from source.
const clientDir = [
  resolve(import.meta.dirname, '..', 'client'),
  resolve(import.meta.dirname, '..', 'dist', 'client'),
].find((dir) => existsSync(join(dir, 'index.html')));
const app = createApp({
  dataSource,
  env,
  services,
  clientDir: env.NODE_ENV === 'production' ? clientDir : undefined,
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
  await services.logFileAnalyser.close().catch(() => {});
  await dataSource.destroy().catch(() => {});
  process.exit(0);
}
process.on('SIGINT', shutdown);
process.on('SIGTERM', shutdown);
