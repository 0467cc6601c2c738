import { BadRequestException } from '@nestjs/common';
import type { EntityManager } from 'typeorm';
import { cellFlags, type ElementSummary, type StepParameters } from '@provenote/shared';
import { DatasetVersion } from '../datasets/dataset-version.entity';

const DETECTED_FLAGS = [cellFlags.indexOf('measured'), cellFlags.indexOf('negative')];

interface SummaryRow {
  idx: string;
  with_value: string;
  detected: string;
  median: number | null;
  q1: number | null;
  q3: number | null;
}

/**
 * The Prepare card's summary of the reference data, computed by PostgreSQL's ordered-set aggregates
 * (percentile_cont, linear interpolation between order statistics) in one pass over the rows.
 */
export async function elementSummary(
  manager: EntityManager,
  labId: string,
  data: StepParameters['data'] | null,
): Promise<ElementSummary> {
  if (!data) throw new BadRequestException('Choose the reference data on the Data card first');
  const version = await manager
    .getRepository(DatasetVersion)
    .findOne({ where: { id: data.referenceVersionId, labId } });
  if (!version) throw new BadRequestException('The reference dataset version of the Data card no longer exists');
  const rows: SummaryRow[] = await manager.query(
    `SELECT c.idx,
            count(c.ppm) AS with_value,
            count(*) FILTER (WHERE c.flag = ANY($2::smallint[])) AS detected,
            percentile_cont(0.5) WITHIN GROUP (ORDER BY c.ppm) FILTER (WHERE c.flag = ANY($2::smallint[])) AS median,
            percentile_cont(0.25) WITHIN GROUP (ORDER BY c.ppm) FILTER (WHERE c.flag = ANY($2::smallint[])) AS q1,
            percentile_cont(0.75) WITHIN GROUP (ORDER BY c.ppm) FILTER (WHERE c.flag = ANY($2::smallint[])) AS q3
     FROM dataset_rows r, unnest(r.ppm, r.flags) WITH ORDINALITY AS c(ppm, flag, idx)
     WHERE r.version_id = $1
     GROUP BY c.idx ORDER BY c.idx`,
    [version.id, DETECTED_FLAGS],
  );
  const samples = version.summary.imported;
  return {
    datasetVersionId: version.id,
    samples,
    elements: rows.map((row) => ({
      element: version.columns[Number(row.idx) - 1]?.element ?? `column ${row.idx}`,
      withValue: Number(row.with_value),
      fractionDetected: samples > 0 ? Number(row.detected) / samples : 0,
      median: row.median,
      q1: row.q1,
      q3: row.q3,
    })),
  };
}
