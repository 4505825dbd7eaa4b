import { createQueryKeys } from '../../../lib/query-keys';

export const roundupKeys = createQueryKeys('roundups');
