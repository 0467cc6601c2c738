import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { EXIT_OK } from './cli-errors';
import { fixture, readCsv, run, temporaryDirectory } from './__fixtures__/harness';

describe('check command', () => {
  const out = temporaryDirectory();
  const result = run([
    'check',
    '--reference',
    fixture('iris-reference.csv'),
    '--out',
    out,
    '--probability',
    'hotelling',
  ]);

  it('exits 0 and writes members.csv for every reference member', () => {
    expect(result.code).toBe(EXIT_OK);
    const rows = readCsv(join(out, 'members.csv'));
    expect(rows[0]).toEqual(['sample_id', 'group', 'd2', 'd2_loo', 'p_hotelling_loo', 'verdict_loo']);
    expect(rows).toHaveLength(121);
    rows.slice(1).forEach((r) => {
      expect(['own_group', 'other_group', 'ambiguous', 'unassigned']).toContain(r[5]);
      // Leaving a member out can only move the group mean away from it: D²₍₋ᵢ₎ > D²ᵢ.
      expect(Number(r[3])).toBeGreaterThan(Number(r[2]));
    });
    expect(result.stdout).toMatch(/checked 120 members/);
  });

  it('writes separation.csv with each pair of groups; df = (p, n₁ + n₂ − p − 1)', () => {
    const rows = readCsv(join(out, 'separation.csv'));
    expect(rows[0]).toEqual(['group_a', 'group_b', 't2', 'f', 'df1', 'df2', 'p']);
    expect(rows.slice(1).map((r) => `${r[0]}/${r[1]}`)).toEqual([
      'setosa/versicolor',
      'setosa/virginica',
      'versicolor/virginica',
    ]);
    rows.slice(1).forEach((r) => expect([r[4], r[5]]).toEqual(['4', '75']));
  });

  it('run.json holds the confusion table and screening statistics', () => {
    const manifest = JSON.parse(readFileSync(join(out, 'run.json'), 'utf8'));
    expect(manifest.leaveOneOut.members).toBe(120);
    expect(manifest.kruskalWallis).toHaveLength(4);
    expect(manifest.wilksLambda.lambda).toBeGreaterThan(0);
    expect(manifest.wilksLambda.lambda).toBeLessThan(0.1);
  });
});
