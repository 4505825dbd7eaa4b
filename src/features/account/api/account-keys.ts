import { createQueryKeys } from '../../../lib/query-keys';

export const accountKeys = createQueryKeys('account');
