import { useMutation, useQueryClient } from '@tanstack/react-query';
import { studySchema, type StepKey } from '@provenote/shared/schemas';
import { apiRequest } from '../../../app/api-client';
import { studyListQuery, studyQuery } from '../../studies/api/studies';

/** Starts a card's run on the queue (its inputs are gathered by the API from the cards above). */
export function useStartStepRun(labId: string, studyId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (key: StepKey) =>
      apiRequest(`/labs/${labId}/studies/${studyId}/steps/${key}/run`, studySchema, { method: 'POST', body: {} }),
    onSuccess: (study) => {
      queryClient.setQueryData(studyQuery(labId, studyId).queryKey, study);
      void queryClient.invalidateQueries({ queryKey: studyListQuery(labId).queryKey, exact: true });
    },
  });
}
