import type { AppConfig } from '../config/config';

/**
 * The run queue's Redis prefix: QUEUE_PREFIX, or one derived from the database name, because a queue
 * belongs to the database its runs live in (and so each test database gets a queue of its own).
 */
export function queuePrefix(config: Pick<AppConfig, 'QUEUE_PREFIX' | 'DATABASE_URL'>): string {
  if (config.QUEUE_PREFIX) return config.QUEUE_PREFIX;
  const database = decodeURIComponent(new URL(config.DATABASE_URL).pathname.replace(/^\//, '')) || 'postgres';
  return `provenote:${database.replace(/[^\w.-]/g, '_')}`;
}
