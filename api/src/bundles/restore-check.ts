import {
  applyTransform,
  fitGroup,
  kruskalWallisByVariable,
  leaveOneOutCheck,
  toDistanceCoordinates,
  type BundleManifest,
} from '@provenote/shared';
import {
  CONTRIBUTIONS_COLUMNS,
  CONTRIBUTIONS_PATH,
  MEMBERS_COLUMNS,
  MEMBERS_PATH,
  parseCsv,
  parseNumberCell,
  robustFit,
  SEPARATION_COLUMNS,
  SEPARATION_PATH,
} from '@provenote/workers';
import type { RestoredInput } from './restore-plan';

/** A run_check_members row: the bundle's own leave-one-out numbers and verdict. */
export interface RestoredCheckMember {
  ordinal: number;
  sampleId: string;
  groupName: string;
  d2: number;
  d2LeaveOneOut: number;
  pChi2LeaveOneOut: number;
  pHotellingLeaveOneOut: number;
  outcome: string;
  bestGroup: string;
  robustD2: number | null;
  robustOutlier: boolean | null;
}

export interface RestoredCheck {
  members: RestoredCheckMember[];
  pairs: { groupA: string; groupB: string; t2: number; f: number; df1: number; df2: number; p: number }[];
  summary: Record<string, unknown>;
}

const number = (cell: string, where: string) => parseNumberCell(cell, where);

/**
 * The group check of a verified bundle. Members and separation are the bundle's CSVs; what those CSVs
 * do not carry (χ² probability left out, best group, robust D², confusion, Kruskal–Wallis) comes from
 * the engine on the bundle's prepared reference data, the same computation the verification just
 * matched against the bundle's numbers. Null when the bundle has no check results.
 */
export function restoreCheck(
  files: ReadonlyMap<string, Buffer>,
  manifest: BundleManifest,
  inputs: readonly RestoredInput[],
  variables: string[],
): RestoredCheck | null {
  const membersBytes = files.get(MEMBERS_PATH);
  const separationBytes = files.get(SEPARATION_PATH);
  if (!membersBytes || !separationBytes) return null;
  const bundleMembers = new Map(
    parseCsv(membersBytes.toString('utf8'), MEMBERS_PATH, MEMBERS_COLUMNS).rows.map((row) => [row[0], row]),
  );
  const pairs = parseCsv(separationBytes.toString('utf8'), SEPARATION_PATH, SEPARATION_COLUMNS).rows.map(
    // Runs name each pair in name order; T², F and p do not depend on which group comes first.
    ([first, second, t2, f, df1, df2, p]) => ({
      groupA: first < second ? first : second,
      groupB: first < second ? second : first,
      t2: number(t2, `${SEPARATION_PATH}, t2`),
      f: number(f, `${SEPARATION_PATH}, f`),
      df1: number(df1, `${SEPARATION_PATH}, df1`),
      df2: number(df2, `${SEPARATION_PATH}, df2`),
      p: number(p, `${SEPARATION_PATH}, p`),
    }),
  );

  const { elements, transform, alrDenominator, covariance, probability, alpha } = manifest.parameters;
  const reference = inputs.filter((input) => input.role === 'reference' && input.group !== null);
  const spec = { transform, alrDenominator };
  const coordinates = toDistanceCoordinates(
    applyTransform(
      reference.map((input) => input.values),
      elements,
      spec,
    ),
    spec,
  ).values;
  const names = [...new Set(reference.map((input) => input.group!))].sort((a, b) => (a < b ? -1 : a > b ? 1 : 0));
  const groups = names.map((name) => {
    const at = reference.flatMap((input, i) => (input.group === name ? [i] : []));
    return { name, members: at.map((i) => reference[i]), rows: at.map((i) => coordinates[i]) };
  });
  const seed = manifest.seed;
  const models = groups.map((g) => fitGroup(g.name, g.rows, variables, { covariance, seed }));
  const check = leaveOneOutCheck(
    models,
    groups.map((g) => g.rows),
    probability,
    alpha,
  );
  const robust = models.map((model, g) => robustFit(model, groups[g].rows, variables, seed));

  const members = check.members.map((member): RestoredCheckMember => {
    const g = names.indexOf(member.group);
    const input = groups[g].members[member.index];
    const row = bundleMembers.get(input.sampleId);
    if (!row) throw new Error(`${MEMBERS_PATH} has no row for the reference sample ${input.sampleId}`);
    const [, group, d2, d2Loo, pHotellingLoo, verdictLoo] = row;
    const where = `${MEMBERS_PATH}, ${input.sampleId}`;
    return {
      ordinal: input.ordinal,
      sampleId: input.sampleId,
      groupName: group,
      d2: number(d2, `${where}, d2`),
      d2LeaveOneOut: number(d2Loo, `${where}, d2_loo`),
      pChi2LeaveOneOut: member.pChi2LeaveOneOut,
      pHotellingLeaveOneOut: number(pHotellingLoo, `${where}, p_hotelling_loo`),
      outcome: verdictLoo,
      bestGroup: member.verdict.group,
      robustD2: robust[g].d2?.[member.index] ?? null,
      robustOutlier: robust[g].flagged?.[member.index] ?? null,
    };
  });
  return {
    members,
    pairs,
    summary: {
      variables,
      restoredFromBundle: true,
      confusion: check.confusion,
      returnedToOwnGroup: check.returnedToOwnGroup,
      members: members.length,
      kruskalWallis: kruskalWallisByVariable(
        groups.map((g) => g.rows),
        variables,
      ),
      robustFit: robust.map(({ group, seed: used, cutoff, note, flagged }) => ({
        group,
        seed: used,
        cutoff,
        note,
        flagged: flagged ? flagged.filter(Boolean).length : null,
      })),
    },
  };
}

/**
 * Each unknown's per-variable contributions to D² to its best group, from results/contributions.csv,
 * in the order of `variables`. Empty when the bundle predates that file.
 */
export function restoreContributions(
  files: ReadonlyMap<string, Buffer>,
  variables: readonly string[],
): Map<string, number[]> {
  const bytes = files.get(CONTRIBUTIONS_PATH);
  const bySample = new Map<string, number[]>();
  if (!bytes) return bySample;
  for (const [sampleId, , variable, contribution] of parseCsv(
    bytes.toString('utf8'),
    CONTRIBUTIONS_PATH,
    CONTRIBUTIONS_COLUMNS,
  ).rows) {
    const j = variables.indexOf(variable);
    if (j < 0) throw new Error(`${CONTRIBUTIONS_PATH} names the variable "${variable}", which the groups do not have`);
    const values = bySample.get(sampleId) ?? [];
    values[j] = number(contribution, `${CONTRIBUTIONS_PATH}, ${sampleId}, ${variable}`);
    bySample.set(sampleId, values);
  }
  return bySample;
}
