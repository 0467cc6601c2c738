import RedisMock from 'ioredis-mock';
import type Redis from 'ioredis';
import { RateLimitService, TooManyRequestsException } from './rate-limit.service';

describe('RateLimitService (on ioredis-mock)', () => {
  let redis: Redis;
  let limits: RateLimitService;

  beforeEach(async () => {
    redis = new RedisMock() as unknown as Redis;
    await redis.flushall();
    limits = new RateLimitService(redis);
  });
  afterEach(() => redis.disconnect());

  it('allows up to the limit in a window, then refuses with the time left', async () => {
    const limit = { key: 'test:a', limit: 3, windowSeconds: 60 };
    const counts = [];
    for (let i = 0; i < 4; i++) counts.push(await limits.hit(limit));
    expect(counts.map((state) => state.allowed)).toEqual([true, true, true, false]);
    expect(counts[3].retryAfterSeconds).toBeGreaterThan(0);
    expect(counts[3].retryAfterSeconds).toBeLessThanOrEqual(60);
    await expect(limits.consume(limit)).rejects.toBeInstanceOf(TooManyRequestsException);
  });

  it('sets the expiry once, on the first hit of the window', async () => {
    await limits.hit({ key: 'test:b', limit: 5, windowSeconds: 30 });
    expect(await redis.pttl('provenote:rl:test:b')).toBeGreaterThan(29_000);
  });

  it('checks without counting, and starts over after a reset', async () => {
    const limit = { key: 'test:c', limit: 1, windowSeconds: 60 };
    await limits.check(limit);
    await limits.check(limit);
    await limits.hit(limit);
    await expect(limits.check(limit)).rejects.toThrow(/Too many attempts/);
    await limits.reset(limit.key);
    await expect(limits.check(limit)).resolves.toBeUndefined();
  });

  it('keeps separate keys apart', async () => {
    await limits.hit({ key: 'test:d', limit: 1, windowSeconds: 60 });
    expect((await limits.hit({ key: 'test:e', limit: 1, windowSeconds: 60 })).allowed).toBe(true);
  });
});
