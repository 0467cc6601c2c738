import { Injectable, NotFoundException } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource } from 'typeorm';
import { PROBABILITY_MAP_ROW_LIMIT, type AssignmentVerdict, type ProbabilityMap } from '@provenote/shared';
import { RUN_NOT_FOUND } from './projections.service';

interface MapRow {
  sample_id: string;
  group_name: string;
  verdict: AssignmentVerdict;
  p_chi2: number[];
  p_hotelling: number[];
}

/**
 * The whole run's probabilities for the heat map, thinned in the database so a run of 100,000 unknowns
 * sends a few hundred rows: the order puts each best group's unknowns together, so evenly spaced rows
 * keep every group's share and the spread of probabilities within it.
 */
@Injectable()
export class ProbabilityMapService {
  constructor(@InjectDataSource() private readonly dataSource: DataSource) {}

  async get(labId: string, runId: string): Promise<ProbabilityMap> {
    const runs: { id: string }[] = await this.dataSource.query(`SELECT id FROM runs WHERE id = $1 AND lab_id = $2`, [
      runId,
      labId,
    ]);
    if (runs.length === 0) throw new NotFoundException(RUN_NOT_FOUND);
    const groups: { name: string }[] = await this.dataSource.query(
      `SELECT name FROM run_groups WHERE run_id = $1 ORDER BY group_index`,
      [runId],
    );
    const [{ total }]: { total: string }[] = await this.dataSource.query(
      `SELECT count(*) AS total FROM run_assignments WHERE run_id = $1`,
      [runId],
    );
    const stride = Math.max(1, Math.ceil(Number(total) / PROBABILITY_MAP_ROW_LIMIT));
    const rows: MapRow[] = await this.dataSource.query(
      `SELECT sample_id, group_name, verdict, p_chi2, p_hotelling FROM (
         SELECT a.sample_id, a.group_name, a.verdict, a.p_chi2, a.p_hotelling,
                row_number() OVER (ORDER BY g.group_index, a.probability DESC, a.sample_id) - 1 AS rank
         FROM run_assignments a
         JOIN run_groups g ON g.run_id = a.run_id AND g.name = a.group_name
         WHERE a.run_id = $1
       ) ordered
       WHERE rank % $2 = 0 ORDER BY rank`,
      [runId, stride],
    );
    return {
      runId,
      groups: groups.map((g) => g.name),
      total: Number(total),
      stride,
      rows: rows.map((r) => ({
        sampleId: r.sample_id,
        group: r.group_name,
        verdict: r.verdict,
        pChi2: r.p_chi2,
        pHotelling: r.p_hotelling,
      })),
    };
  }
}
