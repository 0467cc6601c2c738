import { loadavg } from 'node:os';
import { join } from 'node:path';
import type { BrowserContext } from 'playwright-core';
import type { BenchFigure, BenchSection } from './bench-section';
import { benchRun } from './stack/bench-run';
import { benchStack, REPO_ROOT, type BenchStack } from './stack/bench-stack';
import { round2 } from './stack/figures';
import { buildWeb } from './stack/web-chunks';

const CHROMIUM_ARGS = [
  '--no-sandbox',
  '--disable-gpu',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
  '--no-first-run',
];

/** Opens the study and waits for the first row of the assignments table; cold (empty cache) and again. */
async function timeToTable(stack: BenchStack, studyId: string): Promise<{ coldMs: number; warmMs: number }> {
  // playwright-core is the web workspace's; resolved from there at run time.
  // eslint-disable-next-line @typescript-eslint/no-require-imports
  const { chromium } = require(
    require.resolve('playwright-core', { paths: [join(REPO_ROOT, 'web')] }),
  ) as typeof import('playwright-core');
  const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', headless: true, args: CHROMIUM_ARGS });
  try {
    const context: BrowserContext = await browser.newContext({ viewport: { width: 1280, height: 800 } });
    const cookies = ['provenote_session', 'provenote_csrf'].flatMap((name) => {
      const value = stack.client.cookie(name);
      return value ? [{ name, value, url: stack.baseUrl }] : [];
    });
    await context.addCookies(cookies);
    const page = await context.newPage();
    const url = `${stack.baseUrl}/labs/${stack.labId}/studies/${studyId}`;
    const firstRow = page.locator('table[aria-label="Assignments of the unknowns"] tbody tr').first();
    const open = async () => {
      const started = performance.now();
      await page.goto(url);
      try {
        await firstRow.waitFor({ state: 'visible', timeout: 30_000 });
      } catch (error) {
        const shot = join(REPO_ROOT, '.data', 'bench', 'web-timeout.png');
        await page.screenshot({ path: shot, fullPage: true });
        throw new Error(`the results table did not appear at ${page.url()} (screenshot ${shot}): ${String(error)}`);
      }
      return performance.now() - started;
    };
    const coldMs = await open();
    const warmMs = await open();
    return { coldMs, warmMs };
  } finally {
    await browser.close();
  }
}

/** The built web app: what every visit downloads, Plotly kept out of it, and the time to see results. */
export const webBench: BenchSection = {
  name: 'web',
  async run(log) {
    const build = buildWeb();
    const first = [build.entry, ...build.preloaded];
    const plotly = build.chunks.filter((c) => c.hasPlotly);
    const plotlyUpFront = first.some((c) => c.hasPlotly);
    log(
      `built in ${(build.buildMs / 1000).toFixed(1)} s; entry ${build.entry.file} ${(build.entry.gzipBytes / 1024).toFixed(0)} kB gzip; ` +
        (plotly.length === 0 ? 'no chunk holds Plotly' : `Plotly in ${plotly.map((c) => c.file).join(', ')}`),
    );
    const stack = await benchStack(log);
    const run = await benchRun(stack);
    await stack.serveWeb(build.dist);
    const load = loadavg()[0];
    const shown = await timeToTable(stack, run.studyId);
    log(`results table shown: first visit ${shown.coldMs.toFixed(0)} ms, again ${shown.warmMs.toFixed(0)} ms`);
    const kB = (bytes: number) => round2(bytes / 1024);
    return [
      {
        key: 'web.main_chunk.gzip_kb',
        label: 'web main chunk, gzip (target ≤ 350)',
        value: kB(build.entry.gzipBytes),
        unit: 'kB',
      },
      { key: 'web.main_chunk.raw_kb', label: 'web main chunk, raw', value: kB(build.entry.bytes), unit: 'kB' },
      {
        key: 'web.first_load_js.gzip_kb',
        label: 'web JavaScript loaded up front (entry + preloads), gzip',
        value: kB(first.reduce((sum, c) => sum + c.gzipBytes, 0)),
        unit: 'kB',
      },
      {
        key: 'web.plotly_chunk.gzip_kb',
        label: 'web Plotly chunk, gzip (0: no chunk holds Plotly)',
        value: kB(plotly.reduce((sum, c) => sum + c.gzipBytes, 0)),
        unit: 'kB',
      },
      {
        key: 'web.plotly_loaded_up_front',
        label: 'web Plotly in the entry or its preloads (1 = yes)',
        value: plotlyUpFront ? 1 : 0,
        unit: '',
      },
      { key: 'web.chunks', label: 'web JavaScript chunks', value: build.chunks.length, unit: '' },
      {
        key: 'web.results_table.first_visit_ms',
        label: 'web study page → first results row, empty cache',
        value: Math.round(shown.coldMs),
        unit: 'ms',
      },
      {
        key: 'web.results_table.again_ms',
        label: 'web study page → first results row, cached',
        value: Math.round(shown.warmMs),
        unit: 'ms',
      },
      { key: 'web.load_average_1m', label: 'web: load average at start', value: round2(load), unit: '' },
    ] satisfies BenchFigure[];
  },
};
