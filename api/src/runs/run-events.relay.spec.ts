import { randomUUID } from 'node:crypto';
import Redis from 'ioredis';
import RedisMock from 'ioredis-mock';
import { firstValueFrom, take, toArray } from 'rxjs';
import type { RunEvent } from '@provenote/shared';
import { publishRunEvent, runEventsChannel } from '@provenote/workers';
import { RunEventsRelay } from './run-events.relay';

const event = (runId: string, progress: number): RunEvent => ({
  runId,
  labId: randomUUID(),
  status: 'running',
  progress,
  phase: 'classifying unknowns',
  error: null,
  attempt: 1,
});

describe.each([
  ['ioredis-mock', () => new RedisMock() as unknown as Redis],
  ['the real Redis', () => new Redis(process.env.REDIS_URL!)],
])('RunEventsRelay on %s', (_name, connect) => {
  const prefix = `test-relay-${randomUUID()}`;
  let redis: Redis;
  let publisher: Redis;
  let relay: RunEventsRelay;

  beforeAll(async () => {
    redis = connect();
    publisher = redis.duplicate();
    relay = new RunEventsRelay(redis, prefix);
    await relay.start();
  });
  afterAll(async () => {
    await relay.stop();
    await Promise.all([redis.quit(), publisher.quit()]);
  });

  it('hands each listener the events of its own run only, in order', async () => {
    const mine = randomUUID();
    const received = firstValueFrom(relay.events(mine).pipe(take(2), toArray()));
    await publishRunEvent(publisher, prefix, event(randomUUID(), 0.3));
    await publishRunEvent(publisher, prefix, event(mine, 0.1));
    await publishRunEvent(publisher, prefix, event(mine, 0.6));
    expect((await received).map((e) => e.progress)).toEqual([0.1, 0.6]);
  });

  it('ignores messages that are not run events, and other prefixes', async () => {
    const mine = randomUUID();
    const received = firstValueFrom(relay.events(mine));
    await publisher.publish(runEventsChannel(prefix), 'not json');
    await publisher.publish(runEventsChannel(prefix), JSON.stringify({ runId: mine, progress: 7 }));
    await publishRunEvent(publisher, `${prefix}-other`, event(mine, 0.2));
    await publishRunEvent(publisher, prefix, event(mine, 0.9));
    expect((await received).progress).toBe(0.9);
  });
});
