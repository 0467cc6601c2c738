import { type BeforeApplicationShutdown, Global, Inject, Module } from '@nestjs/common';
import { createRunQueue, type RunQueue } from '@provenote/workers';
import { APP_CONFIG } from '../config/config.module';
import type { AppConfig } from '../config/config';
import { queuePrefix } from './queue-prefix';

export const RUN_QUEUE = Symbol('RUN_QUEUE');
export const QUEUE_PREFIX = Symbol('QUEUE_PREFIX');

/** The run queue (Bull on Redis) for enqueueing, and for processing where this process runs workers. */
@Global()
@Module({
  providers: [
    { provide: QUEUE_PREFIX, inject: [APP_CONFIG], useFactory: (config: AppConfig) => queuePrefix(config) },
    {
      provide: RUN_QUEUE,
      inject: [APP_CONFIG, QUEUE_PREFIX],
      useFactory: (config: AppConfig, prefix: string) =>
        createRunQueue({ redisUrl: config.REDIS_URL, prefix, lockDurationMs: config.QUEUE_LOCK_MS }),
    },
  ],
  exports: [RUN_QUEUE, QUEUE_PREFIX],
})
export class QueueModule implements BeforeApplicationShutdown {
  constructor(@Inject(RUN_QUEUE) private readonly queue: RunQueue) {}

  /**
   * Waits for the jobs this process is running to finish; the others stay queued for the next worker.
   * Before the shutdown phase, in which the database, Redis and mail connections close: a job still
   * running then could neither save its results nor hand itself back.
   */
  async beforeApplicationShutdown() {
    await this.queue.close();
  }
}
