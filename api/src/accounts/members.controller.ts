import { Body, Controller, Delete, Get, HttpCode, HttpStatus, Param, ParseUUIDPipe, Patch } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import type { Member } from '@provenote/shared';
import type { AuthUser } from '../auth/auth.types';
import { CurrentUser } from '../auth/current-user.decorator';
import { ANY_LAB_ROLE, Roles } from '../auth/roles.decorator';
import { ChangeRoleDto } from './accounts.dto';
import { MembersService } from './members.service';

@ApiTags('members')
@Controller('labs/:labId/members')
export class MembersController {
  constructor(private readonly members: MembersService) {}

  /** Every member sees who else is in the lab; only a PI changes it. */
  @Roles(...ANY_LAB_ROLE)
  @Get()
  list(@Param('labId') labId: string): Promise<Member[]> {
    return this.members.list(labId);
  }

  @Roles('pi')
  @Patch(':membershipId')
  @HttpCode(HttpStatus.NO_CONTENT)
  changeRole(
    @Param('labId') labId: string,
    @Param('membershipId', new ParseUUIDPipe({ errorHttpStatusCode: HttpStatus.NOT_FOUND })) membershipId: string,
    @Body() body: ChangeRoleDto,
    @CurrentUser() user: AuthUser,
  ): Promise<void> {
    return this.members.changeRole(labId, membershipId, body.role, user);
  }

  @Roles('pi')
  @Delete(':membershipId')
  @HttpCode(HttpStatus.NO_CONTENT)
  remove(
    @Param('labId') labId: string,
    @Param('membershipId', new ParseUUIDPipe({ errorHttpStatusCode: HttpStatus.NOT_FOUND })) membershipId: string,
    @CurrentUser() user: AuthUser,
  ): Promise<void> {
    return this.members.remove(labId, membershipId, user);
  }
}
