import { type DynamicModule, Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import type { AppConfig } from '../config/config';
import { AppConfigModule } from '../config/config.module';
import { dataSourceOptions } from '../database/typeorm-options';
import { MailModule } from '../mail/mail.module';
import { RedisModule } from '../redis/redis.module';
import { RunsCoreModule } from '../runs/runs-core.module';
import { QueueModule } from './queue.module';

/** A worker process: the database, Redis, the queue and the processors; no HTTP. */
@Module({})
export class WorkerModule {
  static forRoot(config: AppConfig): DynamicModule {
    return {
      module: WorkerModule,
      imports: [
        AppConfigModule.forRoot(config),
        TypeOrmModule.forRoot({ ...dataSourceOptions(config.DATABASE_URL), autoLoadEntities: true }),
        RedisModule,
        MailModule,
        QueueModule,
        RunsCoreModule.forRoot({ workerProcess: true }),
      ],
    };
  }
}
