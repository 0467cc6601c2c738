import {
  BadRequestException,
  ConflictException,
  ForbiddenException,
  Injectable,
  NotFoundException,
} from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource, In, QueryFailedError, type EntityManager } from 'typeorm';
import type {
  CreateGroup,
  CreateGroupVersion,
  GroupVersion,
  ReferenceGroup,
  ReferenceGroupList,
  UpdateGroup,
} from '@provenote/shared';
import { AuditService } from '../audit/audit.service';
import type { AuthUser } from '../auth/auth.types';
import { assertMembersInDataset } from './dataset-members';
import { GroupVersionEntity } from './group-version.entity';
import { ReferenceGroupEntity } from './reference-group.entity';

export const GROUP_NOT_FOUND = 'Reference group not found';
const UNIQUE_VIOLATION = '23505';

const isUniqueViolation = (error: unknown) =>
  error instanceof QueryFailedError && (error.driverError as { code?: string }).code === UNIQUE_VIOLATION;

function toVersion(version: GroupVersionEntity): GroupVersion {
  return {
    id: version.id,
    groupId: version.groupId,
    number: version.number,
    datasetVersionId: version.datasetVersionId,
    source: version.source,
    memberIds: version.memberIds,
    note: version.note,
    createdAt: version.createdAt.toISOString(),
    createdBy: version.createdBy?.displayName ?? null,
    approvedAt: version.approvedAt?.toISOString() ?? null,
    approvedBy: version.approvedBy?.displayName ?? null,
  };
}

function toGroup(group: ReferenceGroupEntity): ReferenceGroup {
  return {
    id: group.id,
    labId: group.labId,
    name: group.name,
    description: group.description,
    createdAt: group.createdAt.toISOString(),
    versions: [...group.versions].sort((a, b) => b.number - a.number).map(toVersion),
  };
}

export interface UsableOptions {
  /** Students assign only against versions an analyst or PI approved. */
  approvedOnly: boolean;
  /** The study's reference dataset version: members are sample ids of that version. */
  datasetVersionId: string | null;
}

