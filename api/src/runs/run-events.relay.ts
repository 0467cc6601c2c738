import type Redis from 'ioredis';
import { filter, Observable, Subject } from 'rxjs';
import type { RunEvent } from '@provenote/shared';
import { parseRunEvent, runEventsChannel } from '@provenote/workers';

/**
 * Relays run events from Redis pub/sub to this API process's listeners (the server-sent event streams).
 * Every API instance subscribes, so a browser sees progress whichever instance it reached and whichever
 * worker runs the job.
 */
export class RunEventsRelay {
  private readonly events$ = new Subject<RunEvent>();
  private subscriber?: Redis;

  constructor(
    private readonly redis: Redis,
    private readonly prefix: string,
  ) {}

  async start(): Promise<void> {
    // A connection in subscriber mode can run no other command, so the relay gets its own.
    const subscriber = this.redis.duplicate();
    this.subscriber = subscriber;
    subscriber.on('message', (_channel: string, message: string) => {
      const event = parseRunEvent(message);
      if (event) this.events$.next(event);
    });
    await subscriber.subscribe(runEventsChannel(this.prefix));
  }

  async stop(): Promise<void> {
    this.events$.complete();
    await this.subscriber?.quit().catch(() => this.subscriber?.disconnect());
  }

  events(runId: string): Observable<RunEvent> {
    return this.events$.pipe(filter((event) => event.runId === runId));
  }
}
