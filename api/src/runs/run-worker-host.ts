import { Inject, Injectable, Logger, type OnApplicationBootstrap } from '@nestjs/common';
import type Redis from 'ioredis';
import { createBundleProcessor, runProcessors, startRunWorker, type RunQueue } from '@provenote/workers';
import { PgBundleSource } from '../bundles/pg-bundle-source';
import { APP_CONFIG } from '../config/config.module';
import type { AppConfig } from '../config/config';
import { QUEUE_PREFIX, RUN_QUEUE } from '../queue/queue.module';
import { REDIS } from '../redis/redis.module';
import { PgRunStore } from './pg-run-store';
import { RunEndedNotifier } from './run-ended-notifier';

export const RUN_WORKERS_ENABLED = Symbol('RUN_WORKERS_ENABLED');

/** Runs the job processors in this process when it is a worker (WORKERS=embedded, or `npm run worker`). */
@Injectable()
export class RunWorkerHost implements OnApplicationBootstrap {
  private readonly logger = new Logger('RunWorker');

  constructor(
    @Inject(RUN_WORKERS_ENABLED) private readonly enabled: boolean,
    @Inject(RUN_QUEUE) private readonly queue: RunQueue,
    @Inject(QUEUE_PREFIX) private readonly prefix: string,
    @Inject(REDIS) private readonly redis: Redis,
    @Inject(APP_CONFIG) private readonly config: AppConfig,
    private readonly store: PgRunStore,
    private readonly notifier: RunEndedNotifier,
    private readonly bundleSource: PgBundleSource,
  ) {}

  onApplicationBootstrap() {
    if (!this.enabled) return;
    startRunWorker({
      queue: this.queue,
      store: this.store,
      redis: this.redis,
      prefix: this.prefix,
      concurrency: this.config.WORKER_CONCURRENCY,
      processors: { ...runProcessors, bundle: createBundleProcessor(this.bundleSource) },
      onRunFinished: (event) => this.notifier.runEnded(event),
      log: (message) => this.logger.warn(message),
    });
    this.logger.log(`processing runs (${this.config.WORKER_CONCURRENCY} at a time, queue ${this.prefix})`);
  }
}
