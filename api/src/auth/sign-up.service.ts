import { ConflictException, Inject, Injectable } from '@nestjs/common';
import { InjectDataSource, InjectRepository } from '@nestjs/typeorm';
import { DataSource, Repository } from 'typeorm';
import type { MailSent, SignUp } from '@provenote/shared';
import { LabsService } from '../accounts/labs.service';
import { User } from '../accounts/user.entity';
import { APP_CONFIG } from '../config/config.module';
import type { AppConfig } from '../config/config';
import { MailService } from '../mail/mail.service';
import { RateLimitService } from '../rate-limit/rate-limit.service';
import type { AuthUser } from './auth.types';
import { MailTokenService } from './mail-token.service';
import { hashPassword } from './passwords';
import { SessionService } from './session.service';

export const SIGN_UP_MAIL_SENT: MailSent = {
  message: 'We sent a link to that address. Open it within 24 hours to finish creating your account.',
};
const CONFIRM_TTL_MS = 24 * 60 * 60 * 1000;

/**
 * Sign-up always answers the same and proves the address by a link: a new address gets a confirmation
 * link, an address that has an account gets a note saying so, so the answer reveals nothing.
 */
@Injectable()
export class SignUpService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    @InjectRepository(User) private readonly users: Repository<User>,
    private readonly tokens: MailTokenService,
    private readonly mail: MailService,
    private readonly labs: LabsService,
    private readonly sessions: SessionService,
    private readonly rateLimits: RateLimitService,
    @Inject(APP_CONFIG) private readonly config: AppConfig,
  ) {}

  async request(body: SignUp, ip: string): Promise<MailSent> {
    await this.rateLimits.consume({ key: `sign-up:ip:${ip}`, limit: 20, windowSeconds: 3600 });
    await this.rateLimits.consume({ key: `sign-up:email:${body.email}`, limit: 3, windowSeconds: 3600 });
    const passwordHash = await hashPassword(body.password);
    const existing = await this.users.findOne({ where: { email: body.email } });
    if (existing?.passwordHash) {
      await this.mail.send({
        to: body.email,
        subject: 'You already have a Provenote account',
        text: [
          'Someone (perhaps you) tried to create a Provenote account with this address, which already has one.',
          `Sign in at ${this.config.PUBLIC_URL}/sign-in, or reset your password at ${this.config.PUBLIC_URL}/forgot-password.`,
          'If it was not you, you can ignore this mail.',
        ].join('\n\n'),
      });
      return SIGN_UP_MAIL_SENT;
    }
    const secret = await this.tokens.issue('sign_up', body.email, CONFIRM_TTL_MS, {
      displayName: body.displayName,
      labName: body.labName,
      passwordHash,
    });
    await this.mail.send({
      to: body.email,
      subject: 'Confirm your Provenote account',
      text: [
        `Hello ${body.displayName},`,
        `to finish creating your account and the lab “${body.labName}”, open this link within 24 hours:`,
        `${this.config.PUBLIC_URL}/confirm-sign-up?token=${secret}`,
        'If you did not ask for an account, you can ignore this mail.',
      ].join('\n\n'),
    });
    return SIGN_UP_MAIL_SENT;
  }

  /** Creates the account and its lab, and signs the person in. */
  async confirm(secret: string): Promise<{ user: AuthUser; token: string; expiresAt: Date }> {
    const user = await this.dataSource.transaction(async (manager) => {
      const token = await this.tokens.consume('sign_up', secret, manager);
      const { displayName, labName, passwordHash } = token.payload;
      const existing = await manager.findOne(User, { where: { email: token.email } });
      if (existing?.passwordHash) throw new ConflictException('This address has an account already; sign in instead');
      const saved = existing
        ? await manager.save(Object.assign(existing, { displayName, passwordHash }))
        : await manager.save(manager.create(User, { email: token.email, displayName, passwordHash }));
      const authUser = { id: saved.id, email: saved.email, displayName: saved.displayName };
      await this.labs.create(labName, authUser, manager);
      return authUser;
    });
    return { user, ...(await this.sessions.create(user.id)) };
  }
}
