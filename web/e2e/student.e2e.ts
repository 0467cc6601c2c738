import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser } from './browser';
import { card, cardStatus, importDataset, journey, REVIEWED_STUDY, RUN_WAIT, signIn } from './journey';

describe('the student', () => {
  let browser: Browser;
  beforeAll(async () => {
    browser = await launchBrowser();
  });
  afterAll(() => browser.close());

  it('cannot edit groups, imports unknowns, copies the demo study onto them and assigns them', () =>
    journey(browser, 'student', async (page) => {
      const labId = await signIn(page, 'student');
      await page.goto(`/labs/${labId}/groups`);
      await page.getByRole('region', { name: 'Group Schist valley' }).waitFor();
      expect(await page.getByRole('button', { name: 'Build groups' }).count()).toBe(0);
      expect(await page.getByRole('button', { name: /^Approve/ }).count()).toBe(0);

      await importDataset(page, labId, 'reservoir-core-eu.csv', 'Core TR-2, my import', 'Unknowns to assign');
      await page.goto(`/labs/${labId}`);
      await page.getByRole('link', { name: REVIEWED_STUDY }).click();
      await page.getByRole('button', { name: 'Copy with new data' }).click();
      const dialog = page.getByRole('dialog', { name: 'Copy with new data' });
      await dialog.getByLabel('Name of the copy').fill('Core TR-2, my copy');
      await dialog.getByLabel('Unknowns').first().click();
      await page.getByRole('option', { name: /Core TR-2, my import/ }).click();
      await dialog.getByRole('button', { name: 'Copy', exact: true }).click();
      await page.waitForURL((url) => !url.pathname.endsWith(labId));
      const check = card(page, 'Group check');
      await check.getByRole('button', { name: /^Run group check/ }).click();
      await cardStatus(check, 'Current');
      expect(await check.getByRole('button', { name: 'Exclude member' }).count()).toBe(0);

      const assign = card(page, 'Assign');
      await assign.getByRole('button', { name: 'Assign the unknowns' }).click();
      await cardStatus(assign, 'Current');
      const table = assign.getByRole('table', { name: 'Assignments of the unknowns' });
      await table.getByRole('row', { name: /TR2-001/ }).waitFor(RUN_WAIT);
      await expect.poll(() => assign.getByText('Evidence, not proof').count()).toBeGreaterThan(0);
    }));
});
