import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import type { INestApplicationContext } from '@nestjs/common';
import type { DatasetKind, LabRole, StepKey, StepParameters } from '@provenote/shared';
import { DataSource } from 'typeorm';
import { Lab } from '../accounts/lab.entity';
import { User } from '../accounts/user.entity';
import type { AuthUser, LabMembership } from '../auth/auth.types';
import { DatasetFilesService } from '../datasets/dataset-files.service';
import { DatasetsService } from '../datasets/datasets.service';
import { GroupsService } from '../groups/groups.service';
import { RunAssignmentEntity } from '../runs/run-assignment.entity';
import { RunEntity } from '../runs/run.entity';
import { OverridesService } from '../studies/overrides.service';
import { StepsService } from '../studies/steps.service';
import { StudiesService } from '../studies/studies.service';
import { StudyRunsService } from '../studies/study-runs.service';
import { DEMO_ACCOUNTS, DEMO_LAB_NAME } from './demo-accounts';
import {
  DEMO_ASSIGN,
  DEMO_FILES,
  DEMO_OVERRIDE_REASON,
  DEMO_PREPARE,
  FRESH_STUDY,
  REVIEWED_STUDY,
  SCHIST_INTERVAL,
} from './demo-study-settings';

/** samples/data, from api/src/demo (tests) and api/dist/demo (the built CLI) alike. */
const SAMPLES_DIR = join(__dirname, '..', '..', '..', 'samples', 'data');
const RUN_TIMEOUT_MS = 60_000;

export interface DemoScenarioResult {
  reviewedStudyId: string;
  freshStudyId: string;
  overriddenSampleId: string;
}

interface Actor {
  user: AuthUser;
  membership: LabMembership;
}

/**
 * The Lake Tarn story loaded through the same services the HTTP routes call: the analyst imports both
 * files, builds the groups from the group column, the PI approves them, and the analyst works one study
 * through the group check and the assignment (computed by the run processors of this process, so the
 * study is finished when this returns) and leaves a second one with only its Data card filled.
 */
export async function loadDemoScenario(app: INestApplicationContext): Promise<DemoScenarioResult> {
  const dataSource = app.get(DataSource);
  const lab = await dataSource.getRepository(Lab).findOneByOrFail({ name: DEMO_LAB_NAME });
  const actor = async (role: LabRole): Promise<Actor> => {
    const email = DEMO_ACCOUNTS.find((account) => account.role === role)!.email;
    const user = await dataSource.getRepository(User).findOneByOrFail({ email });
    return {
      user: { id: user.id, email: user.email, displayName: user.displayName },
      membership: { labId: lab.id, role },
    };
  };
  const analyst = await actor('analyst');
  const pi = await actor('pi');

  const importFile = async (kind: DatasetKind) => {
    const { filename, name } = DEMO_FILES[kind];
    const content = await readFile(join(SAMPLES_DIR, filename));
    const layout = await app.get(DatasetFilesService).upload(lab.id, analyst.user.id, filename, content);
    const dataset = await app
      .get(DatasetsService)
      .create(lab.id, analyst.user, 'analyst', { name, kind, fileId: layout.file.id, mapping: layout.mapping });
    return dataset.versions[0].id;
  };
  const referenceVersionId = await importFile('reference');
  const unknownsVersionId = await importFile('unknowns');

  const groups = app.get(GroupsService);
  const { groups: built } = await groups.fromColumn(lab.id, referenceVersionId, analyst.user);
  const groupVersionIds: string[] = [];
  for (const group of built) {
    const latest = group.versions[0];
    await groups.approve(lab.id, group.id, latest.id, pi.user);
    groupVersionIds.push(latest.id);
  }

  const studies = app.get(StudiesService);
  const steps = app.get(StepsService);
  const edit = <K extends StepKey>(studyId: string, key: K, parameters: StepParameters[K]) =>
    steps.edit(lab.id, studyId, key, parameters, analyst.membership, analyst.user);

  const reviewed = await studies.create(lab.id, REVIEWED_STUDY, analyst.user);
  await edit(reviewed.id, 'data', { referenceVersionId, unknownsVersionId });
  await edit(reviewed.id, 'prepare', DEMO_PREPARE);
  await edit(reviewed.id, 'groups', { groupVersionIds });
  await runStep(app, lab.id, reviewed.id, 'check', analyst);
  await edit(reviewed.id, 'assign', DEMO_ASSIGN);
  const assignRunId = await runStep(app, lab.id, reviewed.id, 'assign', analyst);
  const overriddenSampleId = await overrideOneAmbiguous(app, lab.id, reviewed.id, assignRunId, analyst);

  const fresh = await studies.create(lab.id, FRESH_STUDY, analyst.user);
  await edit(fresh.id, 'data', { referenceVersionId, unknownsVersionId });
  return { reviewedStudyId: reviewed.id, freshStudyId: fresh.id, overriddenSampleId };
}

/** Starts a card's run through the queue and waits until this process's workers have finished it. */
async function runStep(
  app: INestApplicationContext,
  labId: string,
  studyId: string,
  key: 'check' | 'assign',
  { user, membership }: Actor,
): Promise<string> {
  const study = await app.get(StudyRunsService).start(labId, studyId, key, membership, user);
  const runId = study.steps.find((step) => step.key === key)?.runId;
  if (!runId) throw new Error(`The demo study's "${key}" card started no run`);
  const runs = app.get(DataSource).getRepository(RunEntity);
  const deadline = Date.now() + RUN_TIMEOUT_MS;
  for (;;) {
    const run = await runs.findOneByOrFail({ id: runId });
    if (run.status === 'succeeded') return runId;
    if (run.status === 'failed' || run.status === 'cancelled') {
      throw new Error(`The demo study's "${key}" run ${run.status}: ${run.error ?? 'no error recorded'}`);
    }
    if (Date.now() > deadline) throw new Error(`The demo study's "${key}" run did not finish in 60 s`);
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}

/**
 * Schist valley and Glacial till overlap on trace elements, so some slices of the schist interval come
 * out ambiguous; the analyst settles the first of them on the core log, with the reason recorded.
 */
async function overrideOneAmbiguous(
  app: INestApplicationContext,
  labId: string,
  studyId: string,
  runId: string,
  { user, membership }: Actor,
): Promise<string> {
  const candidates = await app
    .get(DataSource)
    .getRepository(RunAssignmentEntity)
    .find({ where: { runId, verdict: 'ambiguous' }, order: { ordinal: 'ASC' } });
  const chosen = candidates.find(
    (row) =>
      row.sampleId >= SCHIST_INTERVAL.first &&
      row.sampleId <= SCHIST_INTERVAL.last &&
      [row.groupName, row.runnerUp].includes('Schist valley'),
  );
  if (!chosen) throw new Error('The demo assignment has no slice of 40–100 cm ambiguous with Schist valley');
  await app
    .get(OverridesService)
    .create(
      labId,
      studyId,
      { sampleId: chosen.sampleId, verdict: 'assigned', group: 'Schist valley', reason: DEMO_OVERRIDE_REASON },
      membership,
      user,
    );
  return chosen.sampleId;
}
