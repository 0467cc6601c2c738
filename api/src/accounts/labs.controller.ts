import { Body, Controller, Get, Param, Patch, Post } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import type { LabDetail } from '@provenote/shared';
import type { AuthUser, LabMembership } from '../auth/auth.types';
import { CurrentMembership, CurrentUser } from '../auth/current-user.decorator';
import { ANY_LAB_ROLE, Roles, SignedIn } from '../auth/roles.decorator';
import { LabInputDto } from './accounts.dto';
import { LabsService } from './labs.service';

@ApiTags('labs')
@Controller('labs')
export class LabsController {
  constructor(private readonly labs: LabsService) {}

  /** Anyone signed in may start a lab of their own, and becomes its PI. */
  @SignedIn()
  @Post()
  async create(@Body() body: LabInputDto, @CurrentUser() user: AuthUser): Promise<LabDetail> {
    const lab = await this.labs.create(body.name, user);
    return this.labs.get(lab.id, 'pi');
  }

  @Roles(...ANY_LAB_ROLE)
  @Get(':labId')
  get(@Param('labId') labId: string, @CurrentMembership() membership: LabMembership): Promise<LabDetail> {
    return this.labs.get(labId, membership.role);
  }

  @Roles('pi')
  @Patch(':labId')
  async rename(
    @Param('labId') labId: string,
    @Body() body: LabInputDto,
    @CurrentMembership() membership: LabMembership,
    @CurrentUser() user: AuthUser,
  ): Promise<LabDetail> {
    await this.labs.rename(labId, body.name, user);
    return this.labs.get(labId, membership.role);
  }
}
