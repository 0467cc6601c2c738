import { mkdirSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { type Browser, chromium, type Page } from 'playwright-core';
import { inject } from 'vitest';

const screenshotDir = fileURLToPath(new URL('../../.data/e2e-screenshots/', import.meta.url));

/** Debian's Chromium, headless, with the background services that would reach outside switched off. */
export function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    headless: true,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
      '--no-first-run',
    ],
  });
}

export interface WatchedPage {
  page: Page;
  /** Console errors, failed requests, and requests to anywhere but the app's own origin. */
  problems: string[];
}

/** A page at 1280×800 that records anything a careful user would call broken. */
export async function openPage(browser: Browser): Promise<WatchedPage> {
  const baseUrl = inject('baseUrl');
  const origin = new URL(baseUrl).origin;
  const context = await browser.newContext({ baseURL: baseUrl, viewport: { width: 1280, height: 800 } });
  const page = await context.newPage();
  const problems: string[] = [];
  page.on('console', (message) => {
    if (message.type() === 'error') problems.push(`console error: ${message.text()}`);
  });
  page.on('pageerror', (error) => problems.push(`page error: ${error.message}`));
  page.on('requestfailed', (request) =>
    problems.push(`failed request: ${request.url()} (${request.failure()?.errorText})`),
  );
  page.on('request', (request) => {
    const url = new URL(request.url());
    if (url.protocol.startsWith('http') && url.origin !== origin) problems.push(`outside request: ${request.url()}`);
  });
  return { page, problems };
}

/** Saves a full-page screenshot under .data/e2e-screenshots/ (kept for failing journeys). */
export async function saveScreenshot(page: Page, name: string): Promise<string> {
  mkdirSync(screenshotDir, { recursive: true });
  const file = `${screenshotDir}${name.replace(/[^a-z0-9-]+/gi, '-')}.png`;
  await page.screenshot({ path: file, fullPage: true });
  return file;
}
