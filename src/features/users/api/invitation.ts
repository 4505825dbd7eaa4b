import { queryOptions, useMutation, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { sessionResponseSchema, type CurrentUser } from '../../../../shared/schemas/auth';
import { invitationSchema, type AcceptInvitationRequest, type Invitation } from '../../../../shared/schemas/users';
import { userKeys } from './user-keys';

/** Who an invitation link is for; refused with a clear message when it is unknown, used or expired. */
export function getInvitation(token: string, signal?: AbortSignal): Promise<Invitation> {
  return apiClient.get(`/api/invitations/${encodeURIComponent(token)}`, { signal, schema: invitationSchema });
}

export function invitationQueryOptions(token: string) {
  return queryOptions({
    queryKey: [...userKeys.item('invitation'), token],
    queryFn: ({ signal }) => getInvitation(token, signal),
    // A refused link stays refused: asking again only spends the rate limit.
    retry: false,
    staleTime: Infinity,
  });
}

export function useInvitation(token: string) {
  return useQuery(invitationQueryOptions(token));
}

/** Sets the first password; the answer is the signed-in user (the server has set the session cookie). */
export async function acceptInvitation({
  token,
  input,
}: {
  token: string;
  input: AcceptInvitationRequest;
}): Promise<CurrentUser> {
  const { user } = await apiClient.post(`/api/invitations/${encodeURIComponent(token)}/accept`, input, {
    schema: sessionResponseSchema,
  });
  return user;
}

export function useAcceptInvitation() {
  return useMutation({ mutationFn: acceptInvitation });
}
