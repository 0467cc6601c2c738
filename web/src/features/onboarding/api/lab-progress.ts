import { queryOptions, useQuery } from '@tanstack/react-query';
import { datasetListSchema, referenceGroupListSchema, studyListSchema } from '@provenote/shared/schemas';
import { apiRequest } from '../../../app/api-client';

/*
 * The same lists, under the same query keys, as the datasets, groups and studies pages: the guide reads
 * their cache and is refreshed by their mutations.
 */
const datasetsQuery = (labId: string) =>
  queryOptions({
    queryKey: ['labs', labId, 'datasets'],
    queryFn: ({ signal }) => apiRequest(`/labs/${labId}/datasets`, datasetListSchema, { signal }),
  });
const groupsQuery = (labId: string) =>
  queryOptions({
    queryKey: ['labs', labId, 'groups'],
    queryFn: ({ signal }) => apiRequest(`/labs/${labId}/groups`, referenceGroupListSchema, { signal }),
  });
const studiesQuery = (labId: string) =>
  queryOptions({
    queryKey: ['labs', labId, 'studies'],
    queryFn: ({ signal }) => apiRequest(`/labs/${labId}/studies`, studyListSchema, { signal }),
  });

export interface LabProgress {
  hasReference: boolean;
  hasApprovedGroups: boolean;
  hasUnknowns: boolean;
  hasStudy: boolean;
}

/** How far a lab has come on the way to its first study; undefined while any list is loading. */
export function useLabProgress(labId: string): { progress: LabProgress | undefined; error: Error | null } {
  const datasets = useQuery(datasetsQuery(labId));
  const groups = useQuery(groupsQuery(labId));
  const studies = useQuery(studiesQuery(labId));
  const error = datasets.error ?? groups.error ?? studies.error;
  if (!datasets.data || !groups.data || !studies.data) return { progress: undefined, error };
  return {
    progress: {
      hasReference: datasets.data.some((d) => d.kind === 'reference'),
      hasApprovedGroups: groups.data.groups.some((g) => g.versions.some((v) => v.approvedAt !== null)),
      hasUnknowns: datasets.data.some((d) => d.kind === 'unknowns'),
      hasStudy: studies.data.studies.length > 0,
    },
    error,
  };
}
