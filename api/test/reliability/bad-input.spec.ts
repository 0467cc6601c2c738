import { readdirSync } from 'node:fs';
import type { FileLayout } from '@provenote/shared';
import { DataSource } from 'typeorm';
import { MAX_MAPPING_COLUMNS } from '../../src/app.factory';
import { type Agent, createLabWithMembers } from '../auth-helpers';
import { FIXTURES, fixture } from '../fixtures/import/collect-import';
import { createTestApp, type TestApp } from '../test-app';

/** Tables an upload or an import writes to; a refused request must leave every count as it was. */
const WRITTEN_TABLES = ['dataset_files', 'datasets', 'dataset_versions', 'dataset_rows', 'dataset_problems'];
const UPLOAD_LIMIT_MB = 1;

const corpusFiles = readdirSync(FIXTURES).filter((name) => /\.(csv|tsv)$/.test(name));

describe('hostile and malformed input through the real HTTP API', () => {
  let testApp: TestApp;
  let labId: string;
  let agent: Agent;
  const base = () => `/api/labs/${labId}`;

  const counts = async () => {
    const dataSource = testApp.app.get(DataSource);
    const entries = await Promise.all(
      WRITTEN_TABLES.map(async (table) => {
        const [row] = (await dataSource.query(`SELECT count(*)::int AS n FROM ${table}`)) as { n: number }[];
        return [table, row.n] as const;
      }),
    );
    return Object.fromEntries(entries);
  };

  /** A 4xx with a message a person can read, and nothing written. */
  async function expectRefusedCleanly(send: () => Promise<{ status: number; body: { message?: unknown } }>) {
    const before = await counts();
    const res = await send();
    expect(res.status).toBeGreaterThanOrEqual(400);
    expect(res.status).toBeLessThan(500);
    expect(typeof res.body.message).toBe('string');
    expect(String(res.body.message).length).toBeGreaterThan(5);
    expect(await counts()).toEqual(before);
    return res;
  }

  const upload = (bytes: Buffer, name: string) => agent.post(`${base()}/dataset-files`).attach('file', bytes, name);

  /** Uploads and imports a file under its guessed mapping; answers the created dataset's body. */
  async function importText(text: string, name = 'hostile.csv', kind: 'reference' | 'unknowns' = 'unknowns') {
    const layout = (await upload(Buffer.from(text, 'utf8'), name).expect(201)).body as FileLayout;
    const res = await agent
      .post(`${base()}/datasets`)
      .send({ name, kind, fileId: layout.file.id, mapping: layout.mapping })
      .expect(201);
    return res.body as { id: string; versions: { number: number; summary: Record<string, number> }[] };
  }

  const rowsOf = async (datasetId: string) =>
    (await agent.get(`${base()}/datasets/${datasetId}/versions/1/rows?page=1&pageSize=500`).expect(200)).body as {
      total: number;
      rows: { sampleId: string; cells: { ppm: number | null; flag: string; raw: string | null }[] }[];
    };

  beforeAll(async () => {
    testApp = await createTestApp({ UPLOAD_LIMIT_MB: String(UPLOAD_LIMIT_MB), WORKERS: 'external' });
    const lab = await createLabWithMembers(testApp, ['analyst']);
    labId = lab.labId;
    agent = lab.members.analyst.agent;
  });
  afterAll(async () => {
    // The server stays up through everything above.
    await agent.get('/api/health').expect(200);
    await testApp.close();
  });

  it.each(corpusFiles)('corpus file %s: imported whole, or refused with a 4xx and nothing written', async (name) => {
    const before = await counts();
    const uploaded = await upload(fixture(name), name);
    if (uploaded.status !== 201) {
      expect(uploaded.status).toBe(422);
      expect(uploaded.body.errors[0].path).toBe('file');
      expect(await counts()).toEqual(before);
      return;
    }
    const layout = uploaded.body as FileLayout;
    const afterUpload = await counts();
    const created = await agent
      .post(`${base()}/datasets`)
      .send({ name, kind: 'unknowns', fileId: layout.file.id, mapping: layout.mapping });
    if (created.status !== 201) {
      expect([400, 422]).toContain(created.status);
      expect(typeof created.body.message).toBe('string');
      expect(await counts()).toEqual(afterUpload);
      return;
    }
    const summary = created.body.versions[0].summary as Record<string, number>;
    expect(summary.rowsRead).toBe(summary.imported + summary.rejected);
    const stored = await testApp.app
      .get(DataSource)
      .query(
        `SELECT count(*)::int AS n FROM dataset_rows r JOIN dataset_versions v ON v.id = r.version_id WHERE v.dataset_id = $1`,
        [created.body.id],
      );
    expect(stored[0].n).toBe(summary.imported);
  });

  it('refuses an upload over the size limit with 413, and keeps serving', async () => {
    const big = Buffer.alloc(Math.ceil((UPLOAD_LIMIT_MB + 0.5) * 1024 * 1024), 'Z-1,1.5\n');
    const res = await expectRefusedCleanly(() => upload(big, 'big.csv'));
    expect(res.status).toBe(413);
    await agent.get(`${base()}/datasets`).expect(200);
  });

  it('refuses requests without a multipart file, with a file under another field, or with several files', async () => {
    const json = await expectRefusedCleanly(() =>
      agent.post(`${base()}/dataset-files`).send({ file: 'Sample,Zr\nA,1\n' }),
    );
    expect(json.status).toBe(400);
    expect(json.body.message).toMatch(/multipart field "file"/);
    const text = await expectRefusedCleanly(() =>
      agent.post(`${base()}/dataset-files`).set('Content-Type', 'text/csv').send('Sample,Zr\nA,1\n'),
    );
    expect(text.status).toBe(400);
    await expectRefusedCleanly(() =>
      agent.post(`${base()}/dataset-files`).attach('data', Buffer.from('Sample,Zr\nA,1\n'), 'a.csv'),
    );
    await expectRefusedCleanly(() =>
      agent
        .post(`${base()}/dataset-files`)
        .attach('file', Buffer.from('Sample,Zr\nA,1\n'), 'a.csv')
        .attach('file', Buffer.from('Sample,Zr\nB,2\n'), 'b.csv'),
    );
  });

  it('refuses a picture or an archive named .csv, and a JSON body that does not parse', async () => {
    const png = Buffer.from('89504e470d0a1a0a0000000d4948445200000001000000010806000000', 'hex');
    const picture = await expectRefusedCleanly(() => upload(Buffer.concat([png, Buffer.alloc(2048, 0)]), 'data.csv'));
    expect(picture.status).toBe(422);
    const zip = Buffer.concat([Buffer.from('504b030414000000', 'hex'), Buffer.alloc(512, 7)]);
    await expectRefusedCleanly(() => upload(zip, 'data.xlsx'));
    const malformed = await expectRefusedCleanly(() =>
      agent.post(`${base()}/datasets`).set('Content-Type', 'application/json').send('{"name": "x", "kind": '),
    );
    expect(malformed.status).toBe(400);
    const wrongType = await expectRefusedCleanly(() =>
      agent.post(`${base()}/datasets`).set('Content-Type', 'text/plain').send('name=x'),
    );
    expect(wrongType.status).toBe(400);
  });

  it('reads huge numbers, NaN and Infinity as unreadable text, never as a stored non-finite value', async () => {
    const dataset = await importText(
      ['Sample,Zr ppm,Rb ppm', 'H-1,1e400,12', 'H-2,NaN,-Infinity', 'H-3,Infinity,1e308', 'H-4,1e-400,0'].join('\n'),
    );
    expect(dataset.versions[0].summary).toMatchObject({ rowsRead: 4, imported: 4, rejected: 0 });
    const { rows } = await rowsOf(dataset.id);
    const cells = rows.flatMap((row) => row.cells.map((cell) => [row.sampleId, cell.ppm, cell.flag]));
    expect(cells).toEqual([
      ['H-1', null, 'unreadable'],
      ['H-1', 12, 'measured'],
      ['H-2', null, 'unreadable'],
      ['H-2', null, 'unreadable'],
      ['H-3', null, 'unreadable'],
      ['H-3', 1e308, 'measured'],
      // Below the smallest double: read as 0, with the file's text kept beside it.
      ['H-4', 0, 'measured'],
      ['H-4', 0, 'measured'],
    ]);
    expect(rows.map((row) => row.cells[0].raw)).toEqual(['1e400', 'NaN', 'Infinity', '1e-400']);
    const [nonFinite] = await testApp.app.get(DataSource).query(
      `SELECT count(*)::int AS n FROM dataset_rows r, unnest(r.ppm) AS v
         WHERE v IN ('NaN'::float8, 'Infinity'::float8, '-Infinity'::float8)`,
    );
    expect(nonFinite.n).toBe(0);
  });

  it('imports a file of 10,000 columns; a mapping over the documented column limit is a 413 saying what to do', async () => {
    const width = 10_000;
    const header = ['Sample', ...Array.from({ length: width - 1 }, (_, i) => `X${i} ppm`)].join(',');
    const row = (id: string) => [id, ...Array.from({ length: width - 1 }, (_, i) => String(i % 97))].join(',');
    const text = [header, row('W-1'), row('W-2')].join('\n');
    const uploaded = (await upload(Buffer.from(text), 'wide.csv').expect(201)).body as FileLayout;
    expect(uploaded.headers).toHaveLength(width);
    // No element is called X<n>, so the guess leaves these columns unmapped; the user maps each by hand.
    const measured = (index: number) =>
      ({
        index,
        header: `X${index - 1} ppm`,
        role: 'measurement',
        element: `X${index - 1}`,
        unit: 'ppm',
        oxide: null,
      }) as const;
    const layout = {
      ...uploaded,
      mapping: {
        ...uploaded.mapping,
        columns: uploaded.mapping.columns.map((column) => (column.index === 0 ? column : measured(column.index))),
      },
    };
    expect(JSON.stringify(layout.mapping).length).toBeGreaterThan(100 * 1024);

    await agent.post(`${base()}/dataset-files/${layout.file.id}/preview`).send({ mapping: layout.mapping }).expect(201);
    const created = await agent
      .post(`${base()}/datasets`)
      .send({ name: 'wide', kind: 'unknowns', fileId: layout.file.id, mapping: layout.mapping })
      .expect(201);
    expect(created.body.versions[0].summary.imported).toBe(2);
    const rows = await rowsOf(created.body.id);
    expect(rows.rows.map((r) => r.sampleId)).toEqual(['W-1', 'W-2']);
    expect(rows.rows[0].cells).toHaveLength(width - 1);
    expect(rows.rows[0].cells[width - 2].ppm).toBe((width - 2) % 97);

    const extra = MAX_MAPPING_COLUMNS + 1 - layout.mapping.columns.length;
    const tooWide = {
      ...layout.mapping,
      columns: [...layout.mapping.columns, ...Array.from({ length: extra }, (_, i) => measured(width + i))],
    };
    const refused = await expectRefusedCleanly(() =>
      agent
        .post(`${base()}/datasets`)
        .send({ name: 'too wide', kind: 'unknowns', fileId: layout.file.id, mapping: tooWide }),
    );
    expect(refused.status).toBe(413);
    expect(refused.body.message).toMatch(/at most 20,000 columns; split the file/);
    await agent.get('/api/health').expect(200);
  }, 120_000);

  it('keeps Unicode and SQL-looking sample ids and names exactly as written', async () => {
    const ids = [
      'Ö-Ämter-1',
      '样品-2',
      '🪨-3',
      'عينة-4',
      'e\u0301-combining-5',
      "'); DROP TABLE dataset_rows; --",
      '1 OR 1=1',
      'Robert\\"; DELETE FROM datasets WHERE true; --',
    ];
    const csvCell = (text: string) => `"${text.replace(/"/g, '""')}"`;
    const text = ['Sample,Zr ppm', ...ids.map((id, i) => `${csvCell(id)},${i + 1}`)].join('\n');
    const name = "Survey'; DROP TABLE datasets; -- 🧪";
    const dataset = await importText(text, name);
    const { rows } = await rowsOf(dataset.id);
    expect(rows.map((row) => row.sampleId)).toEqual(ids);
    const listed = (await agent.get(`${base()}/datasets`).expect(200)).body as { name: string }[];
    expect(listed.map((d) => d.name)).toContain(name);
    const exported = await agent.get(`${base()}/datasets/${dataset.id}/versions/1/export.csv`).expect(200);
    for (const id of ids) expect(exported.text).toContain(id.includes('"') ? id.replace(/"/g, '""') : id);
  });

  it('refuses a NUL byte in a cell (PostgreSQL text cannot hold it) with a 4xx, not a 500', async () => {
    const text = 'Sample,Zr ppm\nN\u0000-1,5\nN-2,6\n';
    const before = await counts();
    const res = await upload(Buffer.from(text), 'nul.csv');
    if (res.status === 201) {
      const layout = res.body as FileLayout;
      const created = await agent
        .post(`${base()}/datasets`)
        .send({ name: 'nul', kind: 'unknowns', fileId: layout.file.id, mapping: layout.mapping });
      expect(created.status).toBeLessThan(500);
      if (created.status !== 201) return;
      const { rows } = await rowsOf(created.body.id);
      expect(rows.map((row) => row.sampleId)).not.toContain('N\u0000-1');
    } else {
      expect(res.status).toBe(422);
      expect(await counts()).toEqual(before);
    }
  });

  it('refuses a mapping that points outside the file, and SQL-looking query parameters, with 400', async () => {
    const layout = (await upload(Buffer.from('Sample,Zr ppm\nM-1,5\n'), 'm.csv').expect(201)).body as FileLayout;
    const mapping = structuredClone(layout.mapping);
    mapping.columns.push({ ...mapping.columns[1], index: 99, header: 'ghost' });
    await expectRefusedCleanly(() =>
      agent.post(`${base()}/datasets`).send({ name: 'ghost', kind: 'unknowns', fileId: layout.file.id, mapping }),
    );
    const dataset = await importText('Sample,Zr ppm\nQ-1,5\n', 'q.csv');
    const page = await agent.get(
      `${base()}/datasets/${dataset.id}/versions/1/rows?page=1;DROP TABLE runs&pageSize=1e9`,
    );
    expect(page.status).toBe(400);
    const notAnId = await agent.get(`${base()}/datasets/1%20OR%201=1`);
    expect(notAnId.status).toBe(400);
  });
});
