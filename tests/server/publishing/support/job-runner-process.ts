// A server process's job runner alone, for the restart test: started as a child process, killed with SIGKILL.
import 'reflect-metadata';
import { createServices } from '../../../../server/compose-services';
import { createDataSource, initializeDataSource } from '../../../../server/data-source';
import { loadEnv } from '../../../../server/env';
import { createJobRegistry } from '../../../../server/jobs/all';
import { JobRunner } from '../../../../server/jobs/job-runner';

const env = loadEnv({ ...process.env, NODE_ENV: 'test', STORAGE_DRIVER: 'local' });
const dataSource = await initializeDataSource(createDataSource(env.DATABASE_URL, { poolSize: 3 }));
const services = createServices(dataSource, env);
const runner = new JobRunner(dataSource, createJobRegistry(services), { pollIntervalMs: 200 });
runner.start();
console.log('runner ready');
