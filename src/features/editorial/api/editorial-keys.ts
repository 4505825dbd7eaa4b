import { createQueryKeys } from '../../../lib/query-keys';

export const editorialKeys = createQueryKeys('editorial');
