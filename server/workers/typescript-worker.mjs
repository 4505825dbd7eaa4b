// Worker threads run the TypeScript entry through tsx when the server runs from source (Vitest, `npm run dev`, the
// API tests): a worker thread does not inherit a loader registered by a test runner. The built server starts the
// compiled entry directly and never loads this file.
import { workerData } from 'node:worker_threads';
import { tsImport } from 'tsx/esm/api';

const entry = await tsImport(workerData.typescriptEntry, import.meta.url);
export default entry.default;
