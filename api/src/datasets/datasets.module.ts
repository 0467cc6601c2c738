import { Module } from '@nestjs/common';
import { MulterModule } from '@nestjs/platform-express';
import { TypeOrmModule } from '@nestjs/typeorm';
import { APP_CONFIG } from '../config/config.module';
import type { AppConfig } from '../config/config';
import { DatasetFile } from './dataset-file.entity';
import { DatasetFilesController } from './dataset-files.controller';
import { DatasetFilesService } from './dataset-files.service';
import { DatasetProblem } from './dataset-problem.entity';
import { DatasetReadsService } from './dataset-reads.service';
import { DatasetRow } from './dataset-row.entity';
import { DatasetUsageRegistry } from './dataset-usage';
import { DatasetVersion } from './dataset-version.entity';
import { Dataset } from './dataset.entity';
import { DatasetsController } from './datasets.controller';
import { DatasetsService } from './datasets.service';
import { SavedMapping } from './saved-mapping.entity';

/**
 * Data import: files in, immutable dataset versions out. Other modules read versions through
 * DatasetReadsService (or the dataset_rows table) and register what pins a version with DatasetUsageRegistry.
 */
@Module({
  imports: [
    TypeOrmModule.forFeature([Dataset, DatasetVersion, DatasetFile, DatasetRow, DatasetProblem, SavedMapping]),
    // Memory storage: the bytes are hashed and stored in PostgreSQL whole, so a temporary file would only add a copy.
    MulterModule.registerAsync({
      inject: [APP_CONFIG],
      useFactory: (config: AppConfig) => ({
        limits: { fileSize: Math.round(config.UPLOAD_LIMIT_MB * 1024 * 1024), files: 1 },
      }),
    }),
  ],
  controllers: [DatasetsController, DatasetFilesController],
  providers: [DatasetsService, DatasetFilesService, DatasetReadsService, DatasetUsageRegistry],
  exports: [DatasetsService, DatasetReadsService, DatasetUsageRegistry],
})
export class DatasetsModule {}
