import { useMutation } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { okSchema } from '../../../../shared/schemas/common';

export function signOut() {
  return apiClient.post('/api/auth/sign-out', {}, { schema: okSchema });
}

/** The caller decides where to go afterwards and clears the cache once it has left the signed-in screens. */
export function useSignOut() {
  return useMutation({ mutationFn: signOut });
}
