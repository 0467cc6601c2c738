import { queryOptions, useQuery } from '@tanstack/react-query';
import { groupSizesSchema } from '@provenote/shared/schemas';
import { apiRequest } from '../../../app/api-client';

/** n against p for the study's chosen groups, with the engine's warnings and false-rejection rate. */
export const groupSizesQuery = (labId: string, studyId: string, updatedAt: string) =>
  queryOptions({
    queryKey: ['labs', labId, 'studies', studyId, 'group-sizes', updatedAt],
    queryFn: ({ signal }) => apiRequest(`/labs/${labId}/studies/${studyId}/group-sizes`, groupSizesSchema, { signal }),
  });

export const useGroupSizes = (labId: string, studyId: string, updatedAt: string, enabled: boolean) =>
  useQuery({ ...groupSizesQuery(labId, studyId, updatedAt), enabled });
