import { Controller, Get, Param, ParseUUIDPipe, Query } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import { projectionQuerySchema, type Projection } from '@provenote/shared';
import { ANY_LAB_ROLE, Roles } from '../auth/roles.decorator';
import { ProjectionsService } from './projections.service';

const uuid = new ParseUUIDPipe({ version: '4', errorHttpStatusCode: 404 });

@ApiTags('runs')
@Controller('labs/:labId/runs/:runId/projection')
export class ProjectionsController {
  constructor(private readonly projections: ProjectionsService) {}

  @Roles(...ANY_LAB_ROLE)
  @Get()
  get(
    @Param('labId') labId: string,
    @Param('runId', uuid) runId: string,
    @Query() query: Record<string, unknown>,
  ): Promise<Projection> {
    return this.projections.get(labId, runId, projectionQuerySchema.parse(query));
  }
}
