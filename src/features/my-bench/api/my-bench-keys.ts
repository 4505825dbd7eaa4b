import { createQueryKeys } from '../../../lib/query-keys';

export const myBenchKeys = createQueryKeys('my-bench');
