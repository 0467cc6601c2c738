import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { isFinishedRunStatus, runSchema, type Run } from '@provenote/shared/schemas';
import { apiRequest } from '../../../app/api-client';

/** How often a run is re-read while it has not ended and no event stream is open. */
export const RUN_POLL_MS = 1500;

export const runQuery = (labId: string, runId: string) =>
  queryOptions({
    queryKey: ['labs', labId, 'runs', runId],
    queryFn: ({ signal }) => apiRequest(`/labs/${labId}/runs/${runId}`, runSchema, { signal }),
  });

/** The run, polled until it ends unless `live` says an event stream already keeps it fresh. */
export const useRun = (labId: string, runId: string, { live = false } = {}) =>
  useQuery({
    ...runQuery(labId, runId),
    refetchInterval: (query) =>
      live || (query.state.data && isFinishedRunStatus(query.state.data.status)) ? false : RUN_POLL_MS,
  });

export const useCancelRun = (labId: string, runId: string) => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => apiRequest(`/labs/${labId}/runs/${runId}/cancel`, runSchema, { method: 'POST' }),
    onSuccess: (run: Run) => queryClient.setQueryData(runQuery(labId, runId).queryKey, run),
  });
};
