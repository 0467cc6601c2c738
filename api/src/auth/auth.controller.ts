import { Body, Controller, Get, HttpCode, HttpStatus, Inject, Post, Req, Res } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import { APP_CONFIG } from '../config/config.module';
import type { AppConfig } from '../config/config';
import type { AuthenticatedRequest } from './auth.types';
import { SignInDto } from './auth.dto';
import { Public } from './roles.decorator';
import { clearSessionCookie, setSessionCookie } from './session-cookies';
import { SessionService } from './session.service';
import { SignInService } from './sign-in.service';

@ApiTags('auth')
@Controller('auth')
export class AuthController {
  constructor(
    private readonly signInService: SignInService,
    private readonly sessions: SessionService,
    @Inject(APP_CONFIG) private readonly config: AppConfig,
  ) {}

  /** The CSRF token to echo as X-CSRF-Token (also readable from the provenote_csrf cookie). */
  @Public()
  @Get('csrf')
  csrf(@Req() req: AuthenticatedRequest) {
    return { csrfToken: req.csrfToken };
  }

  @Public()
  @Post('sign-in')
  @HttpCode(HttpStatus.OK)
  async signIn(@Body() body: SignInDto, @Req() req: AuthenticatedRequest, @Res({ passthrough: true }) res: Response) {
    const { user, token, expiresAt } = await this.signInService.signIn(body, req.ip ?? 'unknown');
    setSessionCookie(res, this.config, token, expiresAt);
    return { user };
  }

  /** Public so that signing out with an expired session still clears the cookie. */
  @Public()
  @Post('sign-out')
  @HttpCode(HttpStatus.NO_CONTENT)
  async signOut(@Req() req: AuthenticatedRequest, @Res({ passthrough: true }) res: Response) {
    if (req.sessionId) await this.sessions.end(req.sessionId);
    clearSessionCookie(res, this.config);
  }
}
