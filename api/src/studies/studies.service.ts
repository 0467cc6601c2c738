import { Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource, type EntityManager } from 'typeorm';
import {
  defaultStepParameters,
  stepKeys,
  type CopyStudy,
  type CreateStudy,
  type StepParameters,
  type Study,
  type StudyList,
  type UpdateStudy,
} from '@provenote/shared';
import { AuditService } from '../audit/audit.service';
import type { AuthUser, LabMembership } from '../auth/auth.types';
import { GroupsService } from '../groups/groups.service';
import { planCopy } from './copy-plan';
import { assertDataStep } from './data-step-check';
import { reconcileRuns } from './reconcile-runs';
import { assertMayEdit, requireStudy } from './study-access';
import { StudyStepEntity } from './study-step.entity';
import { StudyEntity } from './study.entity';
import { toStudy, toStudySummary } from './study-view';

const STUDY_RELATIONS = { owner: true, signedOffBy: true } as const;

@Injectable()
export class StudiesService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly audit: AuditService,
    private readonly groups: GroupsService,
  ) {}

  async list(labId: string): Promise<StudyList> {
    const studies = await this.dataSource.getRepository(StudyEntity).find({
      where: { labId },
      relations: { ...STUDY_RELATIONS, steps: true },
      order: { updatedAt: 'DESC', id: 'ASC' },
    });
    return { studies: studies.map((study) => toStudySummary(study, study.steps)) };
  }

  /** The study with its cards; 404 for a study of another lab, so its existence is not revealed. */
  async load(labId: string, studyId: string, manager: EntityManager = this.dataSource.manager) {
    // One round trip for the study, its people and its cards: the study page is the most read page.
    const study = requireStudy(
      await manager.getRepository(StudyEntity).findOne({
        where: { id: studyId, labId },
        relations: { ...STUDY_RELATIONS, steps: { updatedBy: true } },
        order: { steps: { position: 'ASC' } },
      }),
    );
    const steps = study.steps;
    await reconcileRuns(manager, steps);
    return { study, steps };
  }

  async get(labId: string, studyId: string, manager?: EntityManager): Promise<Study> {
    const { study, steps } = await this.load(labId, studyId, manager);
    return toStudy(study, steps);
  }

  async create(labId: string, input: CreateStudy, user: AuthUser): Promise<Study> {
    const id = await this.dataSource.transaction(async (manager) => {
      const study = await this.insertStudy(manager, labId, input, user, null);
      await this.audit.record(
        {
          labId,
          actor: user,
          action: 'study.created',
          target: { type: 'study', id: study.id },
          details: { name: study.name },
        },
        manager,
      );
      return study.id;
    });
    return this.get(labId, id);
  }

  async update(labId: string, studyId: string, input: UpdateStudy, membership: LabMembership, user: AuthUser) {
    await this.dataSource.transaction(async (manager) => {
      const { study } = await this.load(labId, studyId, manager);
      assertMayEdit(study, membership, user);
      await manager.getRepository(StudyEntity).update(study.id, input);
    });
    return this.get(labId, studyId);
  }

  /** "Copy with new data" (see planCopy); the copy belongs to whoever made it. */
  async copy(
    labId: string,
    studyId: string,
    input: CopyStudy,
    membership: LabMembership,
    user: AuthUser,
  ): Promise<Study> {
    const id = await this.dataSource.transaction(async (manager) => {
      const { study: source, steps } = await this.load(labId, studyId, manager);
      await assertDataStep(manager, labId, input.data);
      const copy = await this.insertStudy(
        manager,
        labId,
        { name: input.name, description: source.description },
        user,
        source.id,
      );
      const repository = manager.getRepository(StudyStepEntity);
      const plan = planCopy(steps, input.data);
      const groups = plan.find((step) => step.key === 'groups')?.parameters as StepParameters['groups'] | null;
      // A student's copy may keep only approved groups, as a student's own study may.
      if (groups && membership.role === 'student') {
        await this.groups.assertUsable(manager, labId, groups.groupVersionIds, {
          approvedOnly: true,
          datasetVersionId: input.data.referenceVersionId,
        });
      }
      for (const step of plan) {
        await repository.update(
          { studyId: copy.id, key: step.key },
          { parameters: step.parameters, status: step.status, updatedById: user.id },
        );
      }
      await this.audit.record(
        {
          labId,
          actor: user,
          action: 'study.copied',
          target: { type: 'study', id: copy.id },
          details: { from: source.id, data: input.data },
        },
        manager,
      );
      return copy.id;
    });
    return this.get(labId, id);
  }

  async remove(labId: string, studyId: string, membership: LabMembership, user: AuthUser): Promise<void> {
    await this.dataSource.transaction(async (manager) => {
      const { study } = await this.load(labId, studyId, manager);
      assertMayEdit(study, membership, user);
      await manager.getRepository(StudyEntity).delete(study.id);
      await this.audit.record(
        {
          labId,
          actor: user,
          action: 'study.deleted',
          target: { type: 'study', id: study.id },
          details: { name: study.name },
        },
        manager,
      );
    });
  }

  private async insertStudy(
    manager: EntityManager,
    labId: string,
    input: CreateStudy,
    user: AuthUser,
    copiedFromId: string | null,
  ): Promise<StudyEntity> {
    const study = await manager
      .getRepository(StudyEntity)
      .save({ labId, name: input.name, description: input.description, ownerId: user.id, copiedFromId });
    await manager.getRepository(StudyStepEntity).insert(
      stepKeys.map((key, position) => ({
        studyId: study.id,
        key,
        position,
        status: 'not_run' as const,
        parameters: defaultStepParameters[key],
        updatedById: user.id,
      })),
    );
    return study;
  }
}
