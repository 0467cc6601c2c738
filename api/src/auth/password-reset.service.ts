import { Inject, Injectable, Logger } from '@nestjs/common';
import { InjectDataSource, InjectRepository } from '@nestjs/typeorm';
import { DataSource, Repository } from 'typeorm';
import type { MailSent } from '@provenote/shared';
import { User } from '../accounts/user.entity';
import { APP_CONFIG } from '../config/config.module';
import type { AppConfig } from '../config/config';
import { MailService } from '../mail/mail.service';
import { RateLimitService } from '../rate-limit/rate-limit.service';
import { MailTokenService } from './mail-token.service';
import { hashPassword } from './passwords';
import { Session } from './session.entity';

export const RESET_MAIL_SENT: MailSent = {
  message: 'If that address has an account, we sent it a link to choose a new password. It works for one hour.',
};
export const RESET_TTL_MS = 60 * 60 * 1000;

@Injectable()
export class PasswordResetService {
  private readonly logger = new Logger(PasswordResetService.name);

  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    @InjectRepository(User) private readonly users: Repository<User>,
    private readonly tokens: MailTokenService,
    private readonly mail: MailService,
    private readonly rateLimits: RateLimitService,
    @Inject(APP_CONFIG) private readonly config: AppConfig,
  ) {}

  /** Same answer whether or not the address has an account. */
  async request(email: string, ip: string): Promise<MailSent> {
    await this.rateLimits.consume({ key: `reset:ip:${ip}`, limit: 30, windowSeconds: 3600 });
    const perAddress = await this.rateLimits.hit({ key: `reset:email:${email}`, limit: 3, windowSeconds: 3600 });
    // Past the per-address limit, answer as usual but send nothing, so the limit reveals nothing either.
    if (!perAddress.allowed) return RESET_MAIL_SENT;
    const user = await this.users.findOne({ where: { email } });
    if (!user) return RESET_MAIL_SENT;
    const secret = await this.tokens.issue('password_reset', email, RESET_TTL_MS);
    // Not awaited: a slow SMTP server must not make a known address answer later than an unknown one.
    void this.mail
      .send({
        to: email,
        subject: 'Choose a new Provenote password',
        text: [
          `Hello ${user.displayName},`,
          'to choose a new password, open this link within one hour:',
          `${this.config.PUBLIC_URL}/reset-password?token=${secret}`,
          'If you did not ask for this, you can ignore this mail; your password stays as it is.',
        ].join('\n\n'),
      })
      .catch((error: unknown) => this.logger.error(`Password reset mail to ${email} failed: ${String(error)}`));
    return RESET_MAIL_SENT;
  }

  /** Sets the new password and ends every session of the account, so a thief's session ends too. */
  async reset(secret: string, password: string): Promise<void> {
    const passwordHash = await hashPassword(password);
    await this.dataSource.transaction(async (manager) => {
      const token = await this.tokens.consume('password_reset', secret, manager);
      const user = await manager.findOneOrFail(User, { where: { email: token.email } });
      await manager.update(User, { id: user.id }, { passwordHash });
      await manager.delete(Session, { userId: user.id });
    });
  }
}
