import { Alert, Badge, Button, Card, Group, Stack, Text, Title } from '@mantine/core';
import type { ReactNode } from 'react';
import {
  isComputedStep,
  stepLabels,
  stepPosition,
  stepStatusLabels,
  type Step,
  type StepStatus,
} from '@provenote/shared/schemas';
import { CardHelp } from '../../onboarding/components/CardHelp';
import { RunProgress } from '../../runs/components/RunProgress';

const statusColours: Record<StepStatus, string> = {
  not_run: 'gray',
  running: 'blue',
  current: 'teal',
  stale: 'orange',
  failed: 'red',
};

interface Props {
  labId: string;
  step: Step;
  /** Why the card cannot be saved or run yet (a card above is not current), or null. */
  blocker: string | null;
  /** The study is signed off: the card shows its settings and results but offers no changes. */
  locked: boolean;
  /** Offered on a stale card: run a computed card again, or confirm a settings card. */
  onRerun?: () => void;
  rerunPending?: boolean;
  children?: ReactNode;
}

/** The frame every notebook card shares: number, title, status in words, progress, stale and failure notes. */
export function StepCard({ labId, step, blocker, locked, onRerun, rerunPending, children }: Props) {
  const { title, summary } = stepLabels[step.key];
  const headingId = `step-${step.key}-title`;
  const computed = isComputedStep(step.key);
  return (
    <Card withBorder radius="md" padding="lg" component="section" aria-labelledby={headingId}>
      <Stack gap="sm">
        <Group justify="space-between" wrap="nowrap">
          <Title order={3} id={headingId} size="h4">
            {stepPosition(step.key) + 1}. {title}
          </Title>
          <Badge color={statusColours[step.status]} variant={step.status === 'current' ? 'filled' : 'light'}>
            {stepStatusLabels[step.status]}
          </Badge>
        </Group>
        <Text size="sm" c="dimmed">
          {summary}
        </Text>
        <CardHelp stepKey={step.key} />
        {step.status === 'running' && step.runId && (
          <RunProgress labId={labId} runId={step.runId} canCancel={!locked} />
        )}
        {step.status === 'stale' && !locked && (
          <Alert color="orange" variant="light" title="A card above changed">
            <Stack gap="xs" align="flex-start">
              <Text size="sm">
                {computed
                  ? 'These results no longer follow from the cards above. Run this card again to bring it up to date.'
                  : 'These settings were made for the cards above as they were. Check them and save again.'}
              </Text>
              {onRerun && !blocker && (
                <Button size="xs" variant="light" color="orange" onClick={onRerun} loading={rerunPending}>
                  {computed ? 'Run again' : 'Keep these settings'}
                </Button>
              )}
            </Stack>
          </Alert>
        )}
        {step.status === 'failed' && (
          <Alert color="red" variant="light" title="The last run failed">
            {step.error ?? 'No reason was recorded.'}
          </Alert>
        )}
        {blocker && !locked && (
          <Text size="sm" c="orange.8">
            {blocker}
          </Text>
        )}
        {children}
        {step.updatedBy && step.status !== 'not_run' && (
          <Text size="xs" c="dimmed">
            Last saved by {step.updatedBy}
          </Text>
        )}
      </Stack>
    </Card>
  );
}
