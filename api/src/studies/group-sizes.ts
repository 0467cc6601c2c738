import { assessGroupSize, type GroupSizes, type StepParameters } from '@provenote/shared';
import type { StudyStepEntity } from './study-step.entity';

/**
 * Coordinates the distances live in: a log-ratio transform of p parts leaves p − 1 free coordinates
 * (alr and ilr have p − 1 columns; clr has p columns of rank p − 1).
 */
export function coordinateCount(prepare: StepParameters['prepare']): number {
  const p = prepare.elements.length;
  return prepare.transform === 'alr' || prepare.transform === 'ilr' || prepare.transform === 'clr' ? p - 1 : p;
}

/**
 * n against p for each chosen group, less its excluded members, with the engine's assessment (the
 * exact false-rejection rate of the chi-square rule is a closed form, not a fit: cheap enough here).
 */
export function groupSizes(steps: StudyStepEntity[], members: Map<string, Set<string>>): GroupSizes {
  const settings = <K extends keyof StepParameters>(key: K) =>
    steps.find((s) => s.key === key)?.parameters as StepParameters[K] | null | undefined;
  const prepare = settings('prepare');
  const alpha = settings('assign')?.alpha ?? 0.05;
  if (!prepare) return { p: 0, alpha, groups: [] };
  const p = coordinateCount(prepare);
  const excluded = settings('check')?.exclusions ?? [];
  const groups = [...members.entries()].map(([group, ids]) => {
    const n = [...ids].filter((id) => !excluded.some((e) => e.group === group && e.sampleId === id)).length;
    return assessGroupSize(group, n, p, alpha);
  });
  return { p, alpha, groups: groups.map((g) => ({ ...g, messages: [...g.messages] })) };
}
