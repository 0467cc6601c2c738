import type Redis from 'ioredis';
import { runEventSchema, type RunEvent } from '@provenote/shared';

/**
 * Redis names of the run queue's side channels, under the queue's prefix so separate installations
 * (and test files) sharing one Redis never see each other's runs.
 */
export const runEventsChannel = (prefix: string) => `${prefix}:run-events`;
export const cancelFlagKey = (prefix: string, runId: string) => `${prefix}:run-cancel:${runId}`;

/** A cancel request outlives any backoff delay between attempts. */
const CANCEL_FLAG_TTL_S = 7 * 24 * 3600;

export async function publishRunEvent(redis: Redis, prefix: string, event: RunEvent): Promise<void> {
  await redis.publish(runEventsChannel(prefix), JSON.stringify(runEventSchema.parse(event)));
}

export async function requestCancel(redis: Redis, prefix: string, runId: string): Promise<void> {
  await redis.set(cancelFlagKey(prefix, runId), '1', 'EX', CANCEL_FLAG_TTL_S);
}

export async function isCancelRequested(redis: Redis, prefix: string, runId: string): Promise<boolean> {
  return (await redis.exists(cancelFlagKey(prefix, runId))) === 1;
}

/** Parses one message of the run-events channel; null for anything that is not a run event. */
export function parseRunEvent(message: string): RunEvent | null {
  try {
    const parsed = runEventSchema.safeParse(JSON.parse(message));
    return parsed.success ? parsed.data : null;
  } catch {
    return null;
  }
}
