import { createQueryKeys } from '../../../lib/query-keys';

export const logCheckKeys = createQueryKeys('log-check');
