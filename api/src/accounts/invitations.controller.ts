import { Body, Controller, Delete, Get, HttpCode, HttpStatus, Param, ParseUUIDPipe, Post } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import type { Invitation } from '@provenote/shared';
import type { AuthUser } from '../auth/auth.types';
import { CurrentUser } from '../auth/current-user.decorator';
import { Roles } from '../auth/roles.decorator';
import { InviteDto } from './accounts.dto';
import { InvitationsService } from './invitations.service';

const invitationId = () => new ParseUUIDPipe({ errorHttpStatusCode: HttpStatus.NOT_FOUND });

@ApiTags('members')
@Controller('labs/:labId/invitations')
export class InvitationsController {
  constructor(private readonly invitations: InvitationsService) {}

  @Roles('pi')
  @Get()
  list(@Param('labId') labId: string): Promise<Invitation[]> {
    return this.invitations.pending(labId);
  }

  @Roles('pi')
  @Post()
  @HttpCode(HttpStatus.NO_CONTENT)
  invite(@Param('labId') labId: string, @Body() body: InviteDto, @CurrentUser() user: AuthUser): Promise<void> {
    return this.invitations.invite(labId, body, user);
  }

  /** A new link (the old one stops working) and a new expiry. */
  @Roles('pi')
  @Post(':invitationId/resend')
  @HttpCode(HttpStatus.NO_CONTENT)
  resend(
    @Param('labId') labId: string,
    @Param('invitationId', invitationId()) id: string,
    @CurrentUser() user: AuthUser,
  ): Promise<void> {
    return this.invitations.resend(labId, id, user);
  }

  @Roles('pi')
  @Delete(':invitationId')
  @HttpCode(HttpStatus.NO_CONTENT)
  revoke(
    @Param('labId') labId: string,
    @Param('invitationId', invitationId()) id: string,
    @CurrentUser() user: AuthUser,
  ): Promise<void> {
    return this.invitations.revoke(labId, id, user);
  }
}
