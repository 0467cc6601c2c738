import { loadavg } from 'node:os';
import type { BenchFigure, BenchSection } from './bench-section';
import { benchRun, RUN_UNKNOWNS } from './stack/bench-run';
import { benchStack } from './stack/bench-stack';
import { round2 } from './stack/figures';

/** Upload → group check → assign → results stored, through the API and the queue, with the API's peak memory. */
export const e2eBench: BenchSection = {
  name: 'e2e',
  async run(log) {
    const stack = await benchStack(log);
    const load = loadavg()[0];
    const run = await benchRun(stack);
    log(
      `${RUN_UNKNOWNS} unknowns × 8 groups × 30 elements: uploads ${run.uploadMs.toFixed(0)} ms, ` +
        `check ${run.checkMs.toFixed(0)} ms, assign ${run.assignMs.toFixed(0)} ms`,
    );
    const ms = (x: number) => Math.round(x);
    return [
      {
        key: 'e2e.100000x8.total_ms',
        label: `end to end, ${RUN_UNKNOWNS} unknowns × 8 groups (upload → results stored), target ≤ 30,000`,
        value: ms(run.totalMs),
        unit: 'ms',
      },
      { key: 'e2e.100000x8.upload_ms', label: 'e2e: both uploads and imports', value: ms(run.uploadMs), unit: 'ms' },
      {
        key: 'e2e.100000x8.check_run_ms',
        label: 'e2e: group check run, start → stored',
        value: ms(run.checkMs),
        unit: 'ms',
      },
      {
        key: 'e2e.100000x8.assign_run_ms',
        label: 'e2e: assign run, start → stored',
        value: ms(run.assignMs),
        unit: 'ms',
      },
      {
        key: 'e2e.100000x8.assign_start_ms',
        label: 'e2e: of which the API snapshots the inputs and queues',
        value: ms(run.assignStartMs),
        unit: 'ms',
      },
      {
        key: 'e2e.api_peak_rss_mb',
        label: 'e2e: API process peak resident memory',
        value: Math.round(run.apiPeakRssMb),
        unit: 'MB',
      },
      {
        key: 'e2e.worker_peak_rss_mb',
        label: 'e2e: worker process peak resident memory',
        value: Math.round(run.workerPeakRssMb),
        unit: 'MB',
      },
      { key: 'e2e.load_average_1m', label: 'e2e: load average at start', value: round2(load), unit: '' },
    ] satisfies BenchFigure[];
  },
};
