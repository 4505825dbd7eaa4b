import { createQueryKeys } from '../../../lib/query-keys';

export const authKeys = createQueryKeys('auth');
export const sessionKey = authKeys.item('session');
