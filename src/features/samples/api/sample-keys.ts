import { createQueryKeys } from '../../../lib/query-keys';

export const sampleKeys = createQueryKeys('samples');
