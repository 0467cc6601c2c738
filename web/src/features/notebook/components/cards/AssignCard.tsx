import { Button, Group, NumberInput, SegmentedControl, Stack, Text } from '@mantine/core';
import { useState } from 'react';
import type { StepParameters } from '@provenote/shared/schemas';
import { useGroupSizes } from '../../api/group-sizes';
import { AssignmentsTable } from '../AssignmentsTable';
import { EvidenceCaution } from '../EvidenceCaution';
import { GroupSizeAlerts } from '../GroupSizeAlerts';
import { stepParameters, type CardProps } from './card-props';

interface Props extends CardProps {
  /** Analysts and PIs on a study that is not signed off. */
  canOverride: boolean;
  onRun: () => void;
  running: boolean;
  runBlocked: boolean;
}

export function AssignCard({
  labId,
  study,
  step,
  readOnly,
  onSave,
  saving,
  errors,
  canOverride,
  onRun,
  running,
  runBlocked,
}: Props) {
  const saved = step.parameters as StepParameters['assign'] | null;
  const [values, setValues] = useState<StepParameters['assign']>(saved ?? { probability: 'hotelling', alpha: 0.05 });
  const sizes = useGroupSizes(labId, study.id, study.updatedAt, step.runId !== null);
  const changed = saved?.probability !== values.probability || saved?.alpha !== values.alpha;
  return (
    <Stack gap="sm">
      <Group align="flex-end">
        <Stack gap={4}>
          <Text size="sm" fw={500} id="assign-basis-label">
            Probability basis
          </Text>
          <SegmentedControl
            aria-labelledby="assign-basis-label"
            data={[
              { value: 'hotelling', label: 'Hotelling (small groups)' },
              { value: 'chi2', label: 'χ² (large groups)' },
            ]}
            value={values.probability}
            onChange={(p) => setValues((v) => ({ ...v, probability: p as 'chi2' | 'hotelling' }))}
            disabled={readOnly}
          />
        </Stack>
        <NumberInput
          label="α"
          description="A group whose probability reaches α takes the sample."
          value={values.alpha}
          onChange={(a) => setValues((v) => ({ ...v, alpha: typeof a === 'number' ? a : 0 }))}
          min={0.001}
          max={0.5}
          step={0.01}
          decimalScale={3}
          disabled={readOnly}
          error={errors.alpha}
          w={200}
        />
      </Group>
      {!readOnly && (
        <Group>
          {changed && (
            <Button variant="default" onClick={() => onSave(values)} loading={saving}>
              Save settings
            </Button>
          )}
          <Button onClick={onRun} loading={running} disabled={runBlocked || changed}>
            {step.status === 'not_run' ? 'Assign the unknowns' : 'Assign again'}
          </Button>
        </Group>
      )}
      {step.runId && (step.status === 'current' || step.status === 'stale') && (
        <>
          <EvidenceCaution />
          {sizes.data && <GroupSizeAlerts sizes={sizes.data} basis={saved?.probability ?? 'hotelling'} />}
          <AssignmentsTable
            labId={labId}
            studyId={study.id}
            runId={step.runId}
            canOverride={canOverride && step.status === 'current'}
            basis={saved?.probability ?? 'hotelling'}
            elements={stepParameters<StepParameters['prepare']>(study, 'prepare')?.elements ?? []}
          />
        </>
      )}
      {step.status === 'not_run' && (
        <Text size="sm" c="dimmed">
          When the cards above are current, assign the unknowns: the run goes on the queue and this card shows its
          progress.
        </Text>
      )}
    </Stack>
  );
}
