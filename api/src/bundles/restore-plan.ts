import {
  ASSIGNMENTS_COLUMNS,
  ASSIGNMENTS_PATH,
  DISTANCES_COLUMNS,
  DISTANCES_PATH,
  GROUP_MEAN_FILE,
  parseCsv,
  parseNumberCell,
  PREPARED_COLUMNS,
  PREPARED_PATH,
} from '@provenote/workers';
import type { AssignmentVerdict, BundleManifest } from '@provenote/shared';

/** A run_inputs row rebuilt from inputs/prepared.csv: the prepared (already imputed) values. */
export interface RestoredInput {
  role: 'reference' | 'unknown';
  ordinal: number;
  sampleId: string;
  group: string | null;
  values: number[];
}

export interface RestoredAssignment {
  ordinal: number;
  sampleId: string;
  verdict: AssignmentVerdict;
  group: string;
  probability: number;
  runnerUp: string | null;
  runnerUpProbability: number | null;
  d2: number[];
  pChi2: number[];
  pHotelling: number[];
}

export interface RestoredOverride {
  sampleId: string;
  computedVerdict: AssignmentVerdict;
  computedGroup: string | null;
  verdict: AssignmentVerdict;
  group: string | null;
  reason: string;
}

/** What a verified bundle restores: the assign run's inputs, groups and results, and the reviewers' overrides. */
export interface RestorePlan {
  inputs: RestoredInput[];
  groups: { name: string; n: number; effectiveN: number }[];
  variables: string[];
  assignments: RestoredAssignment[];
  overrides: RestoredOverride[];
}

const text = (files: ReadonlyMap<string, Buffer>, path: string) => {
  const bytes = files.get(path);
  if (!bytes) throw new Error(`${path} is missing`);
  return bytes.toString('utf8');
};

/**
 * Reads a bundle that has already verified (every checksum and recomputed value matched) back into rows;
 * no statistic is computed here, the numbers are the bundle's own.
 */
export function restorePlan(files: ReadonlyMap<string, Buffer>, manifest: BundleManifest): RestorePlan {
  const elements = manifest.parameters.elements;
  const prepared = parseCsv(text(files, PREPARED_PATH), PREPARED_PATH, PREPARED_COLUMNS);
  const bySample = new Map<string, RestoredInput>();
  const counters = { reference: 0, unknown: 0 };
  for (const [sampleId, role, group, element, valuePpm] of prepared.rows) {
    const kind = role === 'reference' ? 'reference' : 'unknown';
    let input = bySample.get(sampleId);
    if (!input) {
      input = { role: kind, ordinal: counters[kind]++, sampleId, group: group || null, values: [] };
      bySample.set(sampleId, input);
    }
    input.values[elements.indexOf(element)] = parseNumberCell(valuePpm, `${PREPARED_PATH}, ${sampleId}, ${element}`);
  }

  // Runs keep their groups in name order (the processors sort them so); the bundle lists them as the
  // command-line tool meets them. The restored run follows the runs' convention.
  const groups = [...manifest.groups].sort((a, b) => (a.name < b.name ? -1 : a.name > b.name ? 1 : 0));
  const groupNames = groups.map((group) => group.name);
  const distances = parseCsv(text(files, DISTANCES_PATH), DISTANCES_PATH, DISTANCES_COLUMNS);
  const perSample = new Map<string, { d2: number[]; pChi2: number[]; pHotelling: number[] }>();
  for (const [sampleId, group, d2, pChi2, pHotelling] of distances.rows) {
    const k = groupNames.indexOf(group);
    const entry = perSample.get(sampleId) ?? { d2: [], pChi2: [], pHotelling: [] };
    entry.d2[k] = parseNumberCell(d2, `${DISTANCES_PATH}, d2`);
    entry.pChi2[k] = parseNumberCell(pChi2, `${DISTANCES_PATH}, p_chi2`);
    entry.pHotelling[k] = parseNumberCell(pHotelling, `${DISTANCES_PATH}, p_hotelling`);
    perSample.set(sampleId, entry);
  }

  const assignments: RestoredAssignment[] = [];
  const overrides: RestoredOverride[] = [];
  const table = parseCsv(text(files, ASSIGNMENTS_PATH), ASSIGNMENTS_PATH, ASSIGNMENTS_COLUMNS);
  table.rows.forEach((cells, ordinal) => {
    const [sampleId, verdict, group, probability, runnerUp, runnerUpP, finalVerdict, finalGroup, reason] = cells;
    const computed = verdict as AssignmentVerdict;
    assignments.push({
      ordinal,
      sampleId,
      verdict: computed,
      group,
      probability: parseNumberCell(probability, `${ASSIGNMENTS_PATH}, probability`),
      runnerUp: runnerUp || null,
      runnerUpProbability:
        runnerUpP === '' ? null : parseNumberCell(runnerUpP, `${ASSIGNMENTS_PATH}, runner_up_probability`),
      ...(perSample.get(sampleId) ?? { d2: [], pChi2: [], pHotelling: [] }),
    });
    if (reason !== '') {
      overrides.push({
        sampleId,
        computedVerdict: computed,
        computedGroup: computed === 'assigned' ? group : null,
        verdict: finalVerdict as AssignmentVerdict,
        group: finalGroup || null,
        reason,
      });
    }
  });

  const firstGroup = manifest.groups[0];
  const means = parseCsv(text(files, `${firstGroup.directory}/${GROUP_MEAN_FILE}`), GROUP_MEAN_FILE);
  return {
    inputs: [...bySample.values()],
    groups: groups.map(({ name, n, effectiveN }) => ({ name, n, effectiveN })),
    variables: means.rows.map(([variable]) => variable),
    assignments,
    overrides,
  };
}
