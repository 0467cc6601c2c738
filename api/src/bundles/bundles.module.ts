import { Module } from '@nestjs/common';
import { MulterModule } from '@nestjs/platform-express';
import { TypeOrmModule } from '@nestjs/typeorm';
import { APP_CONFIG } from '../config/config.module';
import type { AppConfig } from '../config/config';
import { QueueModule } from '../queue/queue.module';
import { BundleEntity } from './bundle.entity';
import { BundleRestoreService } from './bundle-restore.service';
import { BundlesController } from './bundles.controller';
import { BundlesService } from './bundles.service';

/** Result bundles over HTTP; the bundle job itself runs with the other processors (RunsCoreModule). */
@Module({
  imports: [
    TypeOrmModule.forFeature([BundleEntity]),
    QueueModule,
    // Memory storage: a bundle is verified and stored whole, so a temporary file would only add a copy.
    MulterModule.registerAsync({
      inject: [APP_CONFIG],
      useFactory: (config: AppConfig) => ({
        limits: { fileSize: Math.round(config.UPLOAD_LIMIT_MB * 1024 * 1024), files: 1 },
      }),
    }),
  ],
  controllers: [BundlesController],
  providers: [BundlesService, BundleRestoreService],
})
export class BundlesModule {}
