import type { BundleGroup } from '@provenote/shared';
import type { BundleContent, GroupContent } from './bundle-content';
import { toCsv } from './csv';

/** Where each part of a bundle lives, and the columns of every CSV (shared by the writer and the verifier). */
export const MANIFEST_PATH = 'manifest.json';
export const README_PATH = 'README.txt';
export const REPORT_PATH = 'report.html';
export const RAW_INPUTS_DIR = 'inputs/raw';
export const PREPARED_PATH = 'inputs/prepared.csv';
export const DISTANCES_PATH = 'results/distances.csv';
export const ASSIGNMENTS_PATH = 'results/assignments.csv';
export const CONTRIBUTIONS_PATH = 'results/contributions.csv';
export const MEMBERS_PATH = 'results/members.csv';
export const SEPARATION_PATH = 'results/separation.csv';

export const PREPARED_COLUMNS = ['sample_id', 'role', 'group', 'element', 'value_ppm', 'transformed_value', 'flag'];
export const DISTANCES_COLUMNS = ['sample_id', 'group', 'd2', 'p_chi2', 'p_hotelling'];
export const ASSIGNMENTS_COLUMNS = [
  'sample_id',
  'verdict',
  'group',
  'probability',
  'runner_up',
  'runner_up_probability',
  'final_verdict',
  'final_group',
  'override_reason',
];
export const CONTRIBUTIONS_COLUMNS = ['sample_id', 'group', 'variable', 'contribution'];
export const MEMBERS_COLUMNS = ['sample_id', 'group', 'd2', 'd2_loo', 'p_hotelling_loo', 'verdict_loo'];
export const SEPARATION_COLUMNS = ['group_a', 'group_b', 't2', 'f', 'df1', 'df2', 'p'];
export const GROUP_MEMBERS_FILE = 'members.csv';
export const GROUP_MEAN_FILE = 'mean.csv';
export const GROUP_COVARIANCE_FILE = 'covariance.csv';
export const GROUP_ROBUST_FILE = 'robust-fit.json';

export interface BundleEntry {
  readonly path: string;
  readonly bytes: Uint8Array;
}

/** A file-name part made of letters, digits, dot, dash and underscore only; unique among `taken`. */
function safeName(name: string, taken: Set<string>): string {
  const base =
    name
      .replace(/[^A-Za-z0-9._-]+/g, '_')
      .replace(/^\.+/, '_')
      .slice(0, 80) || 'file';
  let candidate = base;
  for (let k = 2; taken.has(candidate.toLowerCase()); k++) candidate = `${base}-${k}`;
  taken.add(candidate.toLowerCase());
  return candidate;
}

const utf8 = (text: string) => new TextEncoder().encode(text);

function groupFiles(group: GroupContent, directory: string): BundleEntry[] {
  const files: BundleEntry[] = [
    {
      path: `${directory}/${GROUP_MEMBERS_FILE}`,
      bytes: utf8(
        toCsv(
          ['sample_id'],
          group.members.map((id) => [id]),
        ),
      ),
    },
    {
      path: `${directory}/${GROUP_MEAN_FILE}`,
      bytes: utf8(
        toCsv(
          ['variable', 'mean'],
          group.variables.map((v, j) => [v, group.mean[j]]),
        ),
      ),
    },
    {
      path: `${directory}/${GROUP_COVARIANCE_FILE}`,
      bytes: utf8(
        toCsv(
          ['variable', ...group.variables],
          group.variables.map((v, j) => [v, ...group.covariance[j]]),
        ),
      ),
    },
  ];
  if (group.robust) {
    const { robust } = group;
    const details = {
      method: 'FAST-MCD (Rousseeuw & Van Driessen 1999), reweighted',
      seed: robust.seed,
      h: robust.h,
      consistencyFactor: robust.consistencyFactor,
      cutoff: robust.cutoff,
      members: group.members.map((sampleId, i) => ({
        sampleId,
        robustD2: robust.distances[i],
        inSupport: robust.support[i],
      })),
    };
    files.push({ path: `${directory}/${GROUP_ROBUST_FILE}`, bytes: utf8(JSON.stringify(details, null, 2) + '\n') });
  }
  return files;
}

/** Every data file of the bundle (all but manifest, report and README) and the manifest's group entries. */
export function layOutData(content: BundleContent): { entries: BundleEntry[]; groups: BundleGroup[] } {
  const entries: BundleEntry[] = [];
  const rawNames = new Set<string>();
  for (const input of content.inputs) {
    entries.push({ path: `${RAW_INPUTS_DIR}/${safeName(input.name, rawNames)}`, bytes: input.bytes });
  }
  const prepared = content.prepared.map((v) => [
    v.sampleId,
    v.role,
    v.group,
    v.element,
    v.valuePpm,
    v.transformedValue,
    v.flag,
  ]);
  entries.push({ path: PREPARED_PATH, bytes: utf8(toCsv(PREPARED_COLUMNS, prepared)) });

  const groupDirs = new Set<string>();
  const groups = content.groups.map((group): BundleGroup => {
    const directory = `groups/${safeName(group.name, groupDirs)}`;
    entries.push(...groupFiles(group, directory));
    const { name, version, n, effectiveN, method } = group;
    return { name, version, directory, n, effectiveN, covariance: method };
  });

  const { distances, assignments, contributions, members, separation } = content.results;
  const csv = (path: string, columns: string[], rows: (string | number | null)[][]) =>
    entries.push({ path, bytes: utf8(toCsv(columns, rows)) });
  csv(
    DISTANCES_PATH,
    DISTANCES_COLUMNS,
    distances.map((r) => [r.sampleId, r.group, r.d2, r.pChi2, r.pHotelling]),
  );
  csv(
    ASSIGNMENTS_PATH,
    ASSIGNMENTS_COLUMNS,
    assignments.map((r) => [
      r.sampleId,
      r.verdict,
      r.group,
      r.probability,
      r.runnerUp,
      r.runnerUpProbability,
      r.finalVerdict,
      r.finalGroup,
      r.overrideReason,
    ]),
  );
  csv(
    CONTRIBUTIONS_PATH,
    CONTRIBUTIONS_COLUMNS,
    contributions.map((r) => [r.sampleId, r.group, r.variable, r.contribution]),
  );
  csv(
    MEMBERS_PATH,
    MEMBERS_COLUMNS,
    members.map((r) => [r.sampleId, r.group, r.d2, r.d2Loo, r.pHotellingLoo, r.verdictLoo]),
  );
  csv(
    SEPARATION_PATH,
    SEPARATION_COLUMNS,
    separation.map((r) => [r.groupA, r.groupB, r.t2, r.f, r.df1, r.df2, r.p]),
  );
  return { entries, groups };
}
