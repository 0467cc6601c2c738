import { createHash } from 'node:crypto';
import { parse } from 'csv-parse/sync';
import request from 'supertest';
import type { DatasetMapping, FileLayout } from '@provenote/shared';
import { type Agent, type SignedInMember, createLabWithMembers } from '../../test/auth-helpers';
import { fixture } from '../../test/fixtures/import/collect-import';
import { zipBomb } from '../../test/fixtures/import/workbooks';
import { createTestApp, type TestApp } from '../../test/test-app';
import { DatasetUsageRegistry } from './dataset-usage';
import { readCell } from './parsing/read-cell';

type Role = 'pi' | 'analyst' | 'student' | 'guest';

describe('datasets API', () => {
  let testApp: TestApp;
  let labId: string;
  let members: Record<Role, SignedInMember>;
  const base = () => `/api/labs/${labId}`;

  const upload = (agent: Agent, name: string, bytes = fixture(name)) =>
    agent.post(`${base()}/dataset-files`).attach('file', bytes, name);

  async function importFile(agent: Agent, name: string, kind: 'reference' | 'unknowns', datasetName = name) {
    const layout: FileLayout = (await upload(agent, name).expect(201)).body;
    const res = await agent
      .post(`${base()}/datasets`)
      .send({ name: datasetName, kind, fileId: layout.file.id, mapping: layout.mapping })
      .expect(201);
    return { layout, dataset: res.body };
  }

  beforeAll(async () => {
    testApp = await createTestApp();
    ({ labId, members } = await createLabWithMembers(testApp));
  });
  afterAll(() => testApp.close());

  it('uploads a file, previews it, imports it as version 1 and keeps the file byte-exact', async () => {
    const agent = members.analyst.agent;
    const layout: FileLayout = (await upload(agent, 'detection-limits.csv').expect(201)).body;
    expect(layout).toMatchObject({
      headers: ['Sample', 'Group', 'Zr ppm', 'Nb ppm', 'Th ppm', 'U ppm', 'Cs ppm'],
      mappingSource: 'guessed',
    });
    expect(layout.file.sha256).toBe(createHash('sha256').update(fixture('detection-limits.csv')).digest('hex'));

    const preview = (
      await agent
        .post(`${base()}/dataset-files/${layout.file.id}/preview`)
        .send({ mapping: layout.mapping })
        .expect(201)
    ).body;
    expect(preview.summary).toEqual({ rowsRead: 3, imported: 3, flagged: 2, rejected: 0, blankRowsSkipped: 0 });
    expect(preview.rows[0].cells.map((cell: { flag: string }) => cell.flag)).toEqual([
      'below_dl',
      'below_dl_unstated',
      'not_determined',
      'empty',
      'negative',
    ]);
    expect(preview.problemCount).toBe(preview.problems.length);

    const created = (
      await agent
        .post(`${base()}/datasets`)
        .send({ name: 'Survey 1', kind: 'reference', fileId: layout.file.id, mapping: layout.mapping })
        .expect(201)
    ).body;
    expect(created.versions).toHaveLength(1);
    expect(created.versions[0]).toMatchObject({
      number: 1,
      summary: preview.summary,
      file: { sha256: layout.file.sha256 },
    });

    const rows = (
      await members.guest.agent.get(`${base()}/datasets/${created.id}/versions/1/rows?page=1&pageSize=2`).expect(200)
    ).body;
    expect(rows).toMatchObject({ total: 3, page: 1, pageSize: 2 });
    expect(rows.rows.map((row: { sampleId: string }) => row.sampleId)).toEqual(['D-1', 'D-2']);
    expect(rows.rows[1].cells[0]).toEqual({ ppm: 0.5, original: 0.5, flag: 'below_dl', raw: '< 0.5' });
    const page2 = (await agent.get(`${base()}/datasets/${created.id}/versions/1/rows?page=2&pageSize=2`).expect(200))
      .body;
    expect(page2.rows.map((row: { sampleId: string }) => row.sampleId)).toEqual(['D-3']);

    const problems = (await agent.get(`${base()}/datasets/${created.id}/versions/1/problems?pageSize=500`).expect(200))
      .body;
    expect(problems.total).toBe(preview.problemCount);

    const raw = await members.guest.agent
      .get(`${base()}/datasets/${created.id}/versions/1/raw`)
      .buffer(true)
      .parse((res, done) => {
        const chunks: Buffer[] = [];
        res.on('data', (chunk: Buffer) => chunks.push(chunk));
        res.on('end', () => done(null, Buffer.concat(chunks)));
      })
      .expect(200);
    expect(Buffer.compare(raw.body as Buffer, fixture('detection-limits.csv'))).toBe(0);
  });

  it('exports CSV whose values read back as the input values, and re-imports to the same rows', async () => {
    const agent = members.pi.agent;
    const { dataset } = await importFile(agent, 'comma-basic.csv', 'reference', 'Round trip');
    const input: string[][] = parse(fixture('comma-basic.csv'));
    const exported = await agent.get(`${base()}/datasets/${dataset.id}/versions/1/export.csv`).expect(200);
    expect(exported.headers['content-type']).toMatch(/text\/csv/);
    const output: string[][] = parse(exported.text);
    expect(output[0]).toEqual(input[0]);
    const read = (table: string[][]) => table.slice(1).map((row) => row.slice(2).map((cell) => readCell(cell, '.')));
    expect(read(output)).toEqual(read(input));

    const ppm = parse(
      (await agent.get(`${base()}/datasets/${dataset.id}/versions/1/export.csv?values=ppm`).expect(200)).text,
    );
    expect(ppm[0]).toEqual(['Sample ID', 'Group', 'Si (ppm)', 'Al (ppm)', 'Zr (ppm)', 'La (ppm)', 'Rb (ppm)']);
    expect(Number(ppm[1][5])).toBe(31.2);

    const reimported = await upload(agent, 'export.csv', Buffer.from(exported.text)).expect(201);
    expect(reimported.body.mappingSource).toBe('saved');
    const again = (
      await agent
        .post(`${base()}/datasets/${dataset.id}/versions`)
        .send({ fileId: reimported.body.file.id, mapping: reimported.body.mapping, note: 'round trip' })
        .expect(201)
    ).body;
    expect(again.versions.map((version: { number: number }) => version.number)).toEqual([1, 2]);
    const first = (await agent.get(`${base()}/datasets/${dataset.id}/versions/1/rows`).expect(200)).body.rows;
    const second = (await agent.get(`${base()}/datasets/${dataset.id}/versions/2/rows`).expect(200)).body.rows;
    const cells = (rows: { cells: { ppm: number; flag: string }[] }[]) =>
      rows.map((row) => row.cells.map((cell) => [cell.ppm, cell.flag]));
    expect(cells(second)).toEqual(cells(first));
  });

  it('offers a saved mapping again for a file of the same layout', async () => {
    const agent = members.analyst.agent;
    const first: FileLayout = (await upload(agent, 'ragged.csv').expect(201)).body;
    expect(first.mappingSource).toBe('guessed');
    const mapping: DatasetMapping = {
      ...first.mapping,
      columns: first.mapping.columns.map((c) => (c.header === 'Nb ppm' ? { ...c, unit: 'ppb' } : c)),
    };
    await agent
      .post(`${base()}/datasets`)
      .send({ name: 'Ragged', kind: 'reference', fileId: first.file.id, mapping })
      .expect(201);
    const second: FileLayout = (await upload(agent, 'ragged.csv').expect(201)).body;
    expect(second.mappingSource).toBe('saved');
    expect(second.mapping.columns.find((c) => c.header === 'Nb ppm')?.unit).toBe('ppb');
  });

  it('lets students import unknowns only, guests only read, and checks the lab', async () => {
    await importFile(members.student.agent, 'bom-utf8.csv', 'unknowns', 'Student unknowns');
    const layout: FileLayout = (await upload(members.student.agent, 'comma-basic.csv').expect(201)).body;
    const refused = await members.student.agent
      .post(`${base()}/datasets`)
      .send({ name: 'Not mine', kind: 'reference', fileId: layout.file.id, mapping: layout.mapping })
      .expect(403);
    expect(refused.body.message).toMatch(/Only analysts and PIs/);
    await upload(members.guest.agent, 'comma-basic.csv').expect(403);
    const list = (await members.guest.agent.get(`${base()}/datasets`).expect(200)).body;
    expect(list.map((dataset: { name: string }) => dataset.name)).toContain('Student unknowns');

    const other = await createLabWithMembers(testApp, ['pi']);
    await other.members.pi.agent.get(`${base()}/datasets`).expect(404);
    await other.members.pi.agent.get(`/api/labs/${other.labId}/dataset-files/${layout.file.id}/raw`).expect(404);
  });

  it('refuses files that are not tables, with the reason', async () => {
    const agent = members.analyst.agent;
    const bomb = await upload(agent, 'bomb.xlsx', zipBomb()).expect(422);
    expect(bomb.body.errors[0].message).toMatch(/^zip-bomb:/);
    const junk = await upload(agent, 'binary-junk.csv').expect(422);
    expect(junk.body.message).toMatch(/not a text table/);
    await upload(agent, 'empty.csv').expect(422);
    const header = await upload(agent, 'header-only.csv').expect(201);
    const none = await agent
      .post(`${base()}/datasets`)
      .send({ name: 'Nothing', kind: 'reference', fileId: header.body.file.id, mapping: header.body.mapping })
      .expect(422);
    expect(none.body.message).toBe('The file has no rows that can be imported');
  });

  it('refuses a file over the upload limit', async () => {
    const small = await createTestApp({ UPLOAD_LIMIT_MB: '0.001' });
    try {
      const { labId: smallLab, members: smallMembers } = await createLabWithMembers(small, ['analyst']);
      await smallMembers.analyst.agent
        .post(`/api/labs/${smallLab}/dataset-files`)
        .attach('file', Buffer.alloc(2000, 'a'), 'big.csv')
        .expect(413);
    } finally {
      await small.close();
    }
  });

  it('deletes for PIs and analysts only, and not while a study pins the version', async () => {
    const { dataset } = await importFile(members.analyst.agent, 'thousands.csv', 'unknowns', 'To delete');
    await members.student.agent.delete(`${base()}/datasets/${dataset.id}`).expect(403);
    const registry = testApp.app.get(DatasetUsageRegistry);
    const pinned = dataset.versions[0].id;
    registry.register(async (ids) => (ids.includes(pinned) ? ['study "Basin survey" (signed off)'] : []));
    const blocked = await members.pi.agent.delete(`${base()}/datasets/${dataset.id}/versions/1`).expect(409);
    expect(blocked.body.errors).toEqual([{ path: 'version', message: 'study "Basin survey" (signed off)' }]);

    const { dataset: free } = await importFile(members.analyst.agent, 'latin1.csv', 'unknowns', 'Free');
    await members.analyst.agent.delete(`${base()}/datasets/${free.id}`).expect(204);
    await members.guest.agent.get(`${base()}/datasets/${free.id}`).expect(404);
    await request(testApp.app.getHttpServer()).get(`${base()}/datasets`).expect(401);
  });
});
