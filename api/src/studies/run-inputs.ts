import { BadRequestException } from '@nestjs/common';
import type { EntityManager } from 'typeorm';
import { cellFlags, type RunSample, type StepParameters } from '@provenote/shared';
import { DatasetVersion } from '../datasets/dataset-version.entity';
import { GroupVersionEntity } from '../groups/group-version.entity';
import type { DatasetRowsSource } from '../runs/run-inputs.writer';

const MAX_LISTED = 5;

interface StoredSample {
  sample_id: string;
  ppm: (number | null)[];
  flags: number[];
}

/** The dataset version of this lab, or a 400 naming which card to fix. */
async function versionOf(manager: EntityManager, labId: string, id: string, what: string) {
  const version = await manager.getRepository(DatasetVersion).findOne({ where: { id, labId } });
  if (!version)
    throw new BadRequestException(`The ${what} dataset version of the Data card no longer exists in this lab`);
  return version;
}

/** Positions of the chosen elements in a version's measurement columns. */
function elementIndexes(version: DatasetVersion, elements: string[], what: string): number[] {
  return elements.map((element) => {
    const index = version.columns.findIndex((column) => column.element === element);
    if (index < 0)
      throw new BadRequestException(`The ${what} data have no "${element}" column; change the Prepare card`);
    return index;
  });
}

/**
 * One sample's values in element order. A value below the detection limit travels as the limit with its
 * flag; a cell without a number (not determined, empty, limit not stated) cannot be used, and is named.
 */
function toRunSample(
  row: StoredSample,
  indexes: number[],
  elements: string[],
  problems: string[],
): Omit<RunSample, 'group'> | null {
  const values: number[] = [];
  const belowDetection: boolean[] = [];
  for (const [k, index] of indexes.entries()) {
    const value = row.ppm[index];
    const flag = cellFlags[row.flags[index]];
    if (value === null || !Number.isFinite(value)) {
      problems.push(`${row.sample_id} has no value for ${elements[k]} (${flag.replace(/_/g, ' ')})`);
      return null;
    }
    values.push(value);
    belowDetection.push(flag === 'below_dl');
  }
  return { sampleId: row.sample_id, values, belowDetection };
}

function refuseProblems(problems: string[], what: string, total = problems.length) {
  if (total === 0) return;
  const listed = problems.slice(0, MAX_LISTED).join('; ');
  const more = total > MAX_LISTED ? ` and ${total - MAX_LISTED} more` : '';
  throw new BadRequestException(
    `Some ${what} samples cannot be used with the chosen elements: ${listed}${more}. Choose other elements or exclude the samples.`,
  );
}

async function storedRows(
  manager: EntityManager,
  versionId: string,
  sampleIds: string[] | null,
): Promise<StoredSample[]> {
  return sampleIds === null
    ? manager.query(`SELECT sample_id, ppm, flags FROM dataset_rows WHERE version_id = $1 ORDER BY position`, [
        versionId,
      ])
    : manager.query(
        `SELECT sample_id, ppm, flags FROM dataset_rows WHERE version_id = $1 AND sample_id = ANY($2::text[]) ORDER BY position`,
        [versionId, sampleIds],
      );
}

/** The reference samples of the chosen group versions, less the excluded members, with their group names. */
export async function referenceSamples(
  manager: EntityManager,
  labId: string,
  data: StepParameters['data'],
  prepare: StepParameters['prepare'],
  groups: StepParameters['groups'],
  check: StepParameters['check'],
): Promise<(RunSample & { group: string })[]> {
  const version = await versionOf(manager, labId, data.referenceVersionId, 'reference');
  const indexes = elementIndexes(version, prepare.elements, 'reference');
  const groupVersions = await manager
    .getRepository(GroupVersionEntity)
    .find({ where: groups.groupVersionIds.map((id) => ({ id })), relations: { group: true } });
  const excluded = new Set(check.exclusions.map((e) => `${e.group}\u0000${e.sampleId}`));
  const problems: string[] = [];
  const samples: (RunSample & { group: string })[] = [];
  for (const groupVersion of groupVersions) {
    const name = groupVersion.group.name;
    const members = groupVersion.memberIds.filter((id) => !excluded.has(`${name}\u0000${id}`));
    const rows = await storedRows(manager, version.id, members);
    const found = new Set(rows.map((row) => row.sample_id));
    const missing = members.filter((id) => !found.has(id));
    if (missing.length > 0)
      problems.push(
        `group "${name}" lists samples not in the reference data: ${missing.slice(0, MAX_LISTED).join(', ')}`,
      );
    for (const row of rows) {
      const sample = toRunSample(row, indexes, prepare.elements, problems);
      if (sample) samples.push({ ...sample, group: name });
    }
  }
  refuseProblems(problems, 'reference');
  return samples;
}

interface UnusableRow {
  sample_id: string;
  k: number;
  flag: number;
  total: number;
}

/**
 * The unknowns version and its chosen columns, for the run to copy inside the database. Checked here
 * as the in-memory path checks a sample: the first chosen cell without a finite number in each row is
 * named (up to a few, with how many more), so nothing unusable reaches the snapshot.
 */
export async function unknownsSource(
  manager: EntityManager,
  labId: string,
  data: StepParameters['data'],
  prepare: StepParameters['prepare'],
): Promise<DatasetRowsSource> {
  if (!data.unknownsVersionId) throw new BadRequestException('Choose the unknowns on the Data card first');
  const version = await versionOf(manager, labId, data.unknownsVersionId, 'unknowns');
  const columns = elementIndexes(version, prepare.elements, 'unknowns');
  const unusable: UnusableRow[] = await manager.query(
    `SELECT sample_id, k, flag, count(*) OVER ()::int AS total FROM (
       SELECT DISTINCT ON (r.position) r.position, r.sample_id, e.k::int AS k, r.flags[e.i] AS flag
       FROM dataset_rows r CROSS JOIN unnest($2::int[]) WITH ORDINALITY AS e(i, k)
       WHERE r.version_id = $1 AND (r.ppm[e.i] IS NULL OR r.ppm[e.i] IN ('NaN', 'Infinity', '-Infinity'))
       ORDER BY r.position, e.k) AS m
     ORDER BY position LIMIT $3`,
    [version.id, columns.map((column) => column + 1), MAX_LISTED],
  );
  const problems = unusable.map(
    (row) =>
      `${row.sample_id} has no value for ${prepare.elements[row.k - 1]} (${(cellFlags[row.flag] ?? 'no flag').replace(/_/g, ' ')})`,
  );
  refuseProblems(problems, 'unknown', unusable[0]?.total ?? 0);
  return { versionId: version.id, columns };
}
