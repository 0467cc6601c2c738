import { Module, type OnApplicationShutdown, type OnModuleInit } from '@nestjs/common';
import type Redis from 'ioredis';
import { QUEUE_PREFIX, QueueModule } from '../queue/queue.module';
import { REDIS } from '../redis/redis.module';
import { AssignmentsService } from './assignments.service';
import { RunEventsRelay } from './run-events.relay';
import { RunsController } from './runs.controller';
import { RunsCoreModule } from './runs-core.module';
import { RunsService } from './runs.service';

/** Runs over HTTP: create, read, list, cancel, results, and progress as server-sent events. */
@Module({
  imports: [QueueModule, RunsCoreModule.forRoot({ workerProcess: false })],
  controllers: [RunsController],
  providers: [
    RunsService,
    AssignmentsService,
    {
      provide: RunEventsRelay,
      inject: [REDIS, QUEUE_PREFIX],
      useFactory: (redis: Redis, prefix: string) => new RunEventsRelay(redis, prefix),
    },
  ],
})
export class RunsModule implements OnModuleInit, OnApplicationShutdown {
  constructor(private readonly relay: RunEventsRelay) {}

  onModuleInit() {
    return this.relay.start();
  }

  onApplicationShutdown() {
    return this.relay.stop();
  }
}
