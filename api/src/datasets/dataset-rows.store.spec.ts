import { DataSource } from 'typeorm';
import { cellFlags, type FileLayout } from '@provenote/shared';
import { type SignedInMember, createLabWithMembers } from '../../test/auth-helpers';
import { createTestApp, type TestApp } from '../../test/test-app';

/** Cells that COPY's text format and PostgreSQL's array literals both treat specially. */
const AWKWARD = ['tab\there', 'line\nbreak', 'carriage\rreturn', 'back\\slash', 'say "hi", {x}', 'NULL', '\\N', ''];
const csvCell = (text: string) => `"${text.replace(/"/g, '""')}"`;

describe('dataset rows written with COPY', () => {
  let testApp: TestApp;
  let labId: string;
  let analyst: SignedInMember;

  beforeAll(async () => {
    testApp = await createTestApp();
    ({
      labId,
      members: { analyst },
    } = await createLabWithMembers(testApp, ['analyst'] as const));
  });
  afterAll(() => testApp.close());

  async function importCsv(name: string, kind: 'reference' | 'unknowns', csv: string): Promise<string> {
    const base = `/api/labs/${labId}`;
    const layout: FileLayout = (
      await analyst.agent.post(`${base}/dataset-files`).attach('file', Buffer.from(csv), name).expect(201)
    ).body;
    const dataset = (
      await analyst.agent
        .post(`${base}/datasets`)
        .send({ name, kind, fileId: layout.file.id, mapping: layout.mapping })
        .expect(201)
    ).body;
    return dataset.versions[0].id;
  }

  it('stores ids, raw text and attributes with tabs, line breaks, backslashes, quotes and braces unchanged', async () => {
    const lines = ['sample,Zr,Nb,note'];
    AWKWARD.forEach((text, i) =>
      lines.push([csvCell(`S${i} ${text}`), '12.5', csvCell(`x${text}`), csvCell(text)].join(',')),
    );
    const versionId = await importCsv('awkward.csv', 'unknowns', lines.join('\r\n'));
    const rows: { sample_id: string; ppm: (number | null)[]; raw: (string | null)[]; attributes: unknown }[] =
      await testApp.app
        .get(DataSource)
        .query(`SELECT sample_id, ppm, raw, attributes FROM dataset_rows WHERE version_id = $1 ORDER BY position`, [
          versionId,
        ]);
    expect(rows.map((row) => row.sample_id)).toEqual(AWKWARD.map((text, i) => `S${i} ${text}`.trim()));
    expect(rows.map((row) => row.raw)).toEqual(AWKWARD.map((text) => [null, `x${text}`]));
    expect(rows.map((row) => row.ppm[0])).toEqual(AWKWARD.map(() => 12.5));
    // The importer keeps no attributes for a row whose extra cells are all empty.
    expect(rows.map((row) => row.attributes)).toEqual(AWKWARD.map((text) => (text === '' ? null : { note: text })));
  });

  it('stores numbers, units, gaps, flags and groups as the binary COPY stream gave them', async () => {
    const versionId = await importCsv(
      'numbers.csv',
      'reference',
      ['Sample,Group,Zr ppm,Nb ppb,Th ppm', 'A1,g1,12.5,<0.5,-0.25', 'A2,,n.d.,3000,7', 'A3,g2,1e-3,,0'].join('\n'),
    );
    const rows: {
      sample_id: string;
      group_name: string | null;
      ppm: (number | null)[];
      original: (number | null)[];
      flags: number[];
      raw: (string | null)[];
    }[] = await testApp.app
      .get(DataSource)
      .query(
        `SELECT sample_id, group_name, ppm, original, flags, raw FROM dataset_rows WHERE version_id = $1 ORDER BY position`,
        [versionId],
      );
    const flag = (name: (typeof cellFlags)[number]) => cellFlags.indexOf(name);
    expect(rows.map((row) => [row.sample_id, row.group_name])).toEqual([
      ['A1', 'g1'],
      ['A2', null],
      ['A3', 'g2'],
    ]);
    expect(rows.map((row) => row.original)).toEqual([
      [12.5, 0.5, -0.25],
      [null, 3000, 7],
      [0.001, null, 0],
    ]);
    // 1 ppb is 1e-3 ppm.
    expect(rows[0].ppm[1]).toBeCloseTo(0.0005, 15);
    expect(rows[1].ppm[1]).toBeCloseTo(3, 12);
    expect(rows.map((row) => [row.ppm[0], row.ppm[2]])).toEqual([
      [12.5, -0.25],
      [null, 7],
      [0.001, 0],
    ]);
    expect(rows.map((row) => row.flags)).toEqual([
      [flag('measured'), flag('below_dl'), flag('negative')],
      [flag('not_determined'), flag('measured'), flag('measured')],
      [flag('measured'), flag('empty'), flag('measured')],
    ]);
    expect(rows.map((row) => row.raw)).toEqual([
      [null, '<0.5', null],
      ['n.d.', null, null],
      ['1e-3', null, null],
    ]);
  });
  it('keeps each row its own flags and text across COPY batches where most rows share them', async () => {
    // 2,500 rows: more than two of the importer's batches; every seventh row has a below-detection cell.
    const lines = ['sample,Zr,Nb'];
    for (let i = 1; i <= 2500; i++) lines.push(`S${i},${i}.25,${i % 7 === 0 ? '<0.5' : `${i}`}`);
    const versionId = await importCsv('batches.csv', 'unknowns', lines.join('\n'));
    const rows: { position: number; ppm: number[]; original: number[]; flags: number[]; raw: (string | null)[] }[] =
      await testApp.app
        .get(DataSource)
        .query(`SELECT position, ppm, original, flags, raw FROM dataset_rows WHERE version_id = $1 ORDER BY position`, [
          versionId,
        ]);
    expect(rows).toHaveLength(2500);
    const measured = cellFlags.indexOf('measured');
    const below = cellFlags.indexOf('below_dl');
    for (const row of rows) {
      const flagged = row.position % 7 === 0;
      expect(row.ppm).toEqual([row.position + 0.25, flagged ? 0.5 : row.position]);
      expect(row.original).toEqual(row.ppm);
      expect(row.flags).toEqual([measured, flagged ? below : measured]);
      expect(row.raw).toEqual([null, flagged ? '<0.5' : null]);
    }
  });
  describe('the key from rows to their version, checked per statement', () => {
    const db = () => testApp.app.get(DataSource);
    const insertRow = (versionId: string, position: number) =>
      db().query(
        `INSERT INTO dataset_rows (version_id, position, source_row, sample_id, ppm, original, flags, raw)
         VALUES ($1, $2, 1, 'X', '{1}', '{1}', '{0}', '{NULL}')`,
        [versionId, position],
      );

    it('refuses rows naming a version that does not exist, also among rows of one that does', async () => {
      const versionId = await importCsv('key.csv', 'unknowns', 'sample,Zr\nK1,1');
      const missing = '00000000-0000-4000-8000-000000000000';
      await expect(insertRow(missing, 1)).rejects.toMatchObject({ code: '23503' });
      await expect(
        db().query(
          `INSERT INTO dataset_rows (version_id, position, source_row, sample_id, ppm, original, flags, raw)
           SELECT v, 100 + n, 1, 'X', '{1}', '{1}', '{0}', '{NULL}' FROM unnest($1::uuid[]) WITH ORDINALITY AS t(v, n)`,
          [[versionId, missing]],
        ),
      ).rejects.toMatchObject({ code: '23503' });
      await expect(
        db().query(`UPDATE dataset_rows SET version_id = $2 WHERE version_id = $1`, [versionId, missing]),
      ).rejects.toMatchObject({ code: '23503' });
      await insertRow(versionId, 2);
      expect(
        await db().query(`SELECT count(*)::int AS n FROM dataset_rows WHERE version_id = $1`, [versionId]),
      ).toEqual([{ n: 2 }]);
    });

    it("deletes a version's rows with it, and keeps its id while rows name it", async () => {
      const versionId = await importCsv('cascade.csv', 'unknowns', 'sample,Zr\nC1,1\nC2,2');
      await expect(
        db().query(`UPDATE dataset_versions SET id = gen_random_uuid() WHERE id = $1`, [versionId]),
      ).rejects.toMatchObject({ code: '23503' });
      const [{ dataset_id: datasetId }] = await db().query(`SELECT dataset_id FROM dataset_versions WHERE id = $1`, [
        versionId,
      ]);
      // Deleting the dataset cascades to its versions, and the versions' deletion to their rows.
      await db().query(`DELETE FROM datasets WHERE id = $1`, [datasetId]);
      expect(
        await db().query(`SELECT count(*)::int AS n FROM dataset_rows WHERE version_id = $1`, [versionId]),
      ).toEqual([{ n: 0 }]);
    });
  });
});
