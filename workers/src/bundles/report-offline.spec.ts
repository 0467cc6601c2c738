import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { chromium, type Browser } from 'playwright-core';
import { irisContent } from './__fixtures__/iris-content';
import { renderReport, CAUTION } from './report/render-report';

const CHROMIUM_ARGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
  '--no-first-run',
];

describe('report.html', () => {
  let browser: Browser;
  let folder: string;
  beforeAll(async () => {
    browser = await chromium.launch({ executablePath: '/usr/bin/chromium', args: CHROMIUM_ARGS });
    folder = mkdtempSync(join(tmpdir(), 'provenote-report-'));
  });
  afterAll(async () => {
    await browser?.close();
    rmSync(folder, { recursive: true, force: true });
  });

  it('opens offline with no request but itself and shows the study, methods, groups, assignments and projections', async () => {
    const content = irisContent({ firstUnknownId: '<img src="http://example.invalid/x.png">' });
    const file = join(folder, 'report.html');
    writeFileSync(file, renderReport(content));
    const context = await browser.newContext({ offline: true });
    const page = await context.newPage();
    const requests: string[] = [];
    page.on('request', (request) => requests.push(request.url()));
    const consoleErrors: string[] = [];
    page.on('console', (message) => message.type() === 'error' && consoleErrors.push(message.text()));
    await page.goto(pathToFileURL(file).href);

    expect(requests).toEqual([pathToFileURL(file).href]);
    expect(consoleErrors).toEqual([]);
    await expect(page.locator('h1').textContent()).resolves.toBe(content.study.title);
    await expect(page.locator('.caution').textContent()).resolves.toBe(CAUTION);
    const body = (await page.locator('body').textContent()) ?? '';
    expect(body).toContain('Mahalanobis 1936');
    expect(body).toContain('NIST/SEMATECH e-Handbook §6.5.4.3');
    expect(body).toContain('at least α = 0.05');
    // The hostile sample id is shown as text, never turned into an element.
    expect(body).toContain('<img src="http://example.invalid/x.png">');
    await expect(page.locator('img').count()).resolves.toBe(0);
    await expect(page.locator('table').first().locator('tbody tr').count()).resolves.toBe(3);
    await expect(page.locator('h2:has-text("Assignments") + p').textContent()).resolves.toMatch(
      /^15 unknown samples: /,
    );
    // Two figures (principal components and canonical variates), each with the legend's markers.
    await expect(page.locator('figure svg circle').count()).resolves.toBe(2 * (135 + 3));
    await expect(page.locator('figure svg polygon').count()).resolves.toBe(2 * 3);
    await expect(page.locator('figure svg path').count()).resolves.toBe(2 * (15 + 1));
    await context.close();
  }, 60_000);
});
