import { defaultStepParameters, type StepKey, type StepParameters, type StepStatus } from '@provenote/shared';

interface SourceStep {
  key: StepKey;
  parameters: object | null;
}

/**
 * The cards of a "copy with new data": the new data pinned, Prepare carried over, and the groups (with
 * their exclusions) only when the reference data stay the same — group members are sample ids of one
 * reference dataset version. Nothing computed is copied, so every computed card starts as not run.
 */
export function planCopy(
  steps: readonly SourceStep[],
  data: StepParameters['data'],
): { key: StepKey; parameters: object | null; status: StepStatus }[] {
  const sourceData = steps.find((s) => s.key === 'data')?.parameters as StepParameters['data'] | null;
  const sameReference = sourceData?.referenceVersionId === data.referenceVersionId;
  let aboveCurrent = true;
  return steps.map((step) => {
    let parameters = step.parameters;
    if (step.key === 'data') parameters = data;
    if (!sameReference && step.key === 'groups') parameters = null;
    if (!sameReference && step.key === 'check') parameters = defaultStepParameters.check;
    const settingsOnly = step.key === 'data' || step.key === 'prepare' || step.key === 'groups';
    const status: StepStatus = settingsOnly && aboveCurrent && parameters !== null ? 'current' : 'not_run';
    aboveCurrent = status === 'current';
    return { key: step.key, parameters, status };
  });
}
