import { BadRequestException, Injectable } from '@nestjs/common';
import { ModuleRef } from '@nestjs/core';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource } from 'typeorm';
import {
  stepBlocker,
  stepLabels,
  type AssignmentParameters,
  type CreateRunRequest,
  type StepKey,
  type StepParameters,
  type Study,
} from '@provenote/shared';
import { AuditService } from '../audit/audit.service';
import type { AuthUser, LabMembership } from '../auth/auth.types';
import { GroupsService } from '../groups/groups.service';
import type { RunStart } from '../runs/run-inputs.writer';
import { RunsService } from '../runs/runs.service';
import { referenceSamples, unknownsSource } from './run-inputs';
import { assertMayEdit } from './study-access';
import { StudyStepEntity } from './study-step.entity';
import { StudiesService } from './studies.service';

const RUN_KINDS: Partial<Record<StepKey, CreateRunRequest['kind']>> = { check: 'group-check', assign: 'classify' };

const settingsOf = <K extends StepKey>(steps: StudyStepEntity[], key: K) => {
  const parameters = steps.find((s) => s.key === key)?.parameters;
  if (!parameters) throw new BadRequestException(`Save the "${stepLabels[key].title}" card first`);
  return parameters as StepParameters[K];
};

/** Starts the run of a computed card, with its inputs gathered from the cards above. */
@Injectable()
export class StudyRunsService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly studies: StudiesService,
    private readonly audit: AuditService,
    private readonly groups: GroupsService,
    private readonly moduleRef: ModuleRef,
  ) {}

  /**
   * The runs module does not export its service; it is looked up across modules so the run is created
   * exactly as POST /runs creates it (same snapshot, same queue, same role rules).
   */
  private get runs(): RunsService {
    return this.moduleRef.get(RunsService, { strict: false });
  }

  async start(labId: string, studyId: string, key: StepKey, membership: LabMembership, user: AuthUser): Promise<Study> {
    const kind = RUN_KINDS[key];
    if (!kind) throw new BadRequestException(`The "${stepLabels[key].title}" card has no run of its own`);
    const { study, steps } = await this.studies.load(labId, studyId);
    assertMayEdit(study, membership, user);
    const blocker = stepBlocker(steps, key);
    if (blocker) throw new BadRequestException(blocker);
    if (steps.find((s) => s.key === key)?.status === 'running') {
      throw new BadRequestException(`"${stepLabels[key].title}" is running already`);
    }

    const data = settingsOf(steps, 'data');
    const prepare = settingsOf(steps, 'prepare');
    const assign = settingsOf(steps, 'assign');
    const parameters: AssignmentParameters = {
      elements: prepare.elements,
      transform: prepare.transform,
      ...(prepare.alrDenominator ? { alrDenominator: prepare.alrDenominator } : {}),
      belowDetection: prepare.belowDetection,
      covariance: prepare.covariance,
      probability: assign.probability,
      alpha: assign.alpha,
      seed: prepare.seed,
    };
    const manager = this.dataSource.manager;
    const groups = settingsOf(steps, 'groups');
    // A student's run must rest on vetted groups, also in a study copied from an analyst's.
    if (membership.role === 'student') {
      await this.groups.assertUsable(manager, labId, groups.groupVersionIds, {
        approvedOnly: true,
        datasetVersionId: null,
      });
    }
    const reference = await referenceSamples(manager, labId, data, prepare, groups, settingsOf(steps, 'check'));
    const request: RunStart =
      kind === 'classify'
        ? { kind, studyId, parameters, reference, unknowns: await unknownsSource(manager, labId, data, prepare) }
        : { kind, studyId, parameters, reference };
    const run = await this.runs.create(labId, user.id, membership.role, request);

    await this.dataSource.transaction(async (tx) => {
      await tx
        .getRepository(StudyStepEntity)
        .update({ studyId, key }, { status: 'running', runId: run.id, error: null, updatedById: user.id });
      await this.audit.record(
        {
          labId,
          actor: user,
          action: 'study.run_started',
          target: { type: 'study', id: studyId },
          details: { step: key, runId: run.id },
        },
        tx,
      );
    });
    return this.studies.get(labId, studyId);
  }
}
