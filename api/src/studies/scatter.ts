import { BadRequestException } from '@nestjs/common';
import type { EntityManager } from 'typeorm';
import {
  SCATTER_UNKNOWNS_LIMIT,
  type AssignmentVerdict,
  type Scatter,
  type ScatterQuery,
  type StepParameters,
} from '@provenote/shared';
import { DatasetVersion } from '../datasets/dataset-version.entity';
import { GroupVersionEntity } from '../groups/group-version.entity';
import { measuredCoordinates, preparedCoordinates, type CoordinateRows, type StoredRow } from './scatter-coordinates';

type Settings = {
  [K in 'data' | 'prepare' | 'groups' | 'check']: StepParameters[K] | null;
};

/** The two chosen coordinates of each row that has both, with the rest of the row left behind. */
function pick(coordinates: CoordinateRows, x: number, y: number) {
  return coordinates.rows
    .filter((r) => r.values[x] !== null && r.values[y] !== null)
    .map((r) => ({
      sampleId: r.sampleId,
      x: r.values[x]!,
      y: r.values[y]!,
      belowDetection: r.belowDetection[x] || r.belowDetection[y],
    }));
}

function axis(variables: string[], requested: string | undefined, fallback: number, name: string): number {
  const index = requested === undefined ? fallback : variables.indexOf(requested);
  if (index < 0 || index >= variables.length)
    throw new BadRequestException(`The ${name} axis must be one of ${variables.join(', ')}`);
  return index;
}

/**
 * Two coordinates of the members of the study's groups (less excluded ones) and of the unknowns, each
 * with its verdict from the assign run: as measured (ppm) or as the Prepare card prepares them.
 */
export async function scatter(
  manager: EntityManager,
  labId: string,
  settings: Settings,
  assignRunId: string | null,
  query: ScatterQuery,
): Promise<Scatter> {
  if (!settings.data || !settings.groups)
    throw new BadRequestException('Choose the data and the reference groups first');
  const { prepare } = settings;
  if (query.space === 'prepared' && !prepare)
    throw new BadRequestException('Save the Prepare card first, or plot the measured values');
  const versions = manager.getRepository(DatasetVersion);
  const reference = await versions.findOne({ where: { id: settings.data.referenceVersionId, labId } });
  if (!reference) throw new BadRequestException('The reference dataset version of the Data card no longer exists');
  const groupVersions = await manager
    .getRepository(GroupVersionEntity)
    .find({ where: settings.groups.groupVersionIds.map((id) => ({ id })), relations: { group: true } });
  const excluded = new Set((settings.check?.exclusions ?? []).map((e) => `${e.group}\u0000${e.sampleId}`));
  const memberIds = [...new Set(groupVersions.flatMap((v) => v.memberIds))];
  const elements = prepare?.elements ?? reference.columns.map((c) => c.element);
  const coordinatesOf = (version: DatasetVersion, rows: StoredRow[], what: string) =>
    query.space === 'prepared'
      ? preparedCoordinates(version, rows, prepare!, what)
      : measuredCoordinates(version, rows, elements, what);

  const referenceRows: StoredRow[] = await manager.query(
    `SELECT sample_id, ppm, flags FROM dataset_rows WHERE version_id = $1 AND sample_id = ANY($2::text[]) ORDER BY position`,
    [reference.id, memberIds],
  );
  const referenceCoordinates = coordinatesOf(reference, referenceRows, 'reference');
  const { variables } = referenceCoordinates;
  const x = axis(variables, query.x, 0, 'horizontal');
  const y = axis(variables, query.y, 1, 'vertical');
  const byId = new Map(pick(referenceCoordinates, x, y).map((p) => [p.sampleId, p]));
  const members = groupVersions.flatMap((v) =>
    v.memberIds
      .filter((id) => !excluded.has(`${v.group.name}\u0000${id}`) && byId.has(id))
      .map((id) => ({ ...byId.get(id)!, group: v.group.name })),
  );

  const unknownsId = settings.data.unknownsVersionId;
  const unknownsVersion = unknownsId ? await versions.findOne({ where: { id: unknownsId, labId } }) : null;
  const unknownRows: StoredRow[] = unknownsVersion
    ? await manager.query(
        `SELECT sample_id, ppm, flags FROM dataset_rows WHERE version_id = $1 ORDER BY position LIMIT $2`,
        [unknownsVersion.id, SCATTER_UNKNOWNS_LIMIT + 1],
      )
    : [];
  const unknownPoints = unknownsVersion ? pick(coordinatesOf(unknownsVersion, unknownRows, 'unknowns'), x, y) : [];
  const verdicts = new Map<string, { verdict: AssignmentVerdict; group: string }>();
  if (assignRunId && unknownPoints.length > 0) {
    const rows: { sample_id: string; verdict: AssignmentVerdict; group_name: string }[] = await manager.query(
      `SELECT sample_id, verdict, group_name FROM run_assignments WHERE run_id = $1 AND sample_id = ANY($2::text[])`,
      [assignRunId, unknownPoints.map((p) => p.sampleId)],
    );
    for (const row of rows) verdicts.set(row.sample_id, { verdict: row.verdict, group: row.group_name });
  }
  return {
    space: query.space,
    variables,
    x: variables[x],
    y: variables[y],
    reference: members,
    unknowns: unknownPoints.slice(0, SCATTER_UNKNOWNS_LIMIT).map((p) => ({
      ...p,
      verdict: verdicts.get(p.sampleId)?.verdict ?? null,
      group: verdicts.get(p.sampleId)?.group ?? null,
    })),
    truncated: unknownRows.length > SCATTER_UNKNOWNS_LIMIT,
  };
}
