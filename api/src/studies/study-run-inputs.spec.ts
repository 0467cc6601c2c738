import { DataSource } from 'typeorm';
import type { FileLayout, Study } from '@provenote/shared';
import { mulberry32 } from '@provenote/shared';
import { createLabWithMembers, type Agent } from '../../test/auth-helpers';
import { waitForRun } from '../../test/run-waits';
import { createTestApp, type TestApp } from '../../test/test-app';

const CENTRES: Record<string, number[]> = { North: [200, 12, 30], South: [90, 25, 45], East: [140, 8, 70] };

/** Synthetic, seeded reference file: three groups with distinct log-normal centres on Zr, Nb, La. */
function referenceCsv(): { csv: string; groups: Record<string, string[]> } {
  const random = mulberry32(11);
  const lines = ['Sample,Group,Zr ppm,Nb ppm,La ppm'];
  const groups: Record<string, string[]> = {};
  for (const [group, centre] of Object.entries(CENTRES)) {
    groups[group] = Array.from({ length: 14 }, (_, i) => `${group[0]}${i + 1}`);
    for (const id of groups[group]) {
      lines.push([id, group, ...centre.map((c) => (c * Math.exp(0.12 * random.normal())).toFixed(3))].join(','));
    }
  }
  return { csv: `${lines.join('\n')}\n`, groups };
}

describe('the assign card snapshots its unknowns inside PostgreSQL', () => {
  let testApp: TestApp;
  let labId: string;
  let agent: Agent;
  let referenceVersionId: string;
  let groupVersionIds: string[];
  const base = () => `/api/labs/${labId}`;

  async function importCsv(name: string, kind: 'reference' | 'unknowns', csv: string): Promise<string> {
    const layout: FileLayout = (
      await agent.post(`${base()}/dataset-files`).attach('file', Buffer.from(csv), name).expect(201)
    ).body;
    const res = await agent
      .post(`${base()}/datasets`)
      .send({ name, kind, fileId: layout.file.id, mapping: layout.mapping })
      .expect(201);
    return res.body.versions[0].id;
  }

  /** A study on the three groups with the unknowns given, La and Zr chosen (not the file's column order). */
  async function checkedStudy(name: string, unknownsVersionId: string) {
    const study: Study = (await agent.post(`${base()}/studies`).send({ name }).expect(201)).body;
    const steps = `${base()}/studies/${study.id}/steps`;
    await agent.put(`${steps}/data`).send({ parameters: { referenceVersionId, unknownsVersionId } }).expect(200);
    await agent
      .put(`${steps}/prepare`)
      .send({
        parameters: {
          elements: ['La', 'Zr'],
          transform: 'ln',
          alrDenominator: null,
          belowDetection: 'dl-half',
          covariance: 'classic',
          seed: 3,
        },
      })
      .expect(200);
    await agent.put(`${steps}/groups`).send({ parameters: { groupVersionIds } }).expect(200);
    const checking: Study = (await agent.post(`${steps}/check/run`).expect(201)).body;
    await waitForRun(testApp, checking.steps.find((s) => s.key === 'check')!.runId!, (r) => r.status === 'succeeded');
    return steps;
  }

  beforeAll(async () => {
    testApp = await createTestApp();
    let members;
    ({ labId, members } = await createLabWithMembers(testApp, ['analyst'] as const));
    agent = members.analyst.agent;
    const reference = referenceCsv();
    referenceVersionId = await importCsv('reference.csv', 'reference', reference.csv);
    groupVersionIds = [];
    for (const [name, memberIds] of Object.entries(reference.groups)) {
      const res = await agent
        .post(`${base()}/groups`)
        .send({ name, datasetVersionId: referenceVersionId, memberIds })
        .expect(201);
      groupVersionIds.push(res.body.versions[0].id);
    }
  });
  afterAll(() => testApp.close());

  it('copies every unknown in file order with the chosen elements in card order and below-limit flags', async () => {
    const unknowns = [
      ['U1', '150.5', '10', '<0.5'],
      ['U2', '95.25', '22', '41'],
      ['U3', '<3', '7.5', '66.125'],
    ];
    const csv = `Sample,Zr ppm,Nb ppm,La ppm\n${unknowns.map((u) => u.join(',')).join('\n')}\n`;
    const steps = await checkedStudy('order and flags', await importCsv('unknowns.csv', 'unknowns', csv));
    const assigning: Study = (await agent.post(`${steps}/assign/run`).expect(201)).body;
    const runId = assigning.steps.find((s) => s.key === 'assign')!.runId!;
    await waitForRun(testApp, runId, (r) => r.status === 'succeeded');

    const stored: {
      ordinal: number;
      sample_id: string;
      group_label: null;
      values: number[];
      below_detection: boolean[];
    }[] = await testApp.app.get(DataSource).query(
      `SELECT ordinal, sample_id, group_label, values, below_detection FROM run_inputs
           WHERE run_id = $1 AND role = 'unknown' ORDER BY ordinal`,
      [runId],
    );
    // La is the file's fourth column and Zr its second; a "<x" cell keeps its limit x and is flagged.
    const cell = (text: string) => Number(text.replace('<', ''));
    expect(stored).toEqual(
      unknowns.map(([id, zr, , la], ordinal) => ({
        ordinal,
        sample_id: id,
        group_label: null,
        values: [cell(la), cell(zr)],
        below_detection: [la.startsWith('<'), zr.startsWith('<')],
      })),
    );
    const page = await agent.get(`${base()}/runs/${runId}/assignments`).expect(200);
    expect(page.body.total).toBe(unknowns.length);
  });

  it('refuses unknowns without a number in a chosen element, naming the first few and counting the rest', async () => {
    const rows = Array.from({ length: 8 }, (_, i) => `V${i + 1},${100 + i},9,${i % 4 === 3 ? '50' : 'n.d.'}`);
    const steps = await checkedStudy(
      'unusable unknowns',
      await importCsv('gaps.csv', 'unknowns', `Sample,Zr ppm,Nb ppm,La ppm\n${rows.join('\n')}\n`),
    );
    const refused = await agent.post(`${steps}/assign/run`).expect(400);
    expect(refused.body.message).toBe(
      'Some unknown samples cannot be used with the chosen elements: ' +
        ['V1', 'V2', 'V3', 'V5', 'V6'].map((id) => `${id} has no value for La (not determined)`).join('; ') +
        ' and 1 more. Choose other elements or exclude the samples.',
    );
    const runs: { n: number }[] = await testApp.app
      .get(DataSource)
      .query(`SELECT count(*)::int AS n FROM runs WHERE kind = 'classify'`);
    expect(runs[0].n).toBe(1);
  });
});
