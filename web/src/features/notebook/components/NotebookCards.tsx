import { Stack } from '@mantine/core';
import type { StepKey, StepParameters, Study } from '@provenote/shared/schemas';
import { useExportStep } from '../../bundles/export-step';
import { useGroupList } from '../../groups/api/groups';
import { AssignCard } from './cards/AssignCard';
import { stepParameters, type CardProps } from './cards/card-props';
import { CheckCard } from './cards/CheckCard';
import { DataCard } from './cards/DataCard';
import { ExportCard } from './cards/ExportCard';
import { GroupsCard } from './cards/GroupsCard';
import { PrepareCard } from './cards/PrepareCard';
import { ReviewCard } from './cards/ReviewCard';
import { StepCard } from './StepCard';

interface Props {
  labId: string;
  study: Study;
  role: string;
  blockerOf: (key: StepKey) => string | null;
  onSave: (key: StepKey, parameters: object) => void;
  saving: StepKey | null;
  errorsOf: (key: StepKey) => Record<string, string>;
  onRun: (key: StepKey) => void;
  starting: StepKey | null;
  onSignOff: (statement: string) => void;
  signing: boolean;
  signOffError: string | null;
}

/** The cards top to bottom, each in the shared frame with its own body. */
export function NotebookCards(props: Props) {
  const { labId, study, role, blockerOf, onSave, saving, errorsOf, onRun, starting } = props;
  const locked = study.signedOffAt !== null;
  const analyst = role === 'pi' || role === 'analyst';
  const groups = useGroupList(labId);
  const exportStep = useExportStep(labId, study);
  const chosen = stepParameters<StepParameters['groups']>(study, 'groups')?.groupVersionIds ?? [];
  const chosenVersions = (groups.data?.groups ?? []).flatMap((g) => g.versions.filter((v) => chosen.includes(v.id)));
  // Students run the check (it computes, changes no group) once every chosen group is vetted.
  const checkRefusal =
    analyst || (groups.isSuccess && chosenVersions.every((v) => v.approvedAt !== null))
      ? null
      : 'Students run the group check once an analyst or PI has approved every chosen group.';
  const memberOptions = (groups.data?.groups ?? []).flatMap((g) =>
    g.versions
      .filter((v) => chosen.includes(v.id))
      .flatMap((v) =>
        v.memberIds.map((id) => ({ value: `${g.name}\u0000${id}`, label: `${id} (${g.name})`, group: g.name })),
      ),
  );

  return (
    <Stack gap="md">
      {study.steps.map((stored) => {
        const step = stored.key === 'export' && exportStep ? exportStep : stored;
        const blocker = blockerOf(step.key);
        const readOnly = locked || blocker !== null || role === 'guest';
        const card: CardProps = {
          labId,
          study,
          step,
          readOnly,
          onSave: (parameters) => onSave(step.key, parameters),
          saving: saving === step.key,
          errors: errorsOf(step.key),
        };
        const runProps = { onRun: () => onRun(step.key), running: starting === step.key, runBlocked: blocker !== null };
        const rerun =
          step.key === 'check' || step.key === 'assign'
            ? () => onRun(step.key)
            : step.parameters && step.key !== 'review' && step.key !== 'export'
              ? () => onSave(step.key, step.parameters ?? {})
              : undefined;
        return (
          <StepCard
            key={`${step.key}-${step.updatedAt}`}
            labId={labId}
            step={step}
            blocker={blocker}
            locked={locked}
            onRerun={role === 'guest' ? undefined : rerun}
            rerunPending={saving === step.key || starting === step.key}
          >
            {step.key === 'data' && <DataCard {...card} />}
            {step.key === 'prepare' && <PrepareCard {...card} />}
            {step.key === 'groups' && <GroupsCard {...card} />}
            {step.key === 'check' && (
              <CheckCard
                {...card}
                {...runProps}
                mayExclude={analyst}
                runRefusal={checkRefusal}
                memberOptions={memberOptions}
              />
            )}
            {step.key === 'assign' && <AssignCard {...card} {...runProps} canOverride={analyst && !locked} />}
            {step.key === 'review' && (
              <ReviewCard
                labId={labId}
                study={study}
                isPi={role === 'pi'}
                blocker={blockerOf('export')}
                onSignOff={props.onSignOff}
                signing={props.signing}
                error={props.signOffError}
              />
            )}
            {step.key === 'export' && <ExportCard labId={labId} study={study} isPi={role === 'pi'} />}
          </StepCard>
        );
      })}
    </Stack>
  );
}
