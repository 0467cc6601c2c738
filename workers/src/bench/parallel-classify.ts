import { availableParallelism } from 'node:os';
import { join } from 'node:path';
import { Worker } from 'node:worker_threads';
import type { PackedGroups } from '@provenote/shared';
import { addSummaries, type BlockSummary } from './block-summary';
import type { ThreadTask } from './classify-thread';

/**
 * A pool of worker threads running the classification kernel on contiguous ranges of rows. The data
 * live in a SharedArrayBuffer, so threads read them without copies; each thread keeps only its block
 * buffers. Reusable by the queue workers for large runs.
 */
export class ClassifyPool {
  private readonly workers: Worker[];

  constructor(
    readonly threads = availableParallelism(),
    threadScript = join(__dirname, 'classify-thread.js'),
  ) {
    this.workers = Array.from({ length: threads }, () => new Worker(threadScript));
  }

  /** Splits the rows evenly over the threads; resolves with the combined summary. */
  async classify(groups: PackedGroups, data: Float64Array): Promise<BlockSummary> {
    if (!(data.buffer instanceof SharedArrayBuffer))
      throw new TypeError('parallel classification needs data in a SharedArrayBuffer');
    const rows = data.length / groups.p;
    const share = Math.ceil(rows / this.workers.length);
    const parts = await Promise.all(
      this.workers.map((worker, t) => {
        const task: ThreadTask = {
          groups,
          data,
          rowStart: Math.min(t * share, rows),
          rowEnd: Math.min((t + 1) * share, rows),
        };
        return new Promise<BlockSummary>((resolve, reject) => {
          const onError = (error: Error) => reject(error);
          worker.once('error', onError);
          worker.once('message', (message: { summary: BlockSummary }) => {
            worker.off('error', onError);
            resolve(message.summary);
          });
          worker.postMessage(task);
        });
      }),
    );
    return addSummaries(parts);
  }

  async close(): Promise<void> {
    await Promise.all(this.workers.map((worker) => worker.terminate()));
  }
}
