import { createQueryKeys } from '../../../lib/query-keys';

export const writeUpKeys = createQueryKeys('write-up');
