import { createQueryKeys } from '../../../lib/query-keys';

export const matrixKeys = createQueryKeys('matrix');
