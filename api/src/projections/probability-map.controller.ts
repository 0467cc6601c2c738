import { Controller, Get, Param, ParseUUIDPipe } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import type { ProbabilityMap } from '@provenote/shared';
import { ANY_LAB_ROLE, Roles } from '../auth/roles.decorator';
import { ProbabilityMapService } from './probability-map.service';

const uuid = new ParseUUIDPipe({ version: '4', errorHttpStatusCode: 404 });

@ApiTags('runs')
@Controller('labs/:labId/runs/:runId/probability-map')
export class ProbabilityMapController {
  constructor(private readonly maps: ProbabilityMapService) {}

  @Roles(...ANY_LAB_ROLE)
  @Get()
  get(@Param('labId') labId: string, @Param('runId', uuid) runId: string): Promise<ProbabilityMap> {
    return this.maps.get(labId, runId);
  }
}
