import 'reflect-metadata';
import { afterAll } from 'vitest';
import { closeTestContext } from './support/test-app';

// Each test file shares one DataSource on the throwaway database `npm test` created and migrated.
afterAll(async () => {
  await closeTestContext();
});
