import { parentPort } from 'node:worker_threads';
import type { PackedGroups } from '@provenote/shared';
import { classifyAndSummarise } from './block-summary';

/** Worker-thread side of parallel-classify: one message per range of rows, one summary back. */
export interface ThreadTask {
  readonly groups: PackedGroups;
  readonly data: Float64Array;
  readonly rowStart: number;
  readonly rowEnd: number;
}

parentPort?.on('message', (task: ThreadTask) => {
  const started = performance.now();
  const summary = classifyAndSummarise(task.groups, task.data, task.rowStart, task.rowEnd);
  parentPort?.postMessage({ summary, ms: performance.now() - started });
});
