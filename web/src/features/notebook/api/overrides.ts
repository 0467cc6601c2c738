import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { overrideListSchema, type CreateOverride } from '@provenote/shared/schemas';
import { apiRequest } from '../../../app/api-client';
import { studyQuery } from '../../studies/api/studies';

export const overridesQuery = (labId: string, studyId: string) =>
  queryOptions({
    queryKey: ['labs', labId, 'studies', studyId, 'overrides'],
    queryFn: ({ signal }) => apiRequest(`/labs/${labId}/studies/${studyId}/overrides`, overrideListSchema, { signal }),
  });

export const useOverrides = (labId: string, studyId: string) => useQuery(overridesQuery(labId, studyId));

export function useCreateOverride(labId: string, studyId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateOverride) =>
      apiRequest(`/labs/${labId}/studies/${studyId}/overrides`, overrideListSchema, { method: 'POST', body: input }),
    onSuccess: (list) => {
      queryClient.setQueryData(overridesQuery(labId, studyId).queryKey, list);
      // An override turns a built bundle stale: the study's cards change.
      void queryClient.invalidateQueries({ queryKey: studyQuery(labId, studyId).queryKey });
      // The results table shows each unknown's final verdict beside the computed one.
      void queryClient.invalidateQueries({
        predicate: ({ queryKey: [labs, lab, runs, , assignments] }) =>
          labs === 'labs' && lab === labId && runs === 'runs' && assignments === 'assignments',
      });
    },
  });
}
