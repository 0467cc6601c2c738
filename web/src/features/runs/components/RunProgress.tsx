import { Alert, Button, Group, Progress, Stack, Text } from '@mantine/core';
import type { RunStatus } from '@provenote/shared/schemas';
import { useCancelRun } from '../api/run';
import { useRunProgress } from '../api/use-run-progress';

const STATUS_LABELS: Record<RunStatus, string> = {
  queued: 'Waiting for a worker',
  running: 'Running',
  succeeded: 'Finished',
  failed: 'Failed',
  cancelled: 'Cancelled',
};

const STATUS_COLORS: Record<RunStatus, string> = {
  queued: 'gray',
  running: 'blue',
  succeeded: 'teal',
  failed: 'red',
  cancelled: 'gray',
};

/** The progress bar a step card shows for its run: status, phase, fraction, a cancel button, the failure reason. */
export function RunProgress({
  labId,
  runId,
  canCancel = false,
}: {
  labId: string;
  runId: string;
  canCancel?: boolean;
}) {
  const { data: run, error } = useRunProgress(labId, runId);
  const cancel = useCancelRun(labId, runId);
  if (error)
    return (
      <Alert color="red" title="The run could not be read">
        {error.message}
      </Alert>
    );
  if (!run) return <Progress value={0} aria-label="Run progress" />;
  const percent = Math.round(run.progress * 100);
  const open = run.status === 'queued' || run.status === 'running';
  return (
    <Stack gap={4}>
      <Group justify="space-between">
        <Text size="sm" fw={600}>
          {STATUS_LABELS[run.status]}
          {open ? ` · ${run.phase}` : ''}
        </Text>
        <Group gap="xs">
          <Text size="sm" c="dimmed">
            {percent} %
          </Text>
          {canCancel && open && (
            <Button size="compact-xs" variant="default" loading={cancel.isPending} onClick={() => cancel.mutate()}>
              Cancel run
            </Button>
          )}
        </Group>
      </Group>
      <Progress
        value={percent}
        color={STATUS_COLORS[run.status]}
        animated={run.status === 'running'}
        aria-label="Run progress"
        aria-valuetext={`${STATUS_LABELS[run.status]}, ${percent} %`}
      />
      {run.status === 'queued' && run.error && (
        <Text size="xs" c="dimmed">
          {run.error}
        </Text>
      )}
      {run.status === 'failed' && (
        <Alert color="red" title="The run failed">
          {run.error ?? 'No reason was recorded.'}
        </Alert>
      )}
      {cancel.error && (
        <Text size="xs" c="red">
          {cancel.error.message}
        </Text>
      )}
    </Stack>
  );
}
