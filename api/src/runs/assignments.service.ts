import { Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource } from 'typeorm';
import { type AssignmentsPage, type AssignmentsQuery } from '@provenote/shared';
import { RunsService } from './runs.service';

/** Sort keys of the query string → indexed columns (each index ends in ordinal, the tie-break). */
const SORT_COLUMNS: Record<AssignmentsQuery['sort'], string> = {
  input: 'a.ordinal',
  sampleId: 'a.sample_id',
  verdict: 'a.verdict',
  group: 'a.group_name',
  probability: 'a.probability',
  runnerUpProbability: 'a.runner_up_probability',
};

interface AssignmentRowSql {
  sample_id: string;
  verdict: AssignmentsPage['rows'][number]['verdict'];
  group_name: string;
  probability: number;
  runner_up: string | null;
  runner_up_probability: number | null;
  d2: number[];
  p_chi2: number[];
  p_hotelling: number[];
  contributions: number[];
  override_verdict: AssignmentsPage['rows'][number]['verdict'] | null;
  override_group: string | null;
  override_reason: string | null;
}

/** The run's overrides are a handful of rows beside up to 100,000 assignments: one left join per page. */
const FROM = `run_assignments a
  LEFT JOIN study_overrides o ON o.run_id = a.run_id AND o.sample_id = a.sample_id`;

const escapeLike = (text: string) => text.replace(/[\\%_]/g, (c) => `\\${c}`);

/** Pages of a classification run's results, sorted and filtered in the database. */
@Injectable()
export class AssignmentsService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly runs: RunsService,
  ) {}

  async page(labId: string, runId: string, query: AssignmentsQuery): Promise<AssignmentsPage> {
    await this.runs.get(labId, runId);
    const where = ['a.run_id = $1'];
    const values: unknown[] = [runId];
    if (query.verdict) where.push(`a.verdict = $${values.push(query.verdict)}`);
    if (query.finalVerdict) where.push(`COALESCE(o.verdict, a.verdict) = $${values.push(query.finalVerdict)}`);
    if (query.group) where.push(`a.group_name = $${values.push(query.group)}`);
    if (query.search) where.push(`a.sample_id LIKE $${values.push(`${escapeLike(query.search)}%`)}`);
    const direction = query.order === 'desc' ? 'DESC' : 'ASC';
    const sort = SORT_COLUMNS[query.sort];
    // Only the runner-up probability can be null. A NULLS clause on the other (NOT NULL) columns would not
    // change the order, but it keeps PostgreSQL from reading the indexes in order, so it sorts every match.
    const nulls = sort !== 'a.runner_up_probability' ? '' : direction === 'DESC' ? ' NULLS LAST' : ' NULLS FIRST';
    const orderBy =
      sort === 'a.ordinal' ? `a.ordinal ${direction}` : `${sort} ${direction}${nulls}, a.ordinal ${direction}`;
    const offset = (query.page - 1) * query.pageSize;
    const [rows, [{ total }], groups] = await Promise.all([
      this.dataSource.query(
        `SELECT a.sample_id, a.verdict, a.group_name, a.probability, a.runner_up, a.runner_up_probability, a.d2,
           a.p_chi2, a.p_hotelling, a.contributions, o.verdict AS override_verdict, o.group_name AS override_group,
           o.reason AS override_reason
         FROM ${FROM} WHERE ${where.join(' AND ')} ORDER BY ${orderBy}
         LIMIT ${query.pageSize} OFFSET ${offset}`,
        values,
      ) as Promise<AssignmentRowSql[]>,
      this.dataSource.query(
        `SELECT count(*)::int AS total FROM ${FROM} WHERE ${where.join(' AND ')}`,
        values,
      ) as Promise<{ total: number }[]>,
      this.dataSource.query(
        `SELECT name, n, effective_n, variables FROM run_groups WHERE run_id = $1 ORDER BY group_index`,
        [runId],
      ) as Promise<{ name: string; n: number; effective_n: number; variables: string[] }[]>,
    ]);
    return {
      total,
      page: query.page,
      pageSize: query.pageSize,
      groups: groups.map((g) => ({ name: g.name, n: g.n, effectiveN: g.effective_n })),
      variables: groups[0]?.variables ?? [],
      rows: rows.map((row) => ({
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
        override:
          row.override_verdict === null
            ? null
            : { verdict: row.override_verdict, group: row.override_group, reason: row.override_reason ?? '' },
      })),
    };
  }
}
