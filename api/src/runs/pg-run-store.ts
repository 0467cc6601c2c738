import { Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource, type EntityManager } from 'typeorm';
import { assignmentParametersSchema, type RunEvent } from '@provenote/shared';
import type {
  ClaimedRun,
  ClassifyResults,
  GroupCheckResults,
  RunStore,
  SampleRole,
  StoredSamples,
} from '@provenote/workers';
import { insertAssignments, rowSlices } from './insert-assignments';
import { RUN_EVENT_COLUMNS, type RunEventRow, toRunEvent } from './run-event.mapper';

type Returned = [RunEventRow[], number];

/** UPDATE … RETURNING answers [rows, count] through TypeORM's query(). */
const firstEvent = (result: Returned): RunEvent | null => (result[0][0] ? toRunEvent(result[0][0]) : null);

/**
 * The workers' view of runs in PostgreSQL. Results are written with the run's final status in one
 * transaction that first deletes whatever an earlier attempt left, so a retry never duplicates rows and
 * a crash never leaves half a result set.
 */
@Injectable()
export class PgRunStore implements RunStore {
  constructor(@InjectDataSource() private readonly dataSource: DataSource) {}

  async claim(runId: string): Promise<ClaimedRun | null> {
    const [rows] = (await this.dataSource.query(
      `UPDATE runs SET status = 'running', attempt = attempt + 1, progress = 0, phase = 'starting',
         started_at = COALESCE(started_at, now()), updated_at = now()
       WHERE id = $1 AND status IN ('queued', 'running')
       RETURNING id, lab_id, kind, parameters, seed, attempt`,
      [runId],
    )) as [
      {
        id: string;
        lab_id: string;
        kind: ClaimedRun['kind'];
        parameters: unknown;
        seed: number | null;
        attempt: number;
      }[],
      number,
    ];
    const row = rows[0];
    if (!row) return null;
    return {
      id: row.id,
      labId: row.lab_id,
      kind: row.kind,
      parameters: assignmentParametersSchema.parse(row.parameters),
      seed: row.seed,
      attempt: row.attempt,
    };
  }

  async loadSamples(runId: string, role: SampleRole): Promise<StoredSamples> {
    const rows = (await this.dataSource.query(
      `SELECT sample_id, group_label, values, below_detection FROM run_inputs
       WHERE run_id = $1 AND role = $2 ORDER BY ordinal`,
      [runId, role],
    )) as { sample_id: string; group_label: string | null; values: number[]; below_detection: boolean[] }[];
    return {
      sampleIds: rows.map((row) => row.sample_id),
      groups: rows.map((row) => row.group_label),
      values: rows.map((row) => row.values),
      belowDetection: rows.map((row) => row.below_detection),
    };
  }

  async saveProgress(runId: string, progress: number, phase: string): Promise<RunEvent | null> {
    return firstEvent(
      await this.dataSource.query(
        `UPDATE runs SET progress = $2, phase = $3, updated_at = now() WHERE id = $1 AND status = 'running'
         RETURNING ${RUN_EVENT_COLUMNS}`,
        [runId, progress, phase],
      ),
    );
  }

  saveClassifyResults(runId: string, results: ClassifyResults): Promise<RunEvent | null> {
    return this.finishWithResults(runId, { variables: results.variables }, async (manager) => {
      await this.insertGroups(manager, runId, results.groups, results.variables);
      for (const [from, to] of rowSlices(results.sampleIds.length)) {
        await insertAssignments(manager, runId, results, from, to);
      }
      for (const [method, data] of Object.entries(results.projections)) {
        await manager.query(`INSERT INTO run_projections (run_id, method, data) VALUES ($1, $2, $3::jsonb)`, [
          runId,
          method,
          JSON.stringify(data),
        ]);
      }
    });
  }

