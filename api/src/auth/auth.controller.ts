import { Body, Controller, Get, HttpCode, HttpStatus, Inject, Post, Req, Res } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import type { DemoAccounts, MailSent } from '@provenote/shared';
import { APP_CONFIG } from '../config/config.module';
import type { AppConfig } from '../config/config';
import type { AuthenticatedRequest } from './auth.types';
import { ConfirmSignUpDto, RequestPasswordResetDto, ResetPasswordDto, SignInDto, SignUpDto } from './auth.dto';
import { DemoAccountsService } from './demo-accounts.service';
import { PasswordResetService } from './password-reset.service';
import { Public } from './roles.decorator';
import { clearSessionCookie, setSessionCookie } from './session-cookies';
import { SessionService } from './session.service';
import { SignInService } from './sign-in.service';
import { SignUpService } from './sign-up.service';

@ApiTags('auth')
@Controller('auth')
export class AuthController {
  constructor(
    private readonly signInService: SignInService,
    private readonly sessions: SessionService,
    private readonly signUpService: SignUpService,
    private readonly passwordReset: PasswordResetService,
    private readonly demoAccounts: DemoAccountsService,
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

  @Public()
  @Post('sign-up')
  @HttpCode(HttpStatus.ACCEPTED)
  signUp(@Body() body: SignUpDto, @Req() req: AuthenticatedRequest): Promise<MailSent> {
    return this.signUpService.request(body, req.ip ?? 'unknown');
  }

  /** Follows the link of the sign-up mail: creates the account and its lab, and signs in. */
  @Public()
  @Post('sign-up/confirm')
  @HttpCode(HttpStatus.OK)
  async confirmSignUp(@Body() body: ConfirmSignUpDto, @Res({ passthrough: true }) res: Response) {
    const { user, token, expiresAt } = await this.signUpService.confirm(body.token);
    setSessionCookie(res, this.config, token, expiresAt);
    return { user };
  }

  @Public()
  @Post('password-reset')
  @HttpCode(HttpStatus.ACCEPTED)
  requestPasswordReset(@Body() body: RequestPasswordResetDto, @Req() req: AuthenticatedRequest): Promise<MailSent> {
    return this.passwordReset.request(body.email, req.ip ?? 'unknown');
  }

  /** Follows the link of the reset mail; every session of the account ends, so sign in afterwards. */
  @Public()
  @Post('password-reset/confirm')
  @HttpCode(HttpStatus.NO_CONTENT)
  async resetPassword(@Body() body: ResetPasswordDto, @Res({ passthrough: true }) res: Response) {
    await this.passwordReset.reset(body.token, body.password);
    clearSessionCookie(res, this.config);
  }

  /** Shown on the sign-in page of a local installation with demo data; empty everywhere else. */
  @Public()
  @Get('demo-accounts')
  listDemoAccounts(): Promise<DemoAccounts> {
    return this.demoAccounts.list();
  }
}
