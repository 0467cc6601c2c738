import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { invitationsSchema, type Invite } from '@provenote/shared/schemas';
import { apiRequest } from '../../../app/api-client';

export const invitationsQuery = (labId: string) =>
  queryOptions({
    queryKey: ['labs', labId, 'invitations'],
    queryFn: ({ signal }) => apiRequest(`/labs/${labId}/invitations`, invitationsSchema, { signal }),
  });

export const useInvitations = (labId: string, enabled: boolean) => useQuery({ ...invitationsQuery(labId), enabled });

function useInvitationMutation<T>(labId: string, request: (value: T) => Promise<unknown>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: request,
    onSettled: () => queryClient.invalidateQueries({ queryKey: invitationsQuery(labId).queryKey }),
  });
}

export const useInvite = (labId: string) =>
  useInvitationMutation(labId, (body: Invite) =>
    apiRequest(`/labs/${labId}/invitations`, null, { method: 'POST', body }),
  );

export const useResendInvitation = (labId: string) =>
  useInvitationMutation(labId, (id: string) =>
    apiRequest(`/labs/${labId}/invitations/${id}/resend`, null, { method: 'POST' }),
  );

export const useRevokeInvitation = (labId: string) =>
  useInvitationMutation(labId, (id: string) =>
    apiRequest(`/labs/${labId}/invitations/${id}`, null, { method: 'DELETE' }),
  );
