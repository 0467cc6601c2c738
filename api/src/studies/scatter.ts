import { BadRequestException } from '@nestjs/common';
import type { EntityManager } from 'typeorm';
import {
  cellFlags,
  SCATTER_UNKNOWNS_LIMIT,
  type AssignmentVerdict,
  type Scatter,
  type ScatterQuery,
  type StepParameters,
} from '@provenote/shared';
import { DatasetVersion } from '../datasets/dataset-version.entity';
import { GroupVersionEntity } from '../groups/group-version.entity';

const BELOW_DL = cellFlags.indexOf('below_dl');

interface PointRow {
  sample_id: string;
  x: number | null;
  y: number | null;
  fx: number;
  fy: number;
}

/** 1-based position of an element in a version's value arrays (PostgreSQL arrays start at 1). */
function position(version: DatasetVersion, element: string, what: string): number {
  const index = version.columns.findIndex((c) => c.element === element);
  if (index < 0) throw new BadRequestException(`The ${what} data have no "${element}" column`);
  return index + 1;
}

async function points(manager: EntityManager, version: DatasetVersion, query: ScatterQuery, what: string, extra = '') {
  const ix = position(version, query.x, what);
  const iy = position(version, query.y, what);
  const rows: PointRow[] = await manager.query(
    `SELECT sample_id, ppm[$2] AS x, ppm[$3] AS y, flags[$2] AS fx, flags[$3] AS fy FROM dataset_rows
     WHERE version_id = $1 AND ppm[$2] IS NOT NULL AND ppm[$3] IS NOT NULL ORDER BY position ${extra}`,
    [version.id, ix, iy],
  );
  return rows.map((r) => ({
    sampleId: r.sample_id,
    x: r.x!,
    y: r.y!,
    belowDetection: r.fx === BELOW_DL || r.fy === BELOW_DL,
  }));
}

/**
 * The stored values of two elements, read as they are (no transform, no statistic): the members of the
 * study's groups (less excluded ones) and the unknowns, each with its verdict from the assign run.
 */
export async function scatter(
  manager: EntityManager,
  labId: string,
  settings: {
    data: StepParameters['data'] | null;
    groups: StepParameters['groups'] | null;
    check: StepParameters['check'] | null;
  },
  assignRunId: string | null,
  query: ScatterQuery,
): Promise<Scatter> {
  if (!settings.data || !settings.groups)
    throw new BadRequestException('Choose the data and the reference groups first');
  const versions = manager.getRepository(DatasetVersion);
  const reference = await versions.findOne({ where: { id: settings.data.referenceVersionId, labId } });
  if (!reference) throw new BadRequestException('The reference dataset version of the Data card no longer exists');
  const groupVersions = await manager
    .getRepository(GroupVersionEntity)
    .find({ where: settings.groups.groupVersionIds.map((id) => ({ id })), relations: { group: true } });
  const excluded = new Set((settings.check?.exclusions ?? []).map((e) => `${e.group}\u0000${e.sampleId}`));
  const referencePoints = await points(manager, reference, query, 'reference');
  const byId = new Map(referencePoints.map((p) => [p.sampleId, p]));
  const members = groupVersions.flatMap((v) =>
    v.memberIds
      .filter((id) => !excluded.has(`${v.group.name}\u0000${id}`) && byId.has(id))
      .map((id) => ({ ...byId.get(id)!, group: v.group.name })),
  );

  const unknownsId = settings.data.unknownsVersionId;
  const unknownsVersion = unknownsId ? await versions.findOne({ where: { id: unknownsId, labId } }) : null;
  const unknownPoints = unknownsVersion
    ? await points(manager, unknownsVersion, query, 'unknowns', `LIMIT ${SCATTER_UNKNOWNS_LIMIT + 1}`)
    : [];
  const verdicts = new Map<string, { verdict: AssignmentVerdict; group: string }>();
  if (assignRunId && unknownPoints.length > 0) {
    const rows: { sample_id: string; verdict: AssignmentVerdict; group_name: string }[] = await manager.query(
      `SELECT sample_id, verdict, group_name FROM run_assignments WHERE run_id = $1 AND sample_id = ANY($2::text[])`,
      [assignRunId, unknownPoints.map((p) => p.sampleId)],
    );
    for (const row of rows) verdicts.set(row.sample_id, { verdict: row.verdict, group: row.group_name });
  }
  return {
    x: query.x,
    y: query.y,
    reference: members,
    unknowns: unknownPoints.slice(0, SCATTER_UNKNOWNS_LIMIT).map((p) => ({
      ...p,
      verdict: verdicts.get(p.sampleId)?.verdict ?? null,
      group: verdicts.get(p.sampleId)?.group ?? null,
    })),
    truncated: unknownPoints.length > SCATTER_UNKNOWNS_LIMIT,
  };
}
