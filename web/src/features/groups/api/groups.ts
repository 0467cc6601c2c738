import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import {
  referenceGroupListSchema,
  referenceGroupSchema,
  type CreateGroup,
  type CreateGroupVersion,
  type UpdateGroup,
} from '@provenote/shared/schemas';
import { apiRequest } from '../../../app/api-client';

export const groupListQuery = (labId: string) =>
  queryOptions({
    queryKey: ['labs', labId, 'groups'],
    queryFn: ({ signal }) => apiRequest(`/labs/${labId}/groups`, referenceGroupListSchema, { signal }),
  });

export const useGroupList = (labId: string) => useQuery(groupListQuery(labId));

function useInvalidateGroups(labId: string) {
  const queryClient = useQueryClient();
  return () => queryClient.invalidateQueries({ queryKey: groupListQuery(labId).queryKey });
}

export function useCreateGroup(labId: string) {
  const invalidate = useInvalidateGroups(labId);
  return useMutation({
    mutationFn: (input: CreateGroup) =>
      apiRequest(`/labs/${labId}/groups`, referenceGroupSchema, { method: 'POST', body: input }),
    onSuccess: invalidate,
  });
}

export function useAddGroupVersion(labId: string, groupId: string) {
  const invalidate = useInvalidateGroups(labId);
  return useMutation({
    mutationFn: (input: CreateGroupVersion) =>
      apiRequest(`/labs/${labId}/groups/${groupId}/versions`, referenceGroupSchema, { method: 'POST', body: input }),
    onSuccess: invalidate,
  });
}

export function useGroupsFromColumn(labId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (datasetVersionId: string) =>
      apiRequest(`/labs/${labId}/groups/from-column`, referenceGroupListSchema, {
        method: 'POST',
        body: { datasetVersionId },
      }),
    onSuccess: (list) => queryClient.setQueryData(groupListQuery(labId).queryKey, list),
  });
}

export function useApproveGroupVersion(labId: string) {
  const invalidate = useInvalidateGroups(labId);
  return useMutation({
    mutationFn: ({ groupId, versionId }: { groupId: string; versionId: string }) =>
      apiRequest(`/labs/${labId}/groups/${groupId}/versions/${versionId}/approve`, referenceGroupSchema, {
        method: 'POST',
        body: {},
      }),
    onSuccess: invalidate,
  });
}

export function useUpdateGroup(labId: string, groupId: string) {
  const invalidate = useInvalidateGroups(labId);
  return useMutation({
    mutationFn: (input: UpdateGroup) =>
      apiRequest(`/labs/${labId}/groups/${groupId}`, referenceGroupSchema, { method: 'PATCH', body: input }),
    onSuccess: invalidate,
  });
}
