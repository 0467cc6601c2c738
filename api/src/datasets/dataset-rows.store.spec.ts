import { DataSource } from 'typeorm';
import type { FileLayout } from '@provenote/shared';
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

  it('stores ids, raw text and attributes with tabs, line breaks, backslashes, quotes and braces unchanged', async () => {
    const lines = ['sample,Zr,Nb,note'];
    AWKWARD.forEach((text, i) =>
      lines.push([csvCell(`S${i} ${text}`), '12.5', csvCell(`x${text}`), csvCell(text)].join(',')),
    );
    const base = `/api/labs/${labId}`;
    const layout: FileLayout = (
      await analyst.agent
        .post(`${base}/dataset-files`)
        .attach('file', Buffer.from(lines.join('\r\n')), 'awkward.csv')
        .expect(201)
    ).body;
    const dataset = (
      await analyst.agent
        .post(`${base}/datasets`)
        .send({ name: 'awkward', kind: 'unknowns', fileId: layout.file.id, mapping: layout.mapping })
        .expect(201)
    ).body;
    const rows: { sample_id: string; ppm: (number | null)[]; raw: (string | null)[]; attributes: unknown }[] =
      await testApp.app
        .get(DataSource)
        .query(`SELECT sample_id, ppm, raw, attributes FROM dataset_rows WHERE version_id = $1 ORDER BY position`, [
          dataset.versions[0].id,
        ]);
    expect(rows.map((row) => row.sample_id)).toEqual(AWKWARD.map((text, i) => `S${i} ${text}`.trim()));
    expect(rows.map((row) => row.raw)).toEqual(AWKWARD.map((text) => [null, `x${text}`]));
    expect(rows.map((row) => row.ppm[0])).toEqual(AWKWARD.map(() => 12.5));
    // The importer keeps no attributes for a row whose extra cells are all empty.
    expect(rows.map((row) => row.attributes)).toEqual(AWKWARD.map((text) => (text === '' ? null : { note: text })));
  });
});
