import { createQueryKeys } from '../../../lib/query-keys';

export const mailKeys = createQueryKeys('mail');
