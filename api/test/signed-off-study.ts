import { mulberry32, type FileLayout, type Study } from '@provenote/shared';
import type { Agent } from './auth-helpers';
import { waitForRun } from './run-waits';
import type { TestApp } from './test-app';

/*
 * A small synthetic study (an invented scenario: three sediment sources on three elements, seeded),
 * worked through the real notebook routes: data, prepare, groups, group check, assign, one override,
 * and the PI's sign-off.
 */
function syntheticCsv(kind: 'reference' | 'unknowns', seed: number): { csv: string; groups: Record<string, string[]> } {
  const random = mulberry32(seed);
  const centres: Record<string, number[]> = { North: [200, 12, 30], South: [90, 25, 45], East: [140, 8, 70] };
  const groups: Record<string, string[]> = {};
  const lines = [kind === 'reference' ? 'Sample,Group,Zr ppm,Nb ppm,La ppm' : 'Sample,Zr ppm,Nb ppm,La ppm'];
  for (const [group, centre] of Object.entries(centres)) {
    groups[group] = [];
    for (let i = 1; i <= (kind === 'reference' ? 12 : 3); i++) {
      const id = `${kind === 'reference' ? group[0] : 'U'}${group[0]}${i}`;
      groups[group].push(id);
      const values = centre.map((c) => (c * Math.exp(0.12 * random.normal())).toFixed(3));
      lines.push([id, ...(kind === 'reference' ? [group] : []), ...values].join(','));
    }
  }
  return { csv: `${lines.join('\n')}\n`, groups };
}

export const OVERRIDE_REASON = 'Field notes place this sample below the South outlet';

async function importCsv(agent: Agent, base: string, name: string, kind: 'reference' | 'unknowns', csv: string) {
  const layout: FileLayout = (
    await agent.post(`${base}/dataset-files`).attach('file', Buffer.from(csv), name).expect(201)
  ).body;
  const res = await agent
    .post(`${base}/datasets`)
    .send({ name, kind, fileId: layout.file.id, mapping: layout.mapping })
    .expect(201);
  return res.body.versions[0].id as string;
}

/** The study id and its assign run, after the analyst ran every card and the PI signed it off. */
export async function signedOffStudy(
  testApp: TestApp,
  labId: string,
  analyst: Agent,
  pi: Agent,
): Promise<{ studyId: string; assignRunId: string }> {
  const base = `/api/labs/${labId}`;
  const reference = syntheticCsv('reference', 20250601);
  const referenceVersionId = await importCsv(analyst, base, 'reference.csv', 'reference', reference.csv);
  const unknownsVersionId = await importCsv(analyst, base, 'unknowns.csv', 'unknowns', syntheticCsv('unknowns', 9).csv);
  const groupVersionIds: string[] = [];
  for (const [name, memberIds] of Object.entries(reference.groups)) {
    const res = await analyst
      .post(`${base}/groups`)
      .send({ name, datasetVersionId: referenceVersionId, memberIds })
      .expect(201);
    groupVersionIds.push(res.body.versions[0].id);
  }
  const study: Study = (
    await analyst
      .post(`${base}/studies`)
      .send({ name: 'Synthetic sediment sources', description: 'Synthetic.' })
      .expect(201)
  ).body;
  const steps = `${base}/studies/${study.id}/steps`;
  await analyst.put(`${steps}/data`).send({ parameters: { referenceVersionId, unknownsVersionId } }).expect(200);
  await analyst
    .put(`${steps}/prepare`)
    .send({
      parameters: {
        elements: ['Zr', 'Nb', 'La'],
        transform: 'ln',
        alrDenominator: null,
        belowDetection: 'dl-half',
        covariance: 'classic',
        seed: 5,
      },
    })
    .expect(200);
  await analyst.put(`${steps}/groups`).send({ parameters: { groupVersionIds } }).expect(200);
  const checking: Study = (await analyst.post(`${steps}/check/run`).expect(201)).body;
  await waitForRun(testApp, checking.steps.find((s) => s.key === 'check')!.runId!, (r) => r.status === 'succeeded');
  const assigning: Study = (await analyst.post(`${steps}/assign/run`).expect(201)).body;
  const assignRunId = assigning.steps.find((s) => s.key === 'assign')!.runId!;
  await waitForRun(testApp, assignRunId, (r) => r.status === 'succeeded');
  await analyst
    .post(`${base}/studies/${study.id}/overrides`)
    .send({ sampleId: 'UN1', verdict: 'unassigned', group: null, reason: OVERRIDE_REASON })
    .expect(201);
  await pi.post(`${base}/studies/${study.id}/sign-off`).send({}).expect(201);
  return { studyId: study.id, assignRunId };
}
