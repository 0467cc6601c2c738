import { Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { ProbabilityMapController } from './probability-map.controller';
import { ProbabilityMapService } from './probability-map.service';
import { ProjectionsController } from './projections.controller';
import { ProjectionsService } from './projections.service';
import { RunProjectionEntity } from './run-projection.entity';

/** Serves the projections the classify processor stores with its results, and the probability heat map. */
@Module({
  imports: [TypeOrmModule.forFeature([RunProjectionEntity])],
  controllers: [ProjectionsController, ProbabilityMapController],
  providers: [ProjectionsService, ProbabilityMapService],
})
export class ProjectionsModule {}
