import { Controller, Get, HttpStatus, Res } from '@nestjs/common';
import { ApiOkResponse, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import { Public } from '../common/public.decorator';
import { HealthService } from './health.service';

@ApiTags('health')
@Controller('health')
export class HealthController {
  constructor(private readonly health: HealthService) {}

  /** Database and queue state; 503 when either is down, so load balancers can act on it. */
  @Public()
  @Get()
  @ApiOkResponse({ description: 'Database and queue reachable' })
  async get(@Res({ passthrough: true }) res: Response) {
    const health = await this.health.check();
    if (health.status !== 'ok') res.status(HttpStatus.SERVICE_UNAVAILABLE);
    return health;
  }
}
