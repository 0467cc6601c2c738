import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { acceptedInvitationSchema, invitationPreviewSchema, type AcceptInvitation } from '@provenote/shared/schemas';
import { apiRequest } from '../../../app/api-client';
import { meQuery } from '../../../app/session';

export const invitationQuery = (token: string) =>
  queryOptions({
    queryKey: ['invitations', token],
    queryFn: ({ signal }) =>
      apiRequest(`/invitations/${encodeURIComponent(token)}`, invitationPreviewSchema, { signal }),
    retry: false,
  });

export const useInvitation = (token: string) => useQuery({ ...invitationQuery(token), enabled: token !== '' });

export const acceptInvitation = (token: string, body: AcceptInvitation) =>
  apiRequest(`/invitations/${encodeURIComponent(token)}/accept`, acceptedInvitationSchema, { method: 'POST', body });

export function useAcceptInvitation(token: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: AcceptInvitation) => acceptInvitation(token, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: meQuery().queryKey }),
  });
}
