import {
  ConflictException,
  Inject,
  Injectable,
  Logger,
  NotFoundException,
  ServiceUnavailableException,
} from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource } from 'typeorm';
import type { BundleList, BundleSummary } from '@provenote/shared';
import { enqueueRun, type RunQueue } from '@provenote/workers';
import { AuditService } from '../audit/audit.service';
import type { AuthUser } from '../auth/auth.types';
import { RUN_QUEUE } from '../queue/queue.module';
import { RunEntity } from '../runs/run.entity';
import { StudyStepEntity } from '../studies/study-step.entity';
import { StudyEntity } from '../studies/study.entity';
import { BundleEntity } from './bundle.entity';
import { bundleFilename, toBundleSummary } from './bundle-view';

const BUNDLE_RELATIONS = { run: true, createdBy: true } as const;

@Injectable()
export class BundlesService {
  private readonly logger = new Logger(BundlesService.name);

  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    @Inject(RUN_QUEUE) private readonly queue: RunQueue,
    private readonly audit: AuditService,
  ) {}

  private async study(labId: string, studyId: string): Promise<StudyEntity> {
    const study = await this.dataSource.getRepository(StudyEntity).findOne({ where: { id: studyId, labId } });
    if (!study) throw new NotFoundException('Study not found');
    return study;
  }

  /**
   * Queues the bundle job for a signed-off study's assign run. Only a signed-off study is exported: its
   * inputs, settings, results and overrides can no longer change under the bundle.
   */
  async build(labId: string, studyId: string, user: AuthUser): Promise<BundleSummary> {
    const study = await this.study(labId, studyId);
    if (!study.signedOffAt) {
      throw new ConflictException('Sign the study off first: a bundle records a finished, signed-off classification');
    }
    const assign = await this.dataSource.getRepository(StudyStepEntity).findOne({ where: { studyId, key: 'assign' } });
    const source = assign?.runId
      ? await this.dataSource.getRepository(RunEntity).findOne({ where: { id: assign.runId, labId } })
      : null;
    if (!source || source.status !== 'succeeded' || source.kind !== 'classify') {
      throw new ConflictException('This study has no finished assign run to put in a bundle');
    }
    const bundleId = await this.dataSource.transaction(async (manager) => {
      const run = await manager.save(
        manager.create(RunEntity, {
          labId,
          studyId,
          kind: 'bundle',
          parameters: source.parameters,
          seed: source.seed,
          createdBy: user.id,
        }),
      );
      const bundle = await manager.save(
        manager.create(BundleEntity, {
          labId,
          studyId,
          origin: 'built',
          runId: run.id,
          sourceRunId: source.id,
          filename: bundleFilename(study.name, new Date()),
          createdById: user.id,
        }),
      );
      await this.audit.record(
        {
          labId,
          actor: user,
          action: 'export.bundle_requested',
          target: { type: 'study', id: studyId },
          details: { bundleId: bundle.id, runId: run.id, assignRunId: source.id },
        },
        manager,
      );
      return bundle.id;
    });
    const bundle = await this.get(labId, bundleId);
    try {
      await enqueueRun(this.queue, 'bundle', bundle.runId!);
    } catch (error) {
      this.logger.error(`bundle run ${bundle.runId} could not be queued: ${(error as Error).message}`);
      await this.dataSource.getRepository(RunEntity).update(bundle.runId!, {
        status: 'failed',
        phase: 'failed',
        error: 'the job queue could not be reached; build the bundle again',
        finishedAt: new Date(),
      });
      throw new ServiceUnavailableException('The job queue is not reachable right now; try again in a moment');
    }
    return bundle;
  }

  async get(labId: string, bundleId: string): Promise<BundleSummary> {
    const bundle = await this.dataSource
      .getRepository(BundleEntity)
      .findOne({ where: { id: bundleId, labId }, relations: BUNDLE_RELATIONS });
    if (!bundle) throw new NotFoundException('Bundle not found');
    return toBundleSummary(bundle);
  }

  /** Newest first. */
  async list(labId: string, studyId: string): Promise<BundleList> {
    await this.study(labId, studyId);
    const bundles = await this.dataSource.getRepository(BundleEntity).find({
      where: { labId, studyId },
      relations: BUNDLE_RELATIONS,
      order: { createdAt: 'DESC', id: 'ASC' },
    });
    return { bundles: bundles.map(toBundleSummary) };
  }

  /** The zip as stored; every download is an export and goes into the audit log. */
  async download(labId: string, bundleId: string, user: AuthUser): Promise<{ filename: string; content: Buffer }> {
    const bundle = await this.dataSource
      .getRepository(BundleEntity)
      .createQueryBuilder('bundle')
      .addSelect('bundle.content')
      .where('bundle.id = :bundleId AND bundle.lab_id = :labId', { bundleId, labId })
      .getOne();
    if (!bundle) throw new NotFoundException('Bundle not found');
    if (!bundle.content)
      throw new ConflictException('This bundle is not built yet; follow its progress on the Export card');
    await this.audit.record({
      labId,
      actor: user,
      action: 'export.bundle_downloaded',
      target: { type: 'study', id: bundle.studyId },
      details: { bundleId: bundle.id, sha256: bundle.sha256, filename: bundle.filename },
    });
    return { filename: bundle.filename, content: bundle.content };
  }
}
