import { createQueryKeys } from '../../../lib/query-keys';

export const catalogKeys = createQueryKeys('catalog');
