import { BadRequestException } from '@nestjs/common';
import type { EntityManager } from 'typeorm';
import type { DatasetKind, StepParameters } from '@provenote/shared';

async function assertVersionOfKind(manager: EntityManager, labId: string, versionId: string, kind: DatasetKind) {
  const [row]: { kind: DatasetKind }[] = await manager.query(
    `SELECT d.kind FROM dataset_versions v JOIN datasets d ON d.id = v.dataset_id WHERE v.id = $1 AND v.lab_id = $2`,
    [versionId, labId],
  );
  if (!row) throw new BadRequestException(`No such ${kind} dataset version in this lab`);
  if (row.kind !== kind) throw new BadRequestException(`That dataset version holds ${row.kind}, not ${kind}`);
}

/** The Data card pins versions of this lab, each of the right kind. */
export async function assertDataStep(manager: EntityManager, labId: string, data: StepParameters['data']) {
  await assertVersionOfKind(manager, labId, data.referenceVersionId, 'reference');
  if (data.unknownsVersionId) await assertVersionOfKind(manager, labId, data.unknownsVersionId, 'unknowns');
}
