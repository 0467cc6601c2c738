import { Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource } from 'typeorm';
import { type AssignmentsPage, type AssignmentsQuery } from '@provenote/shared';
import { RunsService } from './runs.service';

/** Sort keys of the query string → indexed columns (each index ends in ordinal, the tie-break). */
const SORT_COLUMNS: Record<AssignmentsQuery['sort'], string> = {
  input: 'ordinal',
  sampleId: 'sample_id',
  verdict: 'verdict',
  group: 'group_name',
  probability: 'probability',
  runnerUpProbability: 'runner_up_probability',
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
}

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
    const where = ['run_id = $1'];
    const values: unknown[] = [runId];
    if (query.verdict) where.push(`verdict = $${values.push(query.verdict)}`);
    if (query.group) where.push(`group_name = $${values.push(query.group)}`);
    if (query.search) where.push(`sample_id LIKE $${values.push(`${escapeLike(query.search)}%`)}`);
    const direction = query.order === 'desc' ? 'DESC' : 'ASC';
    const sort = SORT_COLUMNS[query.sort];
    // Only the runner-up probability can be null. A NULLS clause on the other (NOT NULL) columns would not
    // change the order, but it keeps PostgreSQL from reading the indexes in order, so it sorts every match.
    const nulls = sort !== 'runner_up_probability' ? '' : direction === 'DESC' ? ' NULLS LAST' : ' NULLS FIRST';
    const orderBy = sort === 'ordinal' ? `ordinal ${direction}` : `${sort} ${direction}${nulls}, ordinal ${direction}`;
    const offset = (query.page - 1) * query.pageSize;
    const [rows, [{ total }], groups] = await Promise.all([
      this.dataSource.query(
        `SELECT sample_id, verdict, group_name, probability, runner_up, runner_up_probability, d2, p_chi2,
           p_hotelling, contributions
         FROM run_assignments WHERE ${where.join(' AND ')} ORDER BY ${orderBy}
         LIMIT ${query.pageSize} OFFSET ${offset}`,
        values,
      ) as Promise<AssignmentRowSql[]>,
      this.dataSource.query(
        `SELECT count(*)::int AS total FROM run_assignments WHERE ${where.join(' AND ')}`,
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
      })),
    };
  }
}
