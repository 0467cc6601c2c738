import { irisContent } from './__fixtures__/iris-content';
import { bundleBuffer, renameEntryBytes, rewriteZip } from './__fixtures__/zip-tools';
import { DISTANCES_PATH, MANIFEST_PATH, PREPARED_PATH, SEPARATION_PATH } from './bundle-layout';
import { parseCsv } from './csv';
import { verifyBundle } from './verify-bundle';
import { readZipEntries, type ZipEntryBytes } from './zip-reader';

const text = (entries: ZipEntryBytes[], name: string) => entries.find((e) => e.name === name)!.bytes.toString('utf8');
const replaceIn = (name: string, change: (text: string) => string) => (entries: ZipEntryBytes[]) =>
  entries.map((e) => (e.name === name ? { name, bytes: Buffer.from(change(e.bytes.toString('utf8'))) } : e));

describe('result bundle: build and verify', () => {
  let zip: Buffer;
  beforeAll(async () => {
    zip = await bundleBuffer(irisContent({ firstUnknownId: '=HYPERLINK("http://example.invalid","x")' }));
  });

  it('verifies a freshly built bundle, comparing every recomputed value', async () => {
    const result = await verifyBundle(zip);
    expect(result.problems).toEqual([]);
    expect(result.ok).toBe(true);
    // 135 reference flowers × 4 values, 15 unknowns × 3 groups, 135 members, 3 pairs, 3 means and covariances.
    expect(result.valuesCompared).toBeGreaterThan(135 * 4 + 15 * 3 * 3 + 135 * 4);
    expect(result.manifest?.files.map((f) => f.path)).toEqual(
      expect.arrayContaining(['inputs/raw/iris.csv', PREPARED_PATH, DISTANCES_PATH, 'report.html', 'README.txt']),
    );
  });

  it('lays out the files the manifest lists and records the same bytes the same way twice', async () => {
    const entries = await readZipEntries(zip);
    const manifest = JSON.parse(text(entries, MANIFEST_PATH));
    expect(entries.map((e) => e.name).sort()).toEqual(
      [MANIFEST_PATH, ...manifest.files.map((f: { path: string }) => f.path)].sort(),
    );
    expect(manifest.groups.map((g: { directory: string }) => g.directory)).toEqual([
      'groups/setosa',
      'groups/versicolor',
      'groups/virginica',
    ]);
    expect(await bundleBuffer(irisContent({ firstUnknownId: '=HYPERLINK("http://example.invalid","x")' }))).toEqual(
      zip,
    );
  });

  it('escapes a formula-like sample id in every CSV and reads it back unchanged', async () => {
    const entries = await readZipEntries(zip);
    expect(text(entries, DISTANCES_PATH)).toContain(`"'=HYPERLINK(""http://example.invalid"",""x"")"`);
    expect(text(entries, DISTANCES_PATH)).not.toMatch(/(^|,)"?=HYPERLINK/m);
    const table = parseCsv(text(entries, DISTANCES_PATH), DISTANCES_PATH);
    expect(table.rows[0][0]).toBe('=HYPERLINK("http://example.invalid","x")');
  });

  it('names a result changed by one digit, by checksum and by line and column', async () => {
    const entries = await readZipEntries(zip);
    const original = text(entries, DISTANCES_PATH);
    const line = original.split('\r\n')[1];
    const d2 = line.split(',').at(-3)!;
    const changedDigit = d2.replace(/\.(\d)/, (_, digit: string) => `.${(Number(digit) + 1) % 10}`);
    const tampered = await rewriteZip(
      zip,
      replaceIn(DISTANCES_PATH, (t) => t.replace(line, line.replace(d2, changedDigit))),
    );
    const result = await verifyBundle(tampered);
    expect(result.ok).toBe(false);
    expect(result.problems).toEqual(
      expect.arrayContaining([
        expect.objectContaining({ kind: 'checksum', path: DISTANCES_PATH }),
        expect.objectContaining({
          kind: 'difference',
          path: DISTANCES_PATH,
          message: expect.stringMatching(/^line 2, d2: the bundle has /),
        }),
      ]),
    );
  });

  it('names a changed input even when its checksum in the manifest was updated to match', async () => {
    const changeValue = (t: string) => t.replace(/^(iris-1,reference,setosa,sepal_length,)5\.1,5\.1,/m, '$15.3,5.1,');
    const first = await rewriteZip(zip, replaceIn(PREPARED_PATH, changeValue));
    const bytes = (await readZipEntries(first)).find((e) => e.name === PREPARED_PATH)!.bytes;
    const { createHash } = await import('node:crypto');
    const forged = await rewriteZip(
      first,
      replaceIn(MANIFEST_PATH, (t) => {
        const manifest = JSON.parse(t);
        const file = manifest.files.find((f: { path: string }) => f.path === PREPARED_PATH);
        file.sha256 = createHash('sha256').update(bytes).digest('hex');
        file.bytes = bytes.byteLength;
        return JSON.stringify(manifest);
      }),
    );
    const result = await verifyBundle(forged);
    expect(result.ok).toBe(false);
    expect(result.problems.some((p) => p.kind === 'checksum')).toBe(false);
    const paths = new Set(result.problems.filter((p) => p.kind === 'difference').map((p) => p.path));
    // The stale transformed value, setosa's model, and every result that depends on it.
    expect(paths).toEqual(
      new Set([
        PREPARED_PATH,
        'groups/setosa/mean.csv',
        'groups/setosa/covariance.csv',
        DISTANCES_PATH,
        'results/assignments.csv',
        'results/contributions.csv',
        'results/members.csv',
        SEPARATION_PATH,
      ]),
    );
  });

  it('names a removed file and an added file', async () => {
    const removed = await verifyBundle(
      await rewriteZip(zip, (entries) => entries.filter((e) => e.name !== SEPARATION_PATH)),
    );
    expect(removed.problems).toEqual([
      { kind: 'missing', path: SEPARATION_PATH, message: 'listed in the manifest but not in the archive' },
    ]);
    const added = await verifyBundle(
      await rewriteZip(zip, (entries) => [...entries, { name: 'results/extra.csv', bytes: Buffer.from('a\r\n1\r\n') }]),
    );
    expect(added.problems).toEqual([
      { kind: 'unexpected', path: 'results/extra.csv', message: 'in the archive but not listed in the manifest' },
    ]);
  });

  it.each([
    ['a parent-directory entry', '../../../etc/cron.d/x'],
    ['an absolute path', '/etc/cron.d/provenote'],
  ])('refuses and names %s', async (_, unsafe) => {
    const placeholder = 'inputs/' + 'p'.repeat(unsafe.length - 'inputs/'.length);
    const planted = await rewriteZip(zip, (entries) => [...entries, { name: placeholder, bytes: Buffer.from('boo') }]);
    const result = await verifyBundle(renameEntryBytes(planted, placeholder, unsafe));
    expect(result.ok).toBe(false);
    expect(result.problems).toEqual([expect.objectContaining({ kind: 'unsafe-path', path: unsafe })]);
  });

  it('refuses something that is not a zip archive', async () => {
    const result = await verifyBundle(Buffer.from('not a zip at all'));
    expect(result).toEqual(
      expect.objectContaining({ ok: false, problems: [expect.objectContaining({ kind: 'unreadable' })] }),
    );
  });

  it.each([
    ['a robust (FAST-MCD) fit', { covariance: 'mcd' as const }],
    ['pivot coordinates', { transform: 'ilr' as const }],
    ['additive log-ratios', { transform: 'alr' as const, alrDenominator: 'sepal_width' }],
  ])('verifies a bundle built with %s', async (_, parameters) => {
    const built = await bundleBuffer(irisContent({ parameters }));
    const result = await verifyBundle(built);
    expect(result.problems).toEqual([]);
    const names = (await readZipEntries(built)).map((e) => e.name);
    expect(names.includes('groups/setosa/robust-fit.json')).toBe('covariance' in parameters);
  });
});

describe('result bundle of a group check', () => {
  it('records the separation of versicolor and virginica as published', async () => {
    const zip = await bundleBuffer(irisContent({ unknownEvery: 0 }));
    expect((await verifyBundle(zip)).problems).toEqual([]);
    const separation = parseCsv(text(await readZipEntries(zip), SEPARATION_PATH), SEPARATION_PATH);
    const row = separation.rows.find(([a, b]) => a === 'versicolor' && b === 'virginica')!;
    // Outside check (METHODS.md §5): T² = 355.472, F = 86.148 on (4, 95) for Fisher's iris.
    expect(Number(row[2])).toBeCloseTo(355.472, 3);
    expect(Number(row[3])).toBeCloseTo(86.148, 3);
    expect(row.slice(4, 6)).toEqual(['4', '95']);
  });
});
