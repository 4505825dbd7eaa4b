import { apiClient } from '../../../lib/api-client';
import { userSchema, type User } from '../../../../shared/schemas/users';
import { useChangeMutation } from '../../../lib/stale-after';

/** Sends the invitation again: a new link by mail; the earlier link stops working. */
export function sendInvitation(id: number): Promise<User> {
  return apiClient.post(`/api/users/${id}/invitation`, undefined, { schema: userSchema });
}

export function useSendInvitation() {
  return useChangeMutation(sendInvitation, 'user');
}
