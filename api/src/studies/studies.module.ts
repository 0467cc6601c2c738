import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { DatasetsModule } from '../datasets/datasets.module';
import { GroupsModule } from '../groups/groups.module';
import { CheckResultsService } from './check-results.service';
import { OverridesService } from './overrides.service';
import { SignOffService } from './sign-off.service';
import { StepsService } from './steps.service';
import { StudiesController } from './studies.controller';
import { StudiesService } from './studies.service';
import { StudyDatasetUsage } from './study-dataset-usage';
import { StudyRunsService } from './study-runs.service';
import { StudyOverrideEntity } from './study-override.entity';
import { StudyStepEntity } from './study-step.entity';
import { StudyEntity } from './study.entity';

@Module({
  imports: [
    TypeOrmModule.forFeature([StudyEntity, StudyStepEntity, StudyOverrideEntity]),
    GroupsModule,
    DatasetsModule,
  ],
  controllers: [StudiesController],
  providers: [
    StudiesService,
    StepsService,
    SignOffService,
    StudyRunsService,
    OverridesService,
    StudyDatasetUsage,
    CheckResultsService,
  ],
  exports: [StudiesService],
})
export class StudiesModule {}
