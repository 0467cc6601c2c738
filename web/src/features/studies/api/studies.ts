import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import {
  studyListSchema,
  studySchema,
  stepEditResultSchema,
  type CopyStudy,
  type CreateStudy,
  type SignOff,
  type StepKey,
} from '@provenote/shared/schemas';
import { apiRequest } from '../../../app/api-client';

export const studyListQuery = (labId: string) =>
  queryOptions({
    queryKey: ['labs', labId, 'studies'],
    queryFn: ({ signal }) => apiRequest(`/labs/${labId}/studies`, studyListSchema, { signal }),
  });

export const useStudyList = (labId: string) => useQuery(studyListQuery(labId));

export const studyQuery = (labId: string, studyId: string) =>
  queryOptions({
    queryKey: ['labs', labId, 'studies', studyId],
    queryFn: ({ signal }) => apiRequest(`/labs/${labId}/studies/${studyId}`, studySchema, { signal }),
  });

/** Polls while a card is running, so the card turns current (or failed) without a reload. */
export const useStudy = (labId: string, studyId: string) =>
  useQuery({
    ...studyQuery(labId, studyId),
    refetchInterval: (query) => (query.state.data?.steps.some((s) => s.status === 'running') ? 2000 : false),
  });

function useInvalidateStudies(labId: string) {
  const queryClient = useQueryClient();
  return () => queryClient.invalidateQueries({ queryKey: studyListQuery(labId).queryKey, exact: true });
}

export function useCreateStudy(labId: string) {
  const invalidate = useInvalidateStudies(labId);
  return useMutation({
    mutationFn: (input: CreateStudy) =>
      apiRequest(`/labs/${labId}/studies`, studySchema, { method: 'POST', body: input }),
    onSuccess: invalidate,
  });
}

export function useCopyStudy(labId: string, studyId: string) {
  const invalidate = useInvalidateStudies(labId);
  return useMutation({
    mutationFn: (input: CopyStudy) =>
      apiRequest(`/labs/${labId}/studies/${studyId}/copy`, studySchema, { method: 'POST', body: input }),
    onSuccess: invalidate,
  });
}

/** Saves a card; the answer carries the cards the change made stale. */
export function useEditStep(labId: string, studyId: string) {
  const queryClient = useQueryClient();
  const invalidate = useInvalidateStudies(labId);
  return useMutation({
    mutationFn: ({ key, parameters }: { key: StepKey; parameters: object }) =>
      apiRequest(`/labs/${labId}/studies/${studyId}/steps/${key}`, stepEditResultSchema, {
        method: 'PUT',
        body: { parameters },
      }),
    onSuccess: (result) => {
      queryClient.setQueryData(studyQuery(labId, studyId).queryKey, result.study);
      void invalidate();
    },
  });
}

export function useSignOff(labId: string, studyId: string) {
  const queryClient = useQueryClient();
  const invalidate = useInvalidateStudies(labId);
  return useMutation({
    mutationFn: (input: SignOff) =>
      apiRequest(`/labs/${labId}/studies/${studyId}/sign-off`, studySchema, { method: 'POST', body: input }),
    onSuccess: (study) => {
      queryClient.setQueryData(studyQuery(labId, studyId).queryKey, study);
      void invalidate();
    },
  });
}
