import { Injectable } from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import { LessThan, Repository } from 'typeorm';
import type { AuthUser } from './auth.types';
import { Session } from './session.entity';
import { SESSION_RENEW_BELOW_MS, SESSION_TTL_MS } from './session-cookies';
import { hashSecret, newSecret } from './tokens';

export interface ResolvedSession {
  sessionId: string;
  user: AuthUser;
  /** Set when the session was extended by this lookup; the cookie must be sent again with it. */
  renewedUntil?: Date;
}

@Injectable()
export class SessionService {
  constructor(@InjectRepository(Session) private readonly sessions: Repository<Session>) {}

  /** Starts a session for the person; returns the cookie's secret token (only its hash is stored). */
  async create(userId: string): Promise<{ token: string; expiresAt: Date }> {
    const token = newSecret();
    const expiresAt = new Date(Date.now() + SESSION_TTL_MS);
    await this.sessions.insert({ tokenHash: hashSecret(token), userId, expiresAt });
    // Expired rows are swept here rather than by a timer: sign-ins are frequent enough to keep the table small.
    await this.sessions.delete({ userId, expiresAt: LessThan(new Date()) });
    return { token, expiresAt };
  }

  async resolve(token: string): Promise<ResolvedSession | null> {
    const session = await this.sessions.findOne({ where: { tokenHash: hashSecret(token) }, relations: { user: true } });
    if (!session) return null;
    const now = Date.now();
    if (session.expiresAt.getTime() <= now) {
      await this.sessions.delete({ id: session.id });
      return null;
    }
    const { id, email, displayName } = session.user;
    const resolved: ResolvedSession = { sessionId: session.id, user: { id, email, displayName } };
    if (session.expiresAt.getTime() - now < SESSION_RENEW_BELOW_MS) {
      resolved.renewedUntil = new Date(now + SESSION_TTL_MS);
      await this.sessions.update({ id: session.id }, { expiresAt: resolved.renewedUntil });
    }
    return resolved;
  }

  async end(sessionId: string): Promise<void> {
    await this.sessions.delete({ id: sessionId });
  }

  /** Signs the person out everywhere (after a password reset), optionally keeping one session. */
  async endAllFor(userId: string): Promise<void> {
    await this.sessions.delete({ userId });
  }
}
