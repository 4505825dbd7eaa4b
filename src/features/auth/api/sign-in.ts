import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { sessionResponseSchema, type CurrentUser, type SignInRequest } from '../../../../shared/schemas/auth';
import { sessionKey } from './auth-keys';

export async function signIn(input: SignInRequest): Promise<CurrentUser> {
  const { user } = await apiClient.post('/api/auth/sign-in', input, { schema: sessionResponseSchema });
  return user;
}

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: (user) => {
      // Nothing cached for a previous user may leak into this one's screens.
      queryClient.removeQueries();
      queryClient.setQueryData(sessionKey, user);
    },
  });
}
