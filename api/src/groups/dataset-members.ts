import { BadRequestException } from '@nestjs/common';
import type { EntityManager } from 'typeorm';

const MAX_LISTED = 5;

/** Refuses members that are not samples of a reference dataset version of this lab, naming them. */
export async function assertMembersInDataset(
  manager: EntityManager,
  labId: string,
  datasetVersionId: string,
  memberIds: string[],
): Promise<void> {
  const [version] = await manager.query(
    `SELECT v.id FROM dataset_versions v JOIN datasets d ON d.id = v.dataset_id
     WHERE v.id = $1 AND v.lab_id = $2 AND d.kind = 'reference'`,
    [datasetVersionId, labId],
  );
  if (!version) throw new BadRequestException('No such reference dataset version in this lab');
  const rows: { sample_id: string }[] = await manager.query(
    `SELECT DISTINCT sample_id FROM dataset_rows WHERE version_id = $1 AND sample_id = ANY($2::text[])`,
    [datasetVersionId, memberIds],
  );
  const found = new Set(rows.map((row) => row.sample_id));
  const missing = memberIds.filter((id) => !found.has(id));
  if (missing.length > 0) {
    const more = missing.length > MAX_LISTED ? ` and ${missing.length - MAX_LISTED} more` : '';
    throw new BadRequestException(
      `Not samples of this dataset version: ${missing.slice(0, MAX_LISTED).join(', ')}${more}`,
    );
  }
}
