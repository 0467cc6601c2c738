import { type DynamicModule, Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { PgBundleSource } from '../bundles/pg-bundle-source';
import { APP_CONFIG } from '../config/config.module';
import type { AppConfig } from '../config/config';
import { PgRunStore } from './pg-run-store';
import { RunAssignmentEntity } from './run-assignment.entity';
import { RunCheckMemberEntity } from './run-check-member.entity';
import { RunCheckPairEntity } from './run-check-pair.entity';
import { MailService } from '../mail/mail.service';
import { RUN_MAILER, RunEndedNotifier } from './run-ended-notifier';
import { RunGroupEntity } from './run-group.entity';
import { RunInputEntity } from './run-input.entity';
import { RunWorkerHost, RUN_WORKERS_ENABLED } from './run-worker-host';
import { RunEntity } from './run.entity';

const entities = [
  RunEntity,
  RunInputEntity,
  RunGroupEntity,
  RunAssignmentEntity,
  RunCheckMemberEntity,
  RunCheckPairEntity,
];

/**
 * Runs in the database and the processors that compute them, started in this process when it is a
 * worker process (`workerProcess`) or the API with WORKERS=embedded.
 */
@Module({})
export class RunsCoreModule {
  static forRoot({ workerProcess }: { workerProcess: boolean }): DynamicModule {
    return {
      module: RunsCoreModule,
      imports: [TypeOrmModule.forFeature(entities)],
      providers: [
        PgRunStore,
        PgBundleSource,
        RunEndedNotifier,
        // MailModule is global in the api and imported by the worker process.
        { provide: RUN_MAILER, useExisting: MailService },
        RunWorkerHost,
        {
          provide: RUN_WORKERS_ENABLED,
          inject: [APP_CONFIG],
          useFactory: (config: AppConfig) => workerProcess || config.WORKERS === 'embedded',
        },
      ],
      exports: [PgRunStore, TypeOrmModule],
    };
  }
}
