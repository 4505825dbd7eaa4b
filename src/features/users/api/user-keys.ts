import { createQueryKeys } from '../../../lib/query-keys';

export const userKeys = createQueryKeys('users');
