import { queryOptions, useQuery } from '@tanstack/react-query';
import { referenceGroupListSchema } from '@provenote/shared/schemas';
import { apiRequest } from '../../../app/api-client';

export const groupListQuery = (labId: string) =>
  queryOptions({
    queryKey: ['labs', labId, 'groups'],
    queryFn: ({ signal }) => apiRequest(`/labs/${labId}/groups`, referenceGroupListSchema, { signal }),
  });

export const useGroupList = (labId: string) => useQuery(groupListQuery(labId));
