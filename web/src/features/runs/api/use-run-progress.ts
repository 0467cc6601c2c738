import { useQueryClient } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import { isFinishedRunStatus, runEventSchema, type Run } from '@provenote/shared/schemas';
import { runQuery, useRun } from './run';

/**
 * A run and its progress, live: server-sent events from /runs/:runId/events write each change into the
 * run's query, and polling takes over where EventSource is missing or the stream drops.
 */
export function useRunProgress(labId: string, runId: string) {
  const queryClient = useQueryClient();
  const [live, setLive] = useState(false);
  const query = useRun(labId, runId, { live });
  const finished = query.data ? isFinishedRunStatus(query.data.status) : false;

  useEffect(() => {
    if (finished || typeof EventSource === 'undefined') return;
    const source = new EventSource(`/api/labs/${labId}/runs/${runId}/events`, { withCredentials: true });
    const key = runQuery(labId, runId).queryKey;
    source.addEventListener('open', () => setLive(true));
    source.addEventListener('run', (message) => {
      const parsed = runEventSchema.safeParse(JSON.parse((message as MessageEvent<string>).data));
      if (!parsed.success) return;
      const { status, progress, phase, error, attempt } = parsed.data;
      queryClient.setQueryData(key, (run: Run | undefined) =>
        run ? { ...run, status, progress, phase, error, attempt } : run,
      );
      // The ended run's timestamps and results come from the API.
      if (isFinishedRunStatus(status)) void queryClient.invalidateQueries({ queryKey: key });
    });
    source.addEventListener('error', () => {
      source.close();
      setLive(false);
    });
    return () => {
      source.close();
      setLive(false);
    };
  }, [labId, runId, finished, queryClient]);

  return query;
}
