import { DynamicModule, Module } from '@nestjs/common';
import { APP_FILTER, APP_PIPE } from '@nestjs/core';
import { TypeOrmModule } from '@nestjs/typeorm';
import { ZodValidationPipe } from 'nestjs-zod';
import { AccountsModule } from './accounts/accounts.module';
import { AuditModule } from './audit/audit.module';
import { AuthModule } from './auth/auth.module';
import { BundlesModule } from './bundles/bundles.module';
import { AllExceptionsFilter } from './common/all-exceptions.filter';
import type { AppConfig } from './config/config';
import { AppConfigModule } from './config/config.module';
import { dataSourceOptions } from './database/typeorm-options';
import { DatasetsModule } from './datasets/datasets.module';
import { GroupsModule } from './groups/groups.module';
import { HealthModule } from './health/health.module';
import { MailModule } from './mail/mail.module';
import { ProjectionsModule } from './projections/projections.module';
import { RateLimitModule } from './rate-limit/rate-limit.module';
import { RedisModule } from './redis/redis.module';
import { StudiesModule } from './studies/studies.module';
import { RunsModule } from './runs/runs.module';

@Module({})
export class AppModule {
  static forRoot(config: AppConfig): DynamicModule {
    return {
      module: AppModule,
      imports: [
        AppConfigModule.forRoot(config),
        TypeOrmModule.forRoot({ ...dataSourceOptions(config.DATABASE_URL), autoLoadEntities: true }),
        RedisModule,
        RateLimitModule,
        MailModule,
        AuditModule,
        AuthModule,
        AccountsModule,
        HealthModule,
        DatasetsModule,
        GroupsModule,
        StudiesModule,
        RunsModule,
        BundlesModule,
        ProjectionsModule,
      ],
      providers: [
        { provide: APP_PIPE, useClass: ZodValidationPipe },
        { provide: APP_FILTER, useClass: AllExceptionsFilter },
      ],
    };
  }
}
