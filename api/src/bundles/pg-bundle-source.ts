import { createHash } from 'node:crypto';
import { Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource, type EntityManager } from 'typeorm';
import {
  assignmentParametersSchema,
  DEFAULT_MCD_SEED,
  EngineError,
  type AssignmentVerdict,
  type BundleManifest,
  type ProjectionMethod,
  type RunEvent,
  type StoredProjection,
} from '@provenote/shared';
import type { BundleSource, BundleSources, StoredAssignment } from '@provenote/workers';
import { APP_VERSION } from '../version';
import { PgRunStore } from '../runs/pg-run-store';
import { RUN_EVENT_COLUMNS, type RunEventRow, toRunEvent } from '../runs/run-event.mapper';

interface BundleRunRow {
  run_id: string;
  created_at: Date;
  created_by: string | null;
  creator_name: string | null;
  lab_id: string;
  lab_name: string;
  study_id: string;
  study_name: string;
  study_description: string;
  source_run_id: string;
  signed_off_at: Date | null;
  signed_off_by: string | null;
  signer_name: string | null;
  sign_off_statement: string | null;
}

interface StepRow {
  key: string;
  parameters: Record<string, unknown> | null;
  run_id: string | null;
}

/** Stands in for a person whose account was deleted (their id is set to null with it). */
const FORMER_MEMBER = 'a former member';

/**
 * A missing piece of a signed-off study. Retrying cannot bring it back, and the run worker fails an
 * EngineError at once instead of retrying, hence the base class.
 */
export class BundleSourceError extends EngineError {}

