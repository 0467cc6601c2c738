import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { type APIRequestContext, type APIResponse, type Browser, request } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser } from './browser';
import { DEMO_PASSWORD, demoEmail, REVIEWED_STUDY, samplesFile } from './journey';
import { type OwnStack, readZipEntry, startOwnStack } from './own-stack';

/** Column `column` of one of the demo data files, header dropped (the files have no quoted cells). */
function csvColumn(file: string, column: string): string[] {
  const [header, ...rows] = readFileSync(samplesFile(file), 'utf8').trim().split(/\r?\n/);
  const at = header.split(',').indexOf(column);
  if (at < 0) throw new Error(`${file} has no column ${column}`);
  return rows.map((row) => row.split(',')[at]);
}

async function ok<T>(response: Promise<APIResponse>): Promise<T> {
  const res = await response;
  if (!res.ok()) throw new Error(`${res.url()} answered ${res.status()}: ${await res.text()}`);
  return (await res.json()) as T;
}

/** Signs the demo PI in, signs the reviewed study off and builds its bundle, as the Review and Export cards do. */
async function buildDemoBundle(api: APIRequestContext): Promise<Buffer> {
  const csrf = async () => (await ok<{ csrfToken: string }>(api.get('/api/auth/csrf'))).csrfToken;
  await ok(
    api.post('/api/auth/sign-in', {
      data: { email: demoEmail('pi'), password: DEMO_PASSWORD },
      headers: { 'X-CSRF-Token': await csrf() },
    }),
  );
  const headers = { 'X-CSRF-Token': await csrf() };
  const me = await ok<{ memberships: { labId: string }[] }>(api.get('/api/me'));
  const labId = me.memberships[0].labId;
  const { studies } = await ok<{ studies: { id: string; name: string }[] }>(api.get(`/api/labs/${labId}/studies`));
  const study = studies.find((s) => s.name === REVIEWED_STUDY);
  if (!study) throw new Error(`The demo lab has no study "${REVIEWED_STUDY}"`);
  await ok(
    api.post(`/api/labs/${labId}/studies/${study.id}/sign-off`, {
      data: { statement: 'Offline report check.' },
      headers,
    }),
  );
  const built = await ok<{ id: string }>(api.post(`/api/labs/${labId}/studies/${study.id}/bundles`, { headers }));
  const deadline = Date.now() + 30_000;
  for (;;) {
    const bundle = await ok<{ status: string; error: string | null }>(
      api.get(`/api/labs/${labId}/bundles/${built.id}`),
    );
    if (bundle.status === 'succeeded') break;
    if (bundle.status === 'failed' || bundle.status === 'cancelled')
      throw new Error(`The bundle job ${bundle.status}: ${bundle.error}`);
    if (Date.now() > deadline) throw new Error(`The bundle job is still ${bundle.status} after 30 s`);
    await new Promise((resolve) => setTimeout(resolve, 250));
  }
  const download = await api.get(`/api/labs/${labId}/bundles/${built.id}/download`);
  if (!download.ok()) throw new Error(`The download answered ${download.status()}`);
  return download.body();
}

describe("the demo study's report.html", () => {
  let stack: OwnStack;
  let api: APIRequestContext;
  let browser: Browser;
  let folder: string;
  beforeAll(async () => {
    stack = await startOwnStack('provenote_e2e_report');
    api = await request.newContext({ baseURL: stack.baseUrl });
    browser = await launchBrowser();
    folder = mkdtempSync(join(tmpdir(), 'provenote-demo-report-'));
  });
  afterAll(async () => {
    await api?.dispose();
    await browser?.close();
    await stack?.stop();
    if (folder) rmSync(folder, { recursive: true, force: true });
  });

  it('opens from disk with no request but itself and shows the groups, the unknowns and inline figures', async () => {
    const zip = await buildDemoBundle(api);
    const file = join(folder, 'report.html');
    writeFileSync(file, await readZipEntry(zip, 'report.html'));
    const href = pathToFileURL(file).href;

    const context = await browser.newContext();
    const page = await context.newPage();
    const outside = new Set<string>();
    page.on('request', (req) => req.url() !== href && outside.add(req.url()));
    await context.route('**/*', (route) => {
      if (route.request().url() === href) return route.continue();
      outside.add(route.request().url());
      return route.abort();
    });
    const problems: string[] = [];
    page.on('console', (message) => message.type() === 'error' && problems.push(`console error: ${message.text()}`));
    page.on('pageerror', (error) => problems.push(`page error: ${error.message}`));
    await page.goto(href, { waitUntil: 'load' });

    expect([...outside]).toEqual([]);
    expect(problems).toEqual([]);
    await expect(page.locator('h1').textContent()).resolves.toBe(REVIEWED_STUDY);
    await expect(page.getByRole('note').textContent()).resolves.toMatch(
      /statistical evidence .*, not proof of its origin/,
    );

    const groupNames = await page
      .locator('h2:has-text("Reference groups") + table tbody tr td:first-child')
      .allTextContents();
    const memberGroups = csvColumn('reference-soils.csv', 'group');
    const referenceGroups = [...new Set(memberGroups)];
    expect(groupNames.toSorted()).toEqual(referenceGroups.toSorted());

    const assigned = await page
      .locator('h2:has-text("Assignments") ~ table')
      .first()
      .locator('tbody tr td:first-child')
      .allTextContents();
    const unknowns = csvColumn('reservoir-core.csv', 'sample_id');
    expect(assigned.toSorted()).toEqual(unknowns.toSorted());

    // Both projections are drawn inline: every reference sample, every unknown and one ellipse per group.
    const referencePoints = csvColumn('reference-soils.csv', 'sample_id').map((id, i) => `${id} (${memberGroups[i]})`);
    const figures = page.locator('figure svg');
    await expect(figures.evaluateAll((svgs) => svgs.map((svg) => svg.getAttribute('aria-label')))).resolves.toEqual([
      'Principal components of the reference samples',
      'Canonical variates of the reference groups',
    ]);
    for (const svg of await figures.all()) {
      const titles = (selector: string) => svg.locator(`${selector} > title`).allTextContents();
      await expect(titles('path').then((t) => t.toSorted())).resolves.toEqual(unknowns.toSorted());
      await expect(titles('circle').then((t) => t.toSorted())).resolves.toEqual(referencePoints.toSorted());
      await expect(svg.locator('polygon').count()).resolves.toBe(referenceGroups.length);
      await expect(svg.locator('text').allTextContents()).resolves.toEqual(
        expect.arrayContaining([expect.stringMatching(/\(\d+\.\d %/), ...referenceGroups]),
      );
    }
    await expect(page.locator('img, canvas, script, link, iframe').count()).resolves.toBe(0);
    await context.close();
  });
});
