import { createQueryKeys } from '../../../lib/query-keys';

export const benchKeys = createQueryKeys('benches');
