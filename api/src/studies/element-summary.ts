import { BadRequestException } from '@nestjs/common';
import type { EntityManager } from 'typeorm';
import { cellFlags, EngineError, kruskalWallis, type ElementSummary, type StepParameters } from '@provenote/shared';
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

interface GroupValuesRow {
  idx: string;
  group_name: string;
  values: number[];
}

/**
 * Kruskal–Wallis H per element between the groups of the reference data's group column, on the measured
 * values only (a detection limit is not a rank). Samples without a group take no part.
 */
async function screening(
  manager: EntityManager,
  version: DatasetVersion,
  elementOf: (idx: string) => string,
): Promise<ElementSummary['screening']> {
  const rows: GroupValuesRow[] = await manager.query(
    `SELECT c.idx, r.group_name, array_agg(c.ppm) AS values
     FROM dataset_rows r, unnest(r.ppm, r.flags) WITH ORDINALITY AS c(ppm, flag, idx)
     WHERE r.version_id = $1 AND r.group_name IS NOT NULL AND c.ppm IS NOT NULL AND c.flag = ANY($2::smallint[])
     GROUP BY c.idx, r.group_name ORDER BY c.idx, r.group_name`,
    [version.id, DETECTED_FLAGS],
  );
  const byElement = new Map<string, number[][]>();
  for (const row of rows) {
    const groups = byElement.get(row.idx) ?? [];
    groups.push(row.values.map(Number));
    byElement.set(row.idx, groups);
  }
  const groups = [...new Set(rows.map((r) => r.group_name))].sort();
  const elements = version.columns.map((_, i) => {
    const idx = String(i + 1);
    const element = elementOf(idx);
    const values = byElement.get(idx) ?? [];
    if (values.length < 2) return { element, reason: 'measured in fewer than two groups' };
    try {
      const { h, df, p } = kruskalWallis(values);
      return { element, h, df, p };
    } catch (error) {
      if (error instanceof EngineError) return { element, reason: error.message };
      throw error;
    }
  });
  return { groups, elements };
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
  const elementOf = (idx: string) => version.columns[Number(idx) - 1]?.element ?? `column ${idx}`;
  return {
    datasetVersionId: version.id,
    samples,
    elements: rows.map((row) => ({
      element: elementOf(row.idx),
      withValue: Number(row.with_value),
      fractionDetected: samples > 0 ? Number(row.detected) / samples : 0,
      median: row.median,
      q1: row.q1,
      q3: row.q3,
    })),
    screening: await screening(manager, version, elementOf),
  };
}
