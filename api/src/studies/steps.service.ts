import { BadRequestException, ForbiddenException, Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource, type EntityManager } from 'typeorm';
import {
  applyStepEdit,
  newlyStaleSteps,
  stepBlocker,
  stepLabels,
  scatterQuerySchema,
  stepParametersSchemas,
  type ElementSummary,
  type GroupSizes,
  type Scatter,
  type StepEditResult,
  type StepKey,
  type StepParameters,
} from '@provenote/shared';
import { AuditService } from '../audit/audit.service';
import type { AuthUser, LabMembership } from '../auth/auth.types';
import { GroupsService } from '../groups/groups.service';
import { assertDataStep } from './data-step-check';
import { elementSummary } from './element-summary';
import { groupSizes } from './group-sizes';
import { scatter } from './scatter';
import { assertMayEdit } from './study-access';
import { StudyStepEntity } from './study-step.entity';
import { StudiesService } from './studies.service';

/** Cards whose settings only analysts and PIs choose: vetting the reference groups is theirs. */
const ANALYST_STEPS: readonly StepKey[] = ['check'];
/** Cards without settings of their own: review changes through overrides, export through bundles. */
const NO_SETTINGS_STEPS: readonly StepKey[] = ['review', 'export'];

@Injectable()
export class StepsService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly studies: StudiesService,
    private readonly groups: GroupsService,
    private readonly audit: AuditService,
  ) {}

  /**
   * Saves a card's settings and applies the stale rule: every card below that had been saved or run
   * becomes stale. The answer names those cards so the notebook can offer to run them again.
   */
  async edit(
    labId: string,
    studyId: string,
    key: StepKey,
    rawParameters: Record<string, unknown>,
    membership: LabMembership,
    user: AuthUser,
  ): Promise<StepEditResult> {
    if (NO_SETTINGS_STEPS.includes(key)) {
      throw new BadRequestException(`The "${stepLabels[key].title}" card has no settings to save`);
    }
    if (ANALYST_STEPS.includes(key) && membership.role !== 'pi' && membership.role !== 'analyst') {
      throw new ForbiddenException(`Only analysts and PIs may change the "${stepLabels[key].title}" card`);
    }
    const parsed = stepParametersSchemas[key].safeParse(rawParameters);
    if (!parsed.success) {
      throw new BadRequestException({
        message: `These "${stepLabels[key].title}" settings are not valid`,
        errors: parsed.error.issues.map((issue) => ({
          path: ['parameters', ...issue.path].join('.'),
          message: issue.message,
        })),
      });
    }

    const staleSteps = await this.dataSource.transaction(async (manager) => {
      const { study, steps } = await this.studies.load(labId, studyId, manager);
      assertMayEdit(study, membership, user);
      const blocker = stepBlocker(steps, key);
      if (blocker) throw new BadRequestException(blocker);
      await this.checkAgainstOtherCards(manager, labId, key, parsed.data, steps, membership);

      const after = applyStepEdit(steps, key);
      const repository = manager.getRepository(StudyStepEntity);
      for (const [i, step] of after.entries()) {
        const edited = step.key === key;
        if (!edited && step.status === steps[i].status) continue;
        await repository.update(step.id, {
          status: step.status,
          ...(edited ? { parameters: parsed.data, error: null, updatedById: user.id } : {}),
        });
      }
      const stale = newlyStaleSteps(steps, after);
      await this.audit.record(
        {
          labId,
          actor: user,
          action: 'study.step_changed',
          target: { type: 'study', id: studyId },
          details: { step: key, parameters: parsed.data, staleSteps: stale },
        },
        manager,
      );
      return stale;
    });
    return { study: await this.studies.get(labId, studyId), staleSteps };
  }

  async elementSummary(labId: string, studyId: string): Promise<ElementSummary> {
    const { steps } = await this.studies.load(labId, studyId);
    const data = steps.find((s) => s.key === 'data')?.parameters as StepParameters['data'] | null;
    return elementSummary(this.dataSource.manager, labId, data);
  }

  async scatter(labId: string, studyId: string, rawQuery: Record<string, unknown>): Promise<Scatter> {
    const { steps } = await this.studies.load(labId, studyId);
    const query = scatterQuerySchema.parse(rawQuery);
    const settings = <K extends StepKey>(key: K) =>
      steps.find((s) => s.key === key)?.parameters as StepParameters[K] | null;
    const assign = steps.find((s) => s.key === 'assign');
    const assignRunId = assign && (assign.status === 'current' || assign.status === 'stale') ? assign.runId : null;
    return scatter(
      this.dataSource.manager,
      labId,
      { data: settings('data'), prepare: settings('prepare'), groups: settings('groups'), check: settings('check') },
      assignRunId,
      query,
    );
  }

  async groupSizes(labId: string, studyId: string): Promise<GroupSizes> {
    const { steps } = await this.studies.load(labId, studyId);
    const chosen = steps.find((s) => s.key === 'groups')?.parameters as StepParameters['groups'] | null;
    return groupSizes(steps, await this.groups.membersByName(this.dataSource.manager, chosen?.groupVersionIds ?? []));
  }

  /** Settings that are valid alone but must also fit the cards above (and the person's role). */
  private async checkAgainstOtherCards(
    manager: EntityManager,
    labId: string,
    key: StepKey,
    parameters: StepParameters[StepKey],
    steps: StudyStepEntity[],
    membership: LabMembership,
  ) {
    if (key === 'data') await assertDataStep(manager, labId, parameters as StepParameters['data']);
    const data = steps.find((s) => s.key === 'data')?.parameters as StepParameters['data'] | null;
    if (key === 'groups') {
      const { groupVersionIds } = parameters as StepParameters['groups'];
      await this.groups.assertUsable(manager, labId, groupVersionIds, {
        approvedOnly: membership.role === 'student',
        datasetVersionId: data?.referenceVersionId ?? null,
      });
    }
    if (key === 'check') {
      const chosen = steps.find((s) => s.key === 'groups')?.parameters as StepParameters['groups'] | null;
      const members = await this.groups.membersByName(manager, chosen?.groupVersionIds ?? []);
      for (const exclusion of (parameters as StepParameters['check']).exclusions) {
        if (!members.get(exclusion.group)?.has(exclusion.sampleId)) {
          throw new BadRequestException(
            `Sample "${exclusion.sampleId}" is not a member of group "${exclusion.group}" in this study`,
          );
        }
      }
    }
  }
}
