import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser, openPage, saveScreenshot } from './browser';

describe('first visit', () => {
  let browser: Browser;
  beforeAll(async () => {
    browser = await launchBrowser();
  });
  afterAll(() => browser.close());

  it('loads the sign-in page with the shipped font and nothing broken or fetched from outside', async () => {
    const { page, problems } = await openPage(browser);
    try {
      await page.goto('/sign-in', { waitUntil: 'networkidle' });
      await expect(page.getByRole('heading', { name: 'Sign in' }).isVisible()).resolves.toBe(true);
      await page.evaluate(() => document.fonts.ready);
      const fontLoaded = await page.evaluate(() => document.fonts.check('16px "Nunito Sans"'));
      const family = await page.evaluate(() => getComputedStyle(document.body).fontFamily);
      expect(family).toContain('Nunito Sans');
      expect(fontLoaded).toBe(true);
      const fontRequests = await page.evaluate(() =>
        performance
          .getEntriesByType('resource')
          .map((entry) => entry.name)
          .filter((name) => name.includes('nunito-sans')),
      );
      expect(fontRequests.length).toBeGreaterThan(0);
      expect(problems).toEqual([]);
    } catch (error) {
      await saveScreenshot(page, 'first-visit-failure');
      throw error;
    } finally {
      await page.context().close();
    }
  });

  it('answers the health route through the same origin', async () => {
    const { page } = await openPage(browser);
    const res = await page.request.get('/api/health');
    expect(res.status()).toBe(200);
    expect(await res.json()).toMatchObject({ status: 'ok' });
    await page.context().close();
  });
});
