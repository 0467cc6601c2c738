import { Body, Controller, Get, Param, ParseUUIDPipe, Patch, Post } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import type { ReferenceGroup, ReferenceGroupList } from '@provenote/shared';
import type { AuthUser } from '../auth/auth.types';
import { CurrentUser } from '../auth/current-user.decorator';
import { ANY_LAB_ROLE, Roles } from '../auth/roles.decorator';
import { CreateGroupDto, CreateGroupVersionDto, GroupsFromColumnDto, UpdateGroupDto } from './groups.dto';
import { GroupsService } from './groups.service';

const uuid = new ParseUUIDPipe({ version: '4', errorHttpStatusCode: 404 });

@ApiTags('reference groups')
@Controller('labs/:labId/groups')
export class GroupsController {
  constructor(private readonly groups: GroupsService) {}

  @Roles(...ANY_LAB_ROLE)
  @Get()
  list(@Param('labId') labId: string): Promise<ReferenceGroupList> {
    return this.groups.list(labId);
  }

  @Roles(...ANY_LAB_ROLE)
  @Get(':groupId')
  get(@Param('labId') labId: string, @Param('groupId', uuid) groupId: string): Promise<ReferenceGroup> {
    return this.groups.get(labId, groupId);
  }

  @Roles('pi', 'analyst')
  @Post()
  create(@Param('labId') labId: string, @Body() body: CreateGroupDto, @CurrentUser() user: AuthUser) {
    return this.groups.create(labId, body, user);
  }

  @Roles('pi', 'analyst')
  @Post('from-column')
  fromColumn(
    @Param('labId') labId: string,
    @Body() body: GroupsFromColumnDto,
    @CurrentUser() user: AuthUser,
  ): Promise<ReferenceGroupList> {
    return this.groups.fromColumn(labId, body.datasetVersionId, user);
  }

  @Roles('pi', 'analyst')
  @Patch(':groupId')
  update(
    @Param('labId') labId: string,
    @Param('groupId', uuid) groupId: string,
    @Body() body: UpdateGroupDto,
    @CurrentUser() user: AuthUser,
  ): Promise<ReferenceGroup> {
    return this.groups.update(labId, groupId, body, user);
  }

  @Roles('pi', 'analyst')
  @Post(':groupId/versions')
  addVersion(
    @Param('labId') labId: string,
    @Param('groupId', uuid) groupId: string,
    @Body() body: CreateGroupVersionDto,
    @CurrentUser() user: AuthUser,
  ): Promise<ReferenceGroup> {
    return this.groups.addVersion(labId, groupId, body, user);
  }

  @Roles('pi', 'analyst')
  @Post(':groupId/versions/:versionId/approve')
  approve(
    @Param('labId') labId: string,
    @Param('groupId', uuid) groupId: string,
    @Param('versionId', uuid) versionId: string,
    @CurrentUser() user: AuthUser,
  ): Promise<ReferenceGroup> {
    return this.groups.approve(labId, groupId, versionId, user);
  }
}
