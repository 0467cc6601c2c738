import { HttpException, HttpStatus, Inject, Injectable } from '@nestjs/common';
import type Redis from 'ioredis';
import { REDIS } from '../redis/redis.module';

export interface RateLimit {
  /** Counter name, e.g. `sign-in:fail:email:${email}`. */
  key: string;
  limit: number;
  windowSeconds: number;
}

export interface RateLimitState {
  count: number;
  allowed: boolean;
  retryAfterSeconds: number;
}

export class TooManyRequestsException extends HttpException {
  constructor(readonly retryAfterSeconds: number) {
    super(
      `Too many attempts. Wait ${Math.ceil(retryAfterSeconds / 60)} minute(s) and try again.`,
      HttpStatus.TOO_MANY_REQUESTS,
    );
  }
}

/**
 * Fixed-window counters in Redis: the first hit of a window sets its expiry, so every api process shares
 * one count and a restart does not reset it.
 */
@Injectable()
export class RateLimitService {
  constructor(@Inject(REDIS) private readonly redis: Redis) {}

  async hit({ key, limit, windowSeconds }: RateLimit): Promise<RateLimitState> {
    const name = `provenote:rl:${key}`;
    const results = await this.redis.multi().incr(name).pttl(name).exec();
    const count = Number(results?.[0]?.[1]);
    let ttlMs = Number(results?.[1]?.[1]);
    if (!Number.isFinite(count)) throw new Error(`Rate-limit counter ${name} could not be read`);
    if (ttlMs < 0) {
      ttlMs = windowSeconds * 1000;
      await this.redis.pexpire(name, ttlMs);
    }
    return { count, allowed: count <= limit, retryAfterSeconds: Math.ceil(ttlMs / 1000) };
  }

  /** Throws 429 once the window's count is past the limit. */
  async consume(limit: RateLimit): Promise<void> {
    const state = await this.hit(limit);
    if (!state.allowed) throw new TooManyRequestsException(state.retryAfterSeconds);
  }

  /** Throws 429 when the count is already at the limit, without counting this request. */
  async check({ key, limit }: RateLimit): Promise<void> {
    const name = `provenote:rl:${key}`;
    const [count, ttlMs] = await Promise.all([this.redis.get(name), this.redis.pttl(name)]);
    if (Number(count ?? 0) >= limit) throw new TooManyRequestsException(Math.max(1, Math.ceil(ttlMs / 1000)));
  }

  async reset(key: string): Promise<void> {
    await this.redis.del(`provenote:rl:${key}`);
  }
}
