import { Alert, Anchor, Breadcrumbs, Group, Loader, Stack, Text, Title } from '@mantine/core';
import { notifications } from '@mantine/notifications';
import { useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { stepBlocker, stepLabels, type StepKey, type Study } from '@provenote/shared/schemas';
import { ApiError, errorMessage } from '../../../app/api-client';
import { useMe } from '../../../app/session';
import { useEditStep, useSignOff, useStudy } from '../../studies/api/studies';
import { StudyStatusBadge } from '../../studies/components/StudyStatusBadge';
import { useStartStepRun } from '../api/runs';
import { NotebookCards } from './NotebookCards';
import { CopyStudyButton } from './CopyStudyButton';

/** Field errors of a failed save, keyed by the first segment after "parameters." (e.g. "elements"). */
function fieldErrors(error: unknown): Record<string, string> {
  if (!(error instanceof ApiError)) return {};
  return Object.fromEntries(error.errors.map((e) => [e.path.replace(/^parameters\./, '').split('.')[0], e.message]));
}

export function NotebookPage() {
  const { labId = '', studyId = '' } = useParams();
  const study = useStudy(labId, studyId);
  const me = useMe();
  const role = me.data?.memberships.find((m) => m.labId === labId)?.role ?? 'guest';
  if (study.isPending) return <Loader aria-label="Loading the study" />;
  if (study.isError) return <Alert color="red">Could not load the study: {errorMessage(study.error)}</Alert>;
  return <Notebook labId={labId} study={study.data} role={role} />;
}

function Notebook({ labId, study, role }: { labId: string; study: Study; role: string }) {
  const edit = useEditStep(labId, study.id);
  const start = useStartStepRun(labId, study.id);
  const signOff = useSignOff(labId, study.id);
  const [errors, setErrors] = useState<{ key: StepKey; fields: Record<string, string> } | null>(null);

  const save = (key: StepKey, parameters: object) =>
    edit.mutate(
      { key, parameters },
      {
        onSuccess: ({ staleSteps }) => {
          setErrors(null);
          notifications.show({
            color: staleSteps.length > 0 ? 'orange' : 'teal',
            title: `${stepLabels[key].title} saved`,
            message:
              staleSteps.length > 0
                ? `Now stale: ${staleSteps.map((k) => stepLabels[k].title).join(', ')}. Run them again from their cards.`
                : 'Nothing below had to change.',
          });
        },
        onError: (error) => {
          setErrors({ key, fields: fieldErrors(error) });
          notifications.show({
            color: 'red',
            title: `${stepLabels[key].title} not saved`,
            message: errorMessage(error),
          });
        },
      },
    );
  const run = (key: StepKey) =>
    start.mutate(key, {
      onError: (error) =>
        notifications.show({ color: 'red', title: 'The run did not start', message: errorMessage(error) }),
    });

  return (
    <Stack maw={1100} gap="md">
      <Breadcrumbs>
        <Anchor component={Link} to="/">
          Studies
        </Anchor>
        <Text>{study.name}</Text>
      </Breadcrumbs>
      <Group justify="space-between" align="flex-start">
        <Stack gap={4}>
          <Group>
            <Title order={2}>{study.name}</Title>
            <StudyStatusBadge status={study.status} />
          </Group>
          <Text size="sm" c="dimmed">
            Owner: {study.owner?.displayName ?? '—'}
            {study.description && ` · ${study.description}`}
          </Text>
        </Stack>
        {role !== 'guest' && <CopyStudyButton labId={labId} study={study} />}
      </Group>
      <NotebookCards
        labId={labId}
        study={study}
        role={role}
        blockerOf={(key) => stepBlocker(study.steps, key)}
        onSave={save}
        saving={edit.isPending ? (edit.variables?.key ?? null) : null}
        errorsOf={(key) => (errors?.key === key ? errors.fields : {})}
        onRun={run}
        starting={start.isPending ? (start.variables ?? null) : null}
        onSignOff={(statement) => signOff.mutate({ statement })}
        signing={signOff.isPending}
        signOffError={signOff.error ? errorMessage(signOff.error) : null}
      />
    </Stack>
  );
}
