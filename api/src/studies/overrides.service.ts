import { BadRequestException, Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource } from 'typeorm';
import { applyStepEdit, type AssignmentVerdict, type CreateOverride, type Override } from '@provenote/shared';
import { AuditService } from '../audit/audit.service';
import type { AuthUser, LabMembership } from '../auth/auth.types';
import { RunAssignmentEntity } from '../runs/run-assignment.entity';
import { assertMayEdit } from './study-access';
import { StudyOverrideEntity } from './study-override.entity';
import { StudyStepEntity } from './study-step.entity';
import { StudiesService } from './studies.service';

const toOverride = (o: StudyOverrideEntity): Override => ({
  id: o.id,
  runId: o.runId,
  sampleId: o.sampleId,
  computedVerdict: o.computedVerdict,
  computedGroup: o.computedGroup,
  verdict: o.verdict,
  group: o.groupName,
  reason: o.reason,
  createdBy: o.createdBy?.displayName ?? null,
  createdAt: o.createdAt.toISOString(),
});

/**
 * The analyst's final verdicts. The computed verdict is copied from the assign run beside the final one,
 * so the record shows both; a second override of the same sample replaces the first, and the audit log
 * keeps every one.
 */
@Injectable()
export class OverridesService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly studies: StudiesService,
    private readonly audit: AuditService,
  ) {}

  /** The overrides of the study's current assign run. */
  async list(labId: string, studyId: string): Promise<{ overrides: Override[] }> {
    const { steps } = await this.studies.load(labId, studyId);
    const runId = steps.find((s) => s.key === 'assign')?.runId;
    if (!runId) return { overrides: [] };
    const rows = await this.dataSource.getRepository(StudyOverrideEntity).find({
      where: { studyId, runId },
      relations: { createdBy: true },
      order: { sampleId: 'ASC' },
    });
    return { overrides: rows.map(toOverride) };
  }

  async create(labId: string, studyId: string, input: CreateOverride, membership: LabMembership, user: AuthUser) {
    await this.dataSource.transaction(async (manager) => {
      const { study, steps } = await this.studies.load(labId, studyId, manager);
      assertMayEdit(study, membership, user);
      const assign = steps.find((s) => s.key === 'assign');
      if (!assign?.runId || assign.status !== 'current') {
        throw new BadRequestException('Verdicts can be overridden once the Assign card is current');
      }
      const computed = await manager
        .getRepository(RunAssignmentEntity)
        .findOne({ where: { runId: assign.runId, sampleId: input.sampleId } });
      if (!computed) throw new BadRequestException(`Sample "${input.sampleId}" is not among this run's unknowns`);
      const computedVerdict = computed.verdict as AssignmentVerdict;
      await manager
        .createQueryBuilder()
        .insert()
        .into(StudyOverrideEntity)
        .values({
          studyId,
          runId: assign.runId,
          sampleId: input.sampleId,
          computedVerdict,
          computedGroup: computedVerdict === 'unassigned' ? null : computed.groupName,
          verdict: input.verdict,
          groupName: input.group,
          reason: input.reason,
          createdById: user.id,
        })
        .orUpdate(['verdict', 'group_name', 'reason', 'created_by', 'created_at'], ['study_id', 'run_id', 'sample_id'])
        .execute();
      // An override changes the results below Review: a bundle built before it is out of date.
      const after = applyStepEdit(steps, 'review');
      for (const [i, step] of after.entries()) {
        if (step.status !== steps[i].status)
          await manager.getRepository(StudyStepEntity).update(step.id, { status: step.status });
      }
      await this.audit.record(
        {
          labId,
          actor: user,
          action: 'study.verdict_overridden',
          target: { type: 'study', id: studyId },
          details: {
            runId: assign.runId,
            sampleId: input.sampleId,
            computed: { verdict: computedVerdict, group: computed.groupName },
            final: { verdict: input.verdict, group: input.group },
            reason: input.reason,
          },
        },
        manager,
      );
    });
    return this.list(labId, studyId);
  }
}
