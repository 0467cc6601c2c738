import { irisContent } from './__fixtures__/iris-content';
import { bundleBuffer, rewriteZip } from './__fixtures__/zip-tools';
import { CONTRIBUTIONS_PATH, DISTANCES_PATH } from './bundle-layout';
import { parseCsv } from './csv';
import { verifyBundle } from './verify-bundle';
import { readZipEntries } from './zip-reader';

const csvOf = async (zip: Buffer, path: string) =>
  parseCsv((await readZipEntries(zip)).find((e) => e.name === path)!.bytes.toString('utf8'), path);

describe('result bundle: contributions to D²', () => {
  let zip: Buffer;
  beforeAll(async () => {
    zip = await bundleBuffer(irisContent({ parameters: { transform: 'ilr' } }));
  });

  it('holds one row per unknown and coordinate whose contributions sum to its D² to its best group', async () => {
    const contributions = await csvOf(zip, CONTRIBUTIONS_PATH);
    const distances = await csvOf(zip, DISTANCES_PATH);
    expect(contributions.header).toEqual(['sample_id', 'group', 'variable', 'contribution']);
    // 15 unknowns, four parts give three pivot coordinates.
    expect(contributions.rows).toHaveLength(15 * 3);
    const sums = new Map<string, number>();
    for (const [sampleId, group, , value] of contributions.rows) {
      const key = `${sampleId} ${group}`;
      sums.set(key, (sums.get(key) ?? 0) + Number(value));
    }
    expect(sums.size).toBe(15);
    for (const [key, sum] of sums) {
      const [sampleId, group] = key.split(' ');
      const d2 = Number(distances.rows.find(([s, g]) => s === sampleId && g === group)![2]);
      expect(sum).toBeCloseTo(d2, 9);
    }
  });

  it('names one changed contribution by checksum and by line', async () => {
    const original = (await readZipEntries(zip)).find((e) => e.name === CONTRIBUTIONS_PATH)!.bytes.toString('utf8');
    const line = original.split('\r\n')[3];
    const cells = line.split(',');
    cells[3] = String(Number(cells[3]) * 1.01);
    const tampered = await rewriteZip(zip, (entries) =>
      entries.map((e) =>
        e.name === CONTRIBUTIONS_PATH
          ? { name: e.name, bytes: Buffer.from(original.replace(line, cells.join(','))) }
          : e,
      ),
    );
    const result = await verifyBundle(tampered);
    expect(result.ok).toBe(false);
    expect(result.problems).toEqual([
      expect.objectContaining({ kind: 'checksum', path: CONTRIBUTIONS_PATH }),
      expect.objectContaining({
        kind: 'difference',
        path: CONTRIBUTIONS_PATH,
        message: expect.stringMatching(/^line 4, contribution: /),
      }),
    ]);
  });
});
