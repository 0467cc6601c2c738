import type { Step, StudyStatus, Study, StudySummary } from '@provenote/shared';
import type { StudyStepEntity } from './study-step.entity';
import type { StudyEntity } from './study.entity';

/** The one line the study list shows for where a study stands, read from its cards. */
export function studyStatus(study: StudyEntity, steps: readonly StudyStepEntity[]): StudyStatus {
  if (study.signedOffAt) return 'signed_off';
  if (steps.every((step) => step.status === 'not_run')) return 'draft';
  if (steps.some((step) => step.status === 'stale' || step.status === 'failed')) return 'needs_rerun';
  if (steps.find((step) => step.key === 'assign')?.status === 'current') return 'ready_for_review';
  return 'in_progress';
}

/** Study and steps loaded with owner, signer and each step's editor. */
export function toStudySummary(study: StudyEntity, steps: readonly StudyStepEntity[]): StudySummary {
  return {
    id: study.id,
    labId: study.labId,
    name: study.name,
    description: study.description,
    status: studyStatus(study, steps),
    owner: study.owner ? { id: study.owner.id, displayName: study.owner.displayName } : null,
    copiedFromId: study.copiedFromId,
    createdAt: study.createdAt.toISOString(),
    updatedAt: study.updatedAt.toISOString(),
    signedOffAt: study.signedOffAt?.toISOString() ?? null,
    signedOffBy: study.signedOffBy?.displayName ?? null,
  };
}

export function toStep(step: StudyStepEntity): Step {
  return {
    key: step.key,
    status: step.status,
    parameters: step.parameters as Record<string, unknown> | null,
    runId: step.runId,
    error: step.error,
    updatedAt: step.updatedAt.toISOString(),
    updatedBy: step.updatedBy?.displayName ?? null,
  };
}

export function toStudy(study: StudyEntity, steps: readonly StudyStepEntity[]): Study {
  const ordered = [...steps].sort((a, b) => a.position - b.position);
  return { ...toStudySummary(study, ordered), steps: ordered.map(toStep) };
}
