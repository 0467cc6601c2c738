import { loadavg } from 'node:os';
import type { BenchFigure, BenchSection } from './bench-section';
import type { ApiClient } from './stack/api-client';
import { benchRun } from './stack/bench-run';
import { benchStack } from './stack/bench-stack';
import { quantile, round2 } from './stack/figures';

const REQUESTS = 200;
const WARM_UP = 10;

/** Latencies of REQUESTS sequential requests on one keep-alive connection, after a short warm-up. */
async function latencies(client: ApiClient, path: string): Promise<{ median: number; p95: number; body: string }> {
  let body = '';
  for (let i = 0; i < WARM_UP; i++) body = (await client.ok('GET', path)).body.toString('utf8');
  const times: number[] = [];
  for (let i = 0; i < REQUESTS; i++) {
    const started = performance.now();
    await client.ok('GET', path);
    times.push(performance.now() - started);
  }
  return { median: quantile(times, 0.5), p95: quantile(times, 0.95), body };
}

function figures(name: string, label: string, load: number, measured: { median: number; p95: number }): BenchFigure[] {
  return [
    { key: `api.${name}.median_ms`, label: `${label}, median`, value: round2(measured.median), unit: 'ms' },
    { key: `api.${name}.p95_ms`, label: `${label}, p95 (target ≤ 100)`, value: round2(measured.p95), unit: 'ms' },
    { key: `api.${name}.load_average_1m`, label: `${label}, load average at start`, value: round2(load), unit: '' },
  ];
}

/** The pages a person opens on a finished run of 100,000 unknowns: a sorted, filtered results page and the study. */
export const apiBench: BenchSection = {
  name: 'api',
  async run(log) {
    const stack = await benchStack(log);
    const run = await benchRun(stack);
    const base = `/api/labs/${stack.labId}`;
    // Page 3 of one group's assigned unknowns, most probable first: a filter, a sort and an offset at once.
    const resultsPath = `${base}/runs/${run.runId}/assignments?verdict=assigned&group=source-3&sort=probability&order=desc&page=3`;
    let load = loadavg()[0];
    const results = await latencies(stack.client, resultsPath);
    const page = JSON.parse(results.body) as { total: number; rows: unknown[] };
    if (page.rows.length !== 50)
      throw new Error(`the results page has ${page.rows.length} rows, not 50 (total ${page.total})`);
    log(
      `results page (${page.total} matching of 100000): median ${results.median.toFixed(1)} ms, p95 ${results.p95.toFixed(1)} ms`,
    );
    const resultFigures = figures(
      'results_page',
      'API results page, 50 of 100,000, sorted and filtered',
      load,
      results,
    );
    load = loadavg()[0];
    const study = await latencies(stack.client, `${base}/studies/${run.studyId}`);
    log(`study page: median ${study.median.toFixed(1)} ms, p95 ${study.p95.toFixed(1)} ms`);
    return [...resultFigures, ...figures('study_page', 'API study page', load, study)];
  },
};
