import { randomInt } from 'node:crypto';
import {
  ConflictException,
  ForbiddenException,
  Inject,
  Injectable,
  Logger,
  NotFoundException,
  ServiceUnavailableException,
} from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import type Redis from 'ioredis';
import { DataSource } from 'typeorm';
import { isFinishedRunStatus, type CreateRunRequest, type LabRole, type Run } from '@provenote/shared';
import { enqueueRun, publishRunEvent, removeWaitingRun, requestCancel, type RunQueue } from '@provenote/workers';
import { QUEUE_PREFIX, RUN_QUEUE } from '../queue/queue.module';
import { REDIS } from '../redis/redis.module';
import { PgRunStore } from './pg-run-store';
import { RunEntity } from './run.entity';
import { toRun } from './run.mapper';
import { type RunStart, writeAllRunInputs } from './run-inputs.writer';

/**
 * Who may start which kind of run. A group check only computes and changes no group, so a student may
 * run one before assigning; excluding members (vetting the groups) stays with analysts and PIs.
 */
const STARTERS: Record<CreateRunRequest['kind'], readonly LabRole[]> = {
  classify: ['pi', 'analyst', 'student'],
  'group-check': ['pi', 'analyst', 'student'],
};

const LIST_LIMIT = 100;

@Injectable()
export class RunsService {
  private readonly logger = new Logger(RunsService.name);

  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    @Inject(RUN_QUEUE) private readonly queue: RunQueue,
    @Inject(QUEUE_PREFIX) private readonly prefix: string,
    @Inject(REDIS) private readonly redis: Redis,
    private readonly store: PgRunStore,
  ) {}

  /** Stores the run and its input snapshot in one transaction, then puts it on the queue. */
  async create(labId: string, userId: string, role: LabRole, request: RunStart): Promise<Run> {
    if (!STARTERS[request.kind].includes(role)) {
      throw new ForbiddenException(`Your role in this lab (${role}) may not start a ${request.kind} run`);
    }
    const { parameters } = request;
    // A robust fit draws random subsets: a seed is chosen now and kept, so the run can be repeated.
    const seed = parameters.seed ?? (parameters.covariance === 'mcd' ? randomInt(2 ** 31 - 1) : null);
    const runId = await this.dataSource.transaction(async (manager) => {
      const run = await manager.save(
        manager.create(RunEntity, {
          labId,
          studyId: request.studyId ?? null,
          kind: request.kind,
          parameters: { ...parameters, ...(seed === null ? {} : { seed }) },
          seed,
          createdBy: userId,
        }),
      );
      await writeAllRunInputs(manager, run.id, request);
      return run.id;
    });
    try {
      await enqueueRun(this.queue, request.kind, runId);
    } catch (error) {
      this.logger.error(`run ${runId} could not be queued: ${error instanceof Error ? error.message : error}`);
      await this.store.markFailed(runId, 'the job queue could not be reached; start the run again');
      throw new ServiceUnavailableException('The job queue is not reachable right now; try again in a moment');
    }
    return this.get(labId, runId);
  }

  async get(labId: string, runId: string): Promise<Run> {
    const run = await this.dataSource.getRepository(RunEntity).findOne({ where: { id: runId, labId } });
    if (!run) throw new NotFoundException('Run not found');
    return toRun(run);
  }

  async list(labId: string): Promise<Run[]> {
    const runs = await this.dataSource
      .getRepository(RunEntity)
      .find({ where: { labId }, order: { createdAt: 'DESC' }, take: LIST_LIMIT });
    return runs.map(toRun);
  }

  /**
   * A run no worker holds is taken off the queue and cancelled at once; a running one is flagged and
   * stops at its next checkpoint, keeping no partial results.
   */
  async cancel(labId: string, runId: string): Promise<Run> {
    const run = await this.get(labId, runId);
    if (isFinishedRunStatus(run.status)) throw new ConflictException(`This run has already ${run.status}`);
    await requestCancel(this.redis, this.prefix, runId);
    const job = await this.queue.getJob(runId);
    const active = job ? (await job.getState()) === 'active' : false;
    if (!active && (!job || (await removeWaitingRun(this.queue, runId)))) {
      const event = await this.store.markCancelled(runId);
      if (event) await publishRunEvent(this.redis, this.prefix, event);
    }
    return this.get(labId, runId);
  }
}
