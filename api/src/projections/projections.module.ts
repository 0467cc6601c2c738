import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { ProjectionsController } from './projections.controller';
import { ProjectionsService } from './projections.service';
import { RunProjectionEntity } from './run-projection.entity';

/** Serves the projections the classify processor stores with its results. */
@Module({
  imports: [TypeOrmModule.forFeature([RunProjectionEntity])],
  controllers: [ProjectionsController],
  providers: [ProjectionsService],
})
export class ProjectionsModule {}