  saveGroupCheckResults(runId: string, results: GroupCheckResults): Promise<RunEvent | null> {
    return this.finishWithResults(runId, { variables: results.variables, ...results.summary }, async (manager) => {
      await this.insertGroups(manager, runId, results.groups, results.variables);
      const m = results.members;
      await manager.query(
        `INSERT INTO run_check_members (run_id, ordinal, sample_id, group_name, d2, d2_loo, p_chi2_loo,
           p_hotelling_loo, outcome, best_group, robust_d2, robust_outlier)
         SELECT $1, * FROM unnest($2::int[], $3::text[], $4::text[], $5::float8[], $6::float8[], $7::float8[],
           $8::float8[], $9::text[], $10::text[], $11::float8[], $12::bool[])`,
        [
          runId,
          Array.from(m.ordinals),
          m.sampleIds,
          m.groups,
          Array.from(m.d2),
          Array.from(m.d2LeaveOneOut),
          Array.from(m.pChi2LeaveOneOut),
          Array.from(m.pHotellingLeaveOneOut),
          m.outcomes,
          m.bestGroups,
          m.robustD2,
          m.robustFlagged,
        ],
      );
      const pairs = results.pairs;
      await manager.query(
        `INSERT INTO run_check_pairs (run_id, group_a, group_b, t2, f, df1, df2, p)
         SELECT $1, * FROM unnest($2::text[], $3::text[], $4::float8[], $5::float8[], $6::int[], $7::int[], $8::float8[])`,
        [
          runId,
          pairs.map((x) => x.groupA),
          pairs.map((x) => x.groupB),
          pairs.map((x) => x.t2),
          pairs.map((x) => x.f),
          pairs.map((x) => x.df1),
          pairs.map((x) => x.df2),
          pairs.map((x) => x.p),
        ],
      );
    });
  }

  async requeue(runId: string, reason: string): Promise<RunEvent | null> {
    return this.setStatus(runId, `status = 'queued', error = $2, phase = 'waiting to retry'`, ['running'], [reason]);
  }

  async markFailed(runId: string, reason: string): Promise<RunEvent | null> {
    return this.setStatus(
      runId,
      `status = 'failed', error = $2, phase = 'failed', finished_at = now()`,
      ['queued', 'running'],
      [reason],
    );
  }

  async markCancelled(runId: string): Promise<RunEvent | null> {
    return this.setStatus(
      runId,
      `status = 'cancelled', phase = 'cancelled', finished_at = now()`,
      ['queued', 'running'],
      [],
    );
  }

  private async setStatus(
    runId: string,
    assignments: string,
    from: string[],
    values: unknown[],
  ): Promise<RunEvent | null> {
    const fromList = from.map((status) => `'${status}'`).join(', ');
    return firstEvent(
      await this.dataSource.query(
        `UPDATE runs SET ${assignments}, updated_at = now() WHERE id = $1 AND status IN (${fromList})
         RETURNING ${RUN_EVENT_COLUMNS}`,
        [runId, ...values],
      ),
    );
  }

  private async insertGroups(
    manager: EntityManager,
    runId: string,
    groups: ClassifyResults['groups'],
    variables: string[],
  ) {
    await manager.query(
      `INSERT INTO run_groups (run_id, group_index, name, n, effective_n, variables)
       SELECT $1, t.ordinality - 1, t.name, t.n, t.effective_n, $5::text[]
       FROM unnest($2::text[], $3::int[], $4::int[]) WITH ORDINALITY AS t(name, n, effective_n, ordinality)`,
      [runId, groups.map((x) => x.name), groups.map((x) => x.n), groups.map((x) => x.effectiveN), variables],
    );
  }

  /**
   * Locks the run, gives up if it is no longer running (cancelled meanwhile, or finished by a worker
   * that was thought dead), replaces every result row and marks the run succeeded — all or nothing.
   */
  private finishWithResults(
    runId: string,
    summary: Record<string, unknown>,
    write: (manager: EntityManager) => Promise<void>,
  ): Promise<RunEvent | null> {
    return this.dataSource.transaction(async (manager) => {
      const locked = (await manager.query(`SELECT status FROM runs WHERE id = $1 FOR UPDATE`, [runId])) as {
        status: string;
      }[];
      if (locked[0]?.status !== 'running') return null;
      for (const table of [
        'run_assignments',
        'run_check_members',
        'run_check_pairs',
        'run_groups',
        'run_projections',
      ]) {
        await manager.query(`DELETE FROM ${table} WHERE run_id = $1`, [runId]);
      }
      await write(manager);
      return firstEvent(
        await manager.query(
          `UPDATE runs SET status = 'succeeded', progress = 1, phase = 'done', error = NULL, summary = $2,
             finished_at = now(), updated_at = now()
           WHERE id = $1 RETURNING ${RUN_EVENT_COLUMNS}`,
          [runId, JSON.stringify(summary)],
        ),
      );
    });
  }
}