/** The bundle job's reads and its one write, in PostgreSQL. */
@Injectable()
export class PgBundleSource implements BundleSource {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly runs: PgRunStore,
  ) {}

  async load(bundleRunId: string): Promise<BundleSources> {
    const db = this.dataSource.manager;
    const [head] = (await db.query(
      `SELECT b.run_id, r.created_at, r.created_by, u.display_name AS creator_name, l.id AS lab_id,
         l.name AS lab_name, s.id AS study_id, s.name AS study_name, s.description AS study_description,
         b.source_run_id, s.signed_off_at, s.signed_off_by, su.display_name AS signer_name, s.sign_off_statement
       FROM bundles b JOIN runs r ON r.id = b.run_id JOIN labs l ON l.id = b.lab_id
         JOIN studies s ON s.id = b.study_id LEFT JOIN users u ON u.id = r.created_by
         LEFT JOIN users su ON su.id = s.signed_off_by
       WHERE b.run_id = $1`,
      [bundleRunId],
    )) as BundleRunRow[];
    if (!head) throw new BundleSourceError(`run ${bundleRunId} has no bundle record`);
    if (!head.signed_off_at) throw new BundleSourceError('the study has not been signed off');
    const [assign] = (await db.query(`SELECT parameters, seed FROM runs WHERE id = $1 AND status = 'succeeded'`, [
      head.source_run_id,
    ])) as { parameters: unknown; seed: number | null }[];
    if (!assign) throw new BundleSourceError('the assign run of the study has no results');
    const steps = (await db.query(`SELECT key, parameters, run_id FROM study_steps WHERE study_id = $1`, [
      head.study_id,
    ])) as StepRow[];
    const step = (key: string) => steps.find((s) => s.key === key);
    const checkRunId = step('check')?.run_id;
    if (!checkRunId) throw new BundleSourceError('the study has no group check run');

    const { groups, variables, assignments } = await this.assignments(db, head.source_run_id);
    return {
      provenoteVersion: APP_VERSION,
      createdAt: head.created_at.toISOString(),
      createdBy: { id: head.created_by, name: head.creator_name ?? FORMER_MEMBER },
      lab: { id: head.lab_id, name: head.lab_name },
      study: { id: head.study_id, title: head.study_name, description: head.study_description },
      assignRunId: head.source_run_id,
      signOff: {
        by: { id: head.signed_off_by, name: head.signer_name ?? FORMER_MEMBER },
        at: head.signed_off_at.toISOString(),
        statement: head.sign_off_statement ?? '',
      },
      parameters: assignmentParametersSchema.parse(assign.parameters),
      seed: assign.seed ?? DEFAULT_MCD_SEED,
      rawFiles: await this.rawFiles(db, step('data')?.parameters ?? {}),
      reference: await this.runs.loadSamples(head.source_run_id, 'reference'),
      unknowns: await this.runs.loadSamples(head.source_run_id, 'unknown'),
      groupVersions: await this.groupVersions(db, step('groups')?.parameters ?? {}),
      groups,
      variables,
      assignments,
      overrides: await this.overrides(db, head.study_id, head.source_run_id),
      ...(await this.check(db, checkRunId)),
      projections: await this.projections(db, head.source_run_id),
    };
  }

  async save(bundleRunId: string, zip: Buffer, manifest: BundleManifest): Promise<RunEvent | null> {
    return this.dataSource.transaction(async (manager) => {
      const locked = (await manager.query(`SELECT status FROM runs WHERE id = $1 FOR UPDATE`, [bundleRunId])) as {
        status: string;
      }[];
      if (locked[0]?.status !== 'running') return null;
      const sha256 = createHash('sha256').update(zip).digest('hex');
      await manager.query(
        `UPDATE bundles SET content = $2, size_bytes = $3, sha256 = $4, manifest = $5 WHERE run_id = $1`,
        [bundleRunId, zip, zip.byteLength, sha256, JSON.stringify(manifest)],
      );
      const [rows] = (await manager.query(
        `UPDATE runs SET status = 'succeeded', progress = 1, phase = 'done', error = NULL, finished_at = now(),
           updated_at = now()
         WHERE id = $1 RETURNING ${RUN_EVENT_COLUMNS}`,
        [bundleRunId],
      )) as [RunEventRow[], number];
      return rows[0] ? toRunEvent(rows[0]) : null;
    });
  }

  private async overrides(db: EntityManager, studyId: string, runId: string) {
    const rows = (await db.query(
      `SELECT o.sample_id, o.verdict, o.group_name, o.reason, o.created_at, u.display_name AS author
       FROM study_overrides o LEFT JOIN users u ON u.id = o.created_by
       WHERE o.study_id = $1 AND o.run_id = $2`,
      [studyId, runId],
    )) as {
      sample_id: string;
      verdict: AssignmentVerdict;
      group_name: string | null;
      reason: string;
      created_at: Date;
      author: string | null;
    }[];
    return rows.map((row) => ({
      sampleId: row.sample_id,
      verdict: row.verdict,
      group: row.group_name,
      reason: row.reason,
      by: row.author ?? FORMER_MEMBER,
      at: row.created_at.toISOString(),
    }));
  }

  private async rawFiles(db: EntityManager, data: Record<string, unknown>) {
    const versionIds = [data.referenceVersionId, data.unknownsVersionId].filter(
      (id): id is string => typeof id === 'string',
    );
    const files = (await db.query(
      `SELECT f.filename, f.content FROM dataset_versions v JOIN dataset_files f ON f.id = v.file_id
       WHERE v.id = ANY($1::uuid[]) ORDER BY array_position($1::uuid[], v.id)`,
      [versionIds],
    )) as { filename: string; content: Buffer }[];
    return files.map((file) => ({ name: file.filename, bytes: new Uint8Array(file.content) }));
  }

  private async groupVersions(db: EntityManager, groups: Record<string, unknown>) {
    const ids = Array.isArray(groups.groupVersionIds) ? groups.groupVersionIds : [];
    const rows = (await db.query(
      `SELECT g.name, v.number FROM reference_group_versions v JOIN reference_groups g ON g.id = v.group_id
       WHERE v.id = ANY($1::uuid[])`,
      [ids],
    )) as { name: string; number: number }[];
    return new Map(rows.map((row) => [row.name, row.number]));
  }

  private async assignments(db: EntityManager, runId: string) {
    const groupRows = (await db.query(`SELECT name, variables FROM run_groups WHERE run_id = $1 ORDER BY group_index`, [
      runId,
    ])) as { name: string; variables: string[] }[];
    const groups = groupRows.map((row) => row.name);
    const rows = (await db.query(
      `SELECT sample_id, verdict, group_name, probability, runner_up, runner_up_probability, d2, p_chi2, p_hotelling,
         contributions
       FROM run_assignments WHERE run_id = $1 ORDER BY ordinal`,
      [runId],
    )) as {
      sample_id: string;
      verdict: AssignmentVerdict;
      group_name: string;
      probability: number;
      runner_up: string | null;
      runner_up_probability: number | null;
      d2: number[];
      p_chi2: number[];
      p_hotelling: number[];
      contributions: number[];
    }[];
    const assignments = rows.map((row): StoredAssignment => ({
      sampleId: row.sample_id,
      verdict: row.verdict,
      group: row.group_name,
      probability: row.probability,
      runnerUp: row.runner_up,
      runnerUpProbability: row.runner_up_probability,
      d2: row.d2,
      pChi2: row.p_chi2,
      pHotelling: row.p_hotelling,
      contributions: row.contributions,
    }));
    return { groups, variables: groupRows[0]?.variables ?? [], assignments };
  }

  private async projections(db: EntityManager, runId: string) {
    const rows = (await db.query(`SELECT method, data FROM run_projections WHERE run_id = $1`, [runId])) as {
      method: ProjectionMethod;
      data: StoredProjection;
    }[];
    return Object.fromEntries(rows.map((row) => [row.method, row.data])) as Partial<
      Record<ProjectionMethod, StoredProjection>
    >;
  }

  private async check(db: EntityManager, runId: string) {
    const members = (await db.query(
      `SELECT sample_id, group_name, d2, d2_loo, p_hotelling_loo, outcome FROM run_check_members
       WHERE run_id = $1 ORDER BY ordinal`,
      [runId],
    )) as {
      sample_id: string;
      group_name: string;
      d2: number;
      d2_loo: number;
      p_hotelling_loo: number;
      outcome: string;
    }[];
    const pairs = (await db.query(
      `SELECT group_a, group_b, t2, f, df1, df2, p FROM run_check_pairs WHERE run_id = $1 ORDER BY group_a, group_b`,
      [runId],
    )) as { group_a: string; group_b: string; t2: number; f: number; df1: number; df2: number; p: number }[];
    return {
      members: members.map((m) => ({
        sampleId: m.sample_id,
        group: m.group_name,
        d2: m.d2,
        d2Loo: m.d2_loo,
        pHotellingLoo: m.p_hotelling_loo,
        verdictLoo: m.outcome,
      })),
      separation: pairs.map((p) => ({
        groupA: p.group_a,
        groupB: p.group_b,
        t2: p.t2,
        f: p.f,
        df1: p.df1,
        df2: p.df2,
        p: p.p,
      })),
    };
  }
}
