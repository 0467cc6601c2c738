import { Body, Controller, Get, HttpCode, HttpStatus, Inject, Param, Post, Req, Res } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import { mailTokenSchema, type InvitationPreview } from '@provenote/shared';
import type { AuthenticatedRequest } from '../auth/auth.types';
import { Public } from '../auth/roles.decorator';
import { setSessionCookie } from '../auth/session-cookies';
import { SessionService } from '../auth/session.service';
import { APP_CONFIG } from '../config/config.module';
import type { AppConfig } from '../config/config';
import { AcceptInvitationDto } from './accounts.dto';
import { InvitationsService } from './invitations.service';

/** The invitation link from the mail: public, because the person following it may have no account yet. */
@ApiTags('members')
@Controller('invitations/:token')
export class InvitationLinksController {
  constructor(
    private readonly invitations: InvitationsService,
    private readonly sessions: SessionService,
    @Inject(APP_CONFIG) private readonly config: AppConfig,
  ) {}

  @Public()
  @Get()
  preview(@Param('token') token: string): Promise<InvitationPreview> {
    return this.invitations.preview(mailTokenSchema.parse(token));
  }

  /** Joins the lab and signs in as the invited address. */
  @Public()
  @Post('accept')
  @HttpCode(HttpStatus.OK)
  async accept(
    @Param('token') token: string,
    @Body() body: AcceptInvitationDto,
    @Req() req: AuthenticatedRequest,
    @Res({ passthrough: true }) res: Response,
  ) {
    const accepted = await this.invitations.accept(mailTokenSchema.parse(token), body, req.ip ?? 'unknown');
    if (req.sessionId) await this.sessions.end(req.sessionId);
    const session = await this.sessions.create(accepted.user.id);
    setSessionCookie(res, this.config, session.token, session.expiresAt);
    return accepted;
  }
}
