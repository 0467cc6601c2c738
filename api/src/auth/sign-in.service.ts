import { Injectable, UnauthorizedException } from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import { Repository } from 'typeorm';
import type { SignIn } from '@provenote/shared';
import { User } from '../accounts/user.entity';
import { RateLimitService, type RateLimit } from '../rate-limit/rate-limit.service';
import type { AuthUser } from './auth.types';
import { verifyPassword } from './passwords';
import { SessionService } from './session.service';

/** One message for a wrong e-mail and a wrong password, so sign-in does not reveal who has an account. */
export const SIGN_IN_FAILED = 'The e-mail or the password is not right';

const WINDOW_SECONDS = 15 * 60;
/** Failed sign-ins allowed per account per window: enough for typos, far too few for guessing. */
export const FAILED_SIGN_INS_PER_ACCOUNT = 5;
/** Failed sign-ins allowed from one address per window, across accounts (a lab behind one NAT). */
export const FAILED_SIGN_INS_PER_ADDRESS = 50;

const accountLimit = (email: string): RateLimit => ({
  key: `sign-in:fail:email:${email}`,
  limit: FAILED_SIGN_INS_PER_ACCOUNT,
  windowSeconds: WINDOW_SECONDS,
});
const addressLimit = (ip: string): RateLimit => ({
  key: `sign-in:fail:ip:${ip}`,
  limit: FAILED_SIGN_INS_PER_ADDRESS,
  windowSeconds: WINDOW_SECONDS,
});

@Injectable()
export class SignInService {
  constructor(
    @InjectRepository(User) private readonly users: Repository<User>,
    private readonly sessions: SessionService,
    private readonly rateLimits: RateLimitService,
  ) {}

  async signIn(credentials: SignIn, ip: string): Promise<{ user: AuthUser; token: string; expiresAt: Date }> {
    const user = await this.verify(credentials, ip);
    return { user, ...(await this.sessions.create(user.id)) };
  }

  /** Checks an e-mail and password under the same throttling as sign-in (accepting an invitation uses it). */
  async verify({ email, password }: SignIn, ip: string): Promise<AuthUser> {
    await this.rateLimits.check(accountLimit(email));
    await this.rateLimits.check(addressLimit(ip));
    const user = await this.users.findOne({ where: { email } });
    if (!(await verifyPassword(password, user?.passwordHash)) || !user) {
      await this.rateLimits.hit(accountLimit(email));
      await this.rateLimits.hit(addressLimit(ip));
      throw new UnauthorizedException(SIGN_IN_FAILED);
    }
    await this.rateLimits.reset(accountLimit(email).key);
    return { id: user.id, email: user.email, displayName: user.displayName };
  }
}
