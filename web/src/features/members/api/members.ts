import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { membersSchema, type LabRole } from '@provenote/shared/schemas';
import { apiRequest } from '../../../app/api-client';

export const membersQuery = (labId: string) =>
  queryOptions({
    queryKey: ['labs', labId, 'members'],
    queryFn: ({ signal }) => apiRequest(`/labs/${labId}/members`, membersSchema, { signal }),
  });

export const useMembers = (labId: string) => useQuery(membersQuery(labId));

export function useChangeRole(labId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ membershipId, role }: { membershipId: string; role: LabRole }) =>
      apiRequest(`/labs/${labId}/members/${membershipId}`, null, { method: 'PATCH', body: { role } }),
    onSettled: () => queryClient.invalidateQueries({ queryKey: membersQuery(labId).queryKey }),
  });
}

export function useRemoveMember(labId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (membershipId: string) =>
      apiRequest(`/labs/${labId}/members/${membershipId}`, null, { method: 'DELETE' }),
    onSettled: () => queryClient.invalidateQueries({ queryKey: membersQuery(labId).queryKey }),
  });
}