@Injectable()
export class GroupsService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly audit: AuditService,
  ) {}

  async list(labId: string): Promise<ReferenceGroupList> {
    const groups = await this.dataSource.getRepository(ReferenceGroupEntity).find({
      where: { labId },
      relations: { versions: { createdBy: true, approvedBy: true } },
      order: { name: 'ASC' },
    });
    return { groups: groups.map(toGroup) };
  }

  async get(labId: string, groupId: string): Promise<ReferenceGroup> {
    const group = await this.dataSource.getRepository(ReferenceGroupEntity).findOne({
      where: { id: groupId, labId },
      relations: { versions: { createdBy: true, approvedBy: true } },
    });
    if (!group) throw new NotFoundException(GROUP_NOT_FOUND);
    return toGroup(group);
  }

  async create(labId: string, input: CreateGroup, user: AuthUser): Promise<ReferenceGroup> {
    const id = await this.dataSource
      .transaction(async (manager) => {
        const group = await manager
          .getRepository(ReferenceGroupEntity)
          .save({ labId, name: input.name, description: input.description, createdById: user.id });
        await this.insertVersion(manager, labId, group.id, 'manual', input, user);
        await this.audit.record(
          {
            labId,
            actor: user,
            action: 'group.created',
            target: { type: 'group', id: group.id },
            details: { name: group.name },
          },
          manager,
        );
        return group.id;
      })
      .catch((error: unknown) => {
        if (isUniqueViolation(error)) throw new ConflictException(`The lab already has a group named "${input.name}"`);
        throw error;
      });
    return this.get(labId, id);
  }

  async update(labId: string, groupId: string, input: UpdateGroup, user: AuthUser): Promise<ReferenceGroup> {
    await this.get(labId, groupId);
    await this.dataSource
      .transaction(async (manager) => {
        await manager.getRepository(ReferenceGroupEntity).update(groupId, input);
        await this.audit.record(
          {
            labId,
            actor: user,
            action: 'group.updated',
            target: { type: 'group', id: groupId },
            details: { ...input },
          },
          manager,
        );
      })
      .catch((error: unknown) => {
        if (isUniqueViolation(error)) throw new ConflictException(`The lab already has a group named "${input.name}"`);
        throw error;
      });
    return this.get(labId, groupId);
  }

  async addVersion(labId: string, groupId: string, input: CreateGroupVersion, user: AuthUser): Promise<ReferenceGroup> {
    await this.get(labId, groupId);
    await this.dataSource.transaction(async (manager) => {
      const version = await this.insertVersion(manager, labId, groupId, 'manual', input, user);
      await this.audit.record(
        {
          labId,
          actor: user,
          action: 'group.version_created',
          target: { type: 'group', id: groupId },
          details: { version: version.number, members: version.memberIds.length },
        },
        manager,
      );
    });
    return this.get(labId, groupId);
  }

  async approve(labId: string, groupId: string, versionId: string, user: AuthUser): Promise<ReferenceGroup> {
    await this.get(labId, groupId);
    await this.dataSource.transaction(async (manager) => {
      const repository = manager.getRepository(GroupVersionEntity);
      const version = await repository.findOne({
        where: { id: versionId, groupId },
        lock: { mode: 'pessimistic_write' },
      });
      if (!version) throw new NotFoundException('Group version not found');
      if (version.approvedAt) throw new ConflictException(`Version ${version.number} is approved already`);
      await repository.update(version.id, { approvedAt: new Date(), approvedById: user.id });
      await this.audit.record(
        {
          labId,
          actor: user,
          action: 'group.approved',
          target: { type: 'group', id: groupId },
          details: { version: version.number },
        },
        manager,
      );
    });
    return this.get(labId, groupId);
  }

  /**
   * One group per value of a reference dataset version's group column. A group of that name that exists
   * already gets a new version, unless its latest version has exactly these members of this data.
   */
  async fromColumn(labId: string, datasetVersionId: string, user: AuthUser): Promise<ReferenceGroupList> {
    await this.dataSource.transaction(async (manager) => {
      const [version] = await manager.query(
        `SELECT v.id FROM dataset_versions v JOIN datasets d ON d.id = v.dataset_id
         WHERE v.id = $1 AND v.lab_id = $2 AND d.kind = 'reference'`,
        [datasetVersionId, labId],
      );
      if (!version) throw new BadRequestException('No such reference dataset version in this lab');
      const rows: { group_name: string; members: string[] }[] = await manager.query(
        `SELECT group_name, array_agg(sample_id ORDER BY position) AS members FROM dataset_rows
         WHERE version_id = $1 AND group_name IS NOT NULL AND group_name <> '' GROUP BY group_name ORDER BY group_name`,
        [datasetVersionId],
      );
      if (rows.length === 0) throw new BadRequestException('This dataset version has no group column values');
      for (const row of rows) {
        const memberIds = [...new Set(row.members)];
        const groups = manager.getRepository(ReferenceGroupEntity);
        const group =
          (await groups.findOne({ where: { labId, name: row.group_name }, relations: { versions: true } })) ??
          (await groups.save({ labId, name: row.group_name, description: '', createdById: user.id, versions: [] }));
        const latest = [...(group.versions ?? [])].sort((a, b) => b.number - a.number)[0];
        const unchanged =
          latest?.datasetVersionId === datasetVersionId &&
          latest.memberIds.length === memberIds.length &&
          latest.memberIds.every((id, i) => id === memberIds[i]);
        if (unchanged) continue;
        const created = await this.insertVersion(
          manager,
          labId,
          group.id,
          'column',
          { datasetVersionId, memberIds },
          user,
        );
        await this.audit.record(
          {
            labId,
            actor: user,
            action: 'group.version_created',
            target: { type: 'group', id: group.id },
            details: { version: created.number, members: memberIds.length, source: 'column', datasetVersionId },
          },
          manager,
        );
      }
    });
    return this.list(labId);
  }

  /** Refuses group versions a study may not use: another lab's, unapproved for a student, other data. */
  async assertUsable(manager: EntityManager, labId: string, versionIds: string[], options: UsableOptions) {
    const versions = await manager
      .getRepository(GroupVersionEntity)
      .find({ where: { id: In(versionIds) }, relations: { group: true } });
    const found = new Map(versions.filter((v) => v.group.labId === labId).map((v) => [v.id, v]));
    const missing = versionIds.filter((id) => !found.has(id));
    if (missing.length > 0)
      throw new BadRequestException(`No such reference group version in this lab: ${missing.join(', ')}`);
    const names = versions.map((v) => v.group.name);
    const twice = names.find((name, i) => names.indexOf(name) !== i);
    if (twice) throw new BadRequestException(`Choose one version of group "${twice}", not several`);
    for (const version of versions) {
      const label = `"${version.group.name}" version ${version.number}`;
      if (options.approvedOnly && !version.approvedAt) {
        throw new ForbiddenException(`${label} is not approved yet; students may use approved versions only`);
      }
      if (options.datasetVersionId && version.datasetVersionId !== options.datasetVersionId) {
        throw new BadRequestException(`${label} was built from other reference data than this study's Data card`);
      }
    }
  }

  /** Member sample ids per group name, for the chosen versions. */
  async membersByName(manager: EntityManager, versionIds: string[]): Promise<Map<string, Set<string>>> {
    if (versionIds.length === 0) return new Map();
    const versions = await manager
      .getRepository(GroupVersionEntity)
      .find({ where: { id: In(versionIds) }, relations: { group: true } });
    return new Map(versions.map((v) => [v.group.name, new Set(v.memberIds)]));
  }

  private async insertVersion(
    manager: EntityManager,
    labId: string,
    groupId: string,
    source: 'column' | 'manual',
    input: { datasetVersionId: string; memberIds: string[]; note?: string },
    user: AuthUser,
  ): Promise<GroupVersionEntity> {
    if (source === 'manual') await assertMembersInDataset(manager, labId, input.datasetVersionId, input.memberIds);
    const repository = manager.getRepository(GroupVersionEntity);
    const latest = await repository.findOne({
      where: { groupId },
      order: { number: 'DESC' },
      lock: { mode: 'pessimistic_write' },
    });
    return repository.save({
      groupId,
      number: (latest?.number ?? 0) + 1,
      datasetVersionId: input.datasetVersionId,
      source,
      memberIds: input.memberIds,
      note: input.note ?? '',
      createdById: user.id,
    });
  }
}
