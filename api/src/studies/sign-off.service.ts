import { BadRequestException, Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource } from 'typeorm';
import { stepBlocker, type SignOff, type Study } from '@provenote/shared';
import { AuditService } from '../audit/audit.service';
import type { AuthUser } from '../auth/auth.types';
import { assertWritable } from './study-access';
import { StudyEntity } from './study.entity';
import { StudiesService } from './studies.service';

@Injectable()
export class SignOffService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly studies: StudiesService,
    private readonly audit: AuditService,
  ) {}

  /**
   * The PI's sign-off: allowed once every card up to Review is current, and final — from then on every
   * write route refuses to change the study (its inputs, settings, results and overrides).
   */
  async signOff(labId: string, studyId: string, input: SignOff, user: AuthUser): Promise<Study> {
    await this.dataSource.transaction(async (manager) => {
      // Lock first, so a card saved at the same moment cannot slip in under the signature.
      await manager
        .getRepository(StudyEntity)
        .findOne({ where: { id: studyId, labId }, lock: { mode: 'pessimistic_write' } });
      const { study, steps } = await this.studies.load(labId, studyId, manager);
      assertWritable(study);
      const blocker = stepBlocker(steps, 'export');
      if (blocker) throw new BadRequestException(`The study cannot be signed off yet: ${blocker}`);
      await manager
        .getRepository(StudyEntity)
        .update(study.id, { signedOffAt: new Date(), signedOffById: user.id, signOffStatement: input.statement });
      const assign = steps.find((step) => step.key === 'assign');
      await this.audit.record(
        {
          labId,
          actor: user,
          action: 'study.signed_off',
          target: { type: 'study', id: study.id },
          details: { assignRunId: assign?.runId ?? null, statement: input.statement },
        },
        manager,
      );
    });
    return this.studies.get(labId, studyId);
  }
}
