import {
  ConflictException,
  ForbiddenException,
  Injectable,
  NotFoundException,
  UnprocessableEntityException,
} from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type { CreateDataset, CreateVersion, Dataset as DatasetView, DatasetKind, LabRole } from '@provenote/shared';
import { DataSource, type EntityManager } from 'typeorm';
import { AuditService } from '../audit/audit.service';
import type { AuthUser } from '../auth/auth.types';
import { DatasetFilesService } from './dataset-files.service';
import { insertProblems, insertRows } from './dataset-rows.store';
import { DatasetUsageRegistry } from './dataset-usage';
import { DatasetVersion } from './dataset-version.entity';
import { versionView } from './dataset-views';
import { Dataset } from './dataset.entity';
import { asHttpErrors } from './import-failures';
import { importFile } from './parsing/parse-file';
import { SavedMapping } from './saved-mapping.entity';

/** Students bring unknowns to assign; reference data are for analysts and PIs. */
function assertMayImport(role: LabRole, kind: DatasetKind): void {
  if (kind === 'reference' && role !== 'pi' && role !== 'analyst') {
    throw new ForbiddenException('Only analysts and PIs may import reference data; students may import unknowns');
  }
}

/** Datasets and their immutable versions: creating, reading and deleting them. */
@Injectable()
export class DatasetsService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly files: DatasetFilesService,
    private readonly usage: DatasetUsageRegistry,
    private readonly audit: AuditService,
  ) {}

  async create(labId: string, user: AuthUser, role: LabRole, input: CreateDataset): Promise<DatasetView> {
    assertMayImport(role, input.kind);
    const datasetId = await this.dataSource.transaction(async (manager) => {
      const dataset = await manager
        .getRepository(Dataset)
        .save({ labId, name: input.name, kind: input.kind, createdBy: user.id });
      await this.importVersion(manager, dataset, user, { fileId: input.fileId, mapping: input.mapping, note: '' });
      await this.audit.record(
        {
          labId,
          actor: user,
          action: 'dataset.created',
          target: { type: 'dataset', id: dataset.id },
          details: { name: input.name, kind: input.kind },
        },
        manager,
      );
      return dataset.id;
    });
    return this.get(labId, datasetId);
  }

  /** A corrected or extended file becomes the next version; earlier versions stay as they were. */
  async addVersion(
    labId: string,
    datasetId: string,
    user: AuthUser,
    role: LabRole,
    input: CreateVersion,
  ): Promise<DatasetView> {
    await this.dataSource.transaction(async (manager) => {
      const dataset = await manager
        .getRepository(Dataset)
        .findOne({ where: { id: datasetId, labId }, lock: { mode: 'pessimistic_write' } });
      if (!dataset) throw new NotFoundException('No such dataset in this lab');
      assertMayImport(role, dataset.kind);
      await this.importVersion(manager, dataset, user, input);
    });
    return this.get(labId, datasetId);
  }

  private async importVersion(manager: EntityManager, dataset: Dataset, user: AuthUser, input: CreateVersion) {
    const file = await this.files.withContent(dataset.labId, input.fileId);
    const versions = manager.getRepository(DatasetVersion);
    const last = await versions.maximum('number', { datasetId: dataset.id });
    const version = await versions.save({
      datasetId: dataset.id,
      labId: dataset.labId,
      number: (last ?? 0) + 1,
      note: input.note,
      fileId: file.id,
      mapping: input.mapping,
      columns: [],
      summary: { rowsRead: 0, imported: 0, flagged: 0, rejected: 0, blankRowsSkipped: 0 },
      createdBy: user.id,
    });
    let problemPosition = 1;
    // One write in flight while the next batch is parsed: the connection runs them in order, and
    // parsing overlaps the database's work instead of waiting for it.
    let inFlight: Promise<void> = Promise.resolve();
    const write = (next: () => Promise<void>) => {
      const previous = inFlight;
      inFlight = previous.then(next);
      return previous;
    };
    const { summary, columns, fingerprint } = await asHttpErrors(async () => {
      const result = await importFile(file.content, file.filename, input.mapping, dataset.kind, {
        rows: (batch) => write(() => insertRows(manager, version.id, batch)),
        problems: (batch) => {
          const first = problemPosition;
          problemPosition += batch.length;
          return write(() => insertProblems(manager, version.id, first, batch));
        },
      });
      await inFlight;
      return result;
    });
    if (summary.imported === 0) {
      throw new UnprocessableEntityException({
        message: 'The file has no rows that can be imported',
        errors: [{ path: 'file', message: `${summary.rowsRead} row(s) read, ${summary.rejected} rejected` }],
      });
    }
    await versions.update(version.id, { columns, summary });
    await manager
      .createQueryBuilder()
      .insert()
      .into(SavedMapping)
      .values({ labId: dataset.labId, fingerprint, mapping: input.mapping })
      .orUpdate(['mapping', 'updated_at'], ['lab_id', 'fingerprint'])
      .execute();
    if (version.number > 1) {
      await this.audit.record(
        {
          labId: dataset.labId,
          actor: user,
          action: 'dataset.version_created',
          target: { type: 'dataset_version', id: version.id },
          details: { dataset: dataset.name, number: version.number },
        },
        manager,
      );
    }
  }

  async list(labId: string): Promise<DatasetView[]> {
    const datasets = await this.dataSource.getRepository(Dataset).find({
      where: { labId },
      relations: { versions: { file: true } },
      order: { createdAt: 'DESC', versions: { number: 'ASC' } },
    });
    return datasets.map(datasetView);
  }

  async get(labId: string, datasetId: string): Promise<DatasetView> {
    const dataset = await this.dataSource.getRepository(Dataset).findOne({
      where: { id: datasetId, labId },
      relations: { versions: { file: true } },
      order: { versions: { number: 'ASC' } },
    });
    if (!dataset) throw new NotFoundException('No such dataset in this lab');
    return datasetView(dataset);
  }

  async version(
    labId: string,
    datasetId: string,
    number: number,
  ): Promise<DatasetVersion & { file: NonNullable<DatasetVersion['file']> }> {
    const version = await this.dataSource.getRepository(DatasetVersion).findOne({
      where: { datasetId, labId, number },
      relations: { file: true },
    });
    if (!version) throw new NotFoundException('No such dataset version in this lab');
    return version;
  }

  /** Deletes one version, or (without a number) the whole dataset; refused while a study depends on it. */
  async remove(labId: string, datasetId: string, user: AuthUser, number?: number): Promise<void> {
    await this.dataSource.transaction(async (manager) => {
      const dataset = await manager
        .getRepository(Dataset)
        .findOne({ where: { id: datasetId, labId }, lock: { mode: 'pessimistic_write' } });
      if (!dataset) throw new NotFoundException('No such dataset in this lab');
      const versions = await manager
        .getRepository(DatasetVersion)
        .find({ where: number === undefined ? { datasetId } : { datasetId, number } });
      if (number !== undefined && versions.length === 0)
        throw new NotFoundException('No such dataset version in this lab');
      const blockers = await this.usage.blockers(versions.map((version) => version.id));
      if (blockers.length > 0) {
        throw new ConflictException({
          message: 'This data is used by a signed-off study and cannot be deleted',
          errors: blockers.map((blocker) => ({ path: 'version', message: blocker })),
        });
      }
      const fileIds = versions.map((version) => version.fileId);
      if (number === undefined) await manager.getRepository(Dataset).delete({ id: datasetId });
      else await manager.getRepository(DatasetVersion).delete({ id: versions[0].id });
      const remaining = await manager.getRepository(DatasetVersion).count({ where: { datasetId } });
      if (remaining === 0) await manager.getRepository(Dataset).delete({ id: datasetId });
      // A file no remaining version was made from goes with its last version.
      await manager.query(
        `DELETE FROM dataset_files f WHERE f.id = ANY($1::uuid[]) AND NOT EXISTS (SELECT 1 FROM dataset_versions v WHERE v.file_id = f.id)`,
        [fileIds],
      );
      await this.audit.record(
        {
          labId,
          actor: user,
          action: number === undefined ? 'dataset.deleted' : 'dataset.version_deleted',
          target: { type: 'dataset', id: datasetId },
          details: number === undefined ? { name: dataset.name } : { name: dataset.name, number },
        },
        manager,
      );
    });
  }
}

function datasetView(dataset: Dataset): DatasetView {
  return {
    id: dataset.id,
    labId: dataset.labId,
    name: dataset.name,
    kind: dataset.kind,
    createdAt: dataset.createdAt.toISOString(),
    versions: dataset.versions.map((version) => versionView(version)),
  };
}
