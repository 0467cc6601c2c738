import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser } from './browser';
import { card, cardStatus, choose, FRESH_STUDY, importDataset, journey, RUN_WAIT, signIn } from './journey';

const GROUPS = ['Basalt plateau', 'Glacial till', 'Granite uplands', 'Limestone karst', 'Schist valley'];
const ELEMENTS = ['Ti', 'Fe', 'K', 'Ca', 'Rb', 'Sr', 'Zr', 'Th', 'Cr'];

describe('the analyst', () => {
  let browser: Browser;
  beforeAll(async () => {
    browser = await launchBrowser();
  });
  afterAll(() => browser.close());

  it('imports the demo files, builds and approves groups from the group column', () =>
    journey(browser, 'analyst-import', async (page) => {
      const labId = await signIn(page, 'analyst');
      await importDataset(
        page,
        labId,
        'reference-soils.csv',
        'Catchment soils, re-import',
        'Reference data (with groups)',
      );
      await expect.poll(() => page.getByText('178', { exact: true }).count()).toBeGreaterThan(0);
      await importDataset(page, labId, 'reservoir-core.csv', 'Core TR-2, re-import', 'Unknowns to assign');

      await page.goto(`/labs/${labId}/groups`);
      await choose(page, page.getByLabel('Build groups from a group column').first(), [
        'Catchment soils, re-import — version 1',
      ]);
      await page.getByRole('button', { name: 'Build groups' }).click();
      const approveButtons = page.getByRole('button', { name: 'Approve v2' });
      await expect.poll(() => approveButtons.count()).toBe(5);
      for (let left = 5; left > 0; left--) {
        await approveButtons.first().click();
        await expect.poll(() => approveButtons.count()).toBe(left - 1);
      }
    }));

  it('prepares the fresh demo study, runs the group check, assigns and reads the results and plots', () =>
    journey(browser, 'analyst-notebook', async (page) => {
      await signIn(page, 'analyst');
      await page.getByRole('link', { name: FRESH_STUDY }).click();
      const prepare = card(page, 'Prepare');
      await choose(page, prepare.getByLabel('Elements'), ELEMENTS);
      await prepare.getByRole('button', { name: 'Save preparation' }).click();
      await cardStatus(prepare, 'Current');

      const groups = card(page, 'Reference groups');
      const groupInput = groups.getByLabel('Reference groups', { exact: true }).first();
      for (const group of GROUPS) {
        await groupInput.click();
        await page
          .getByRole('option', { name: new RegExp(`^${group}`) })
          .first()
          .click();
      }
      await page.keyboard.press('Escape');
      await groups.getByRole('button', { name: 'Save groups' }).click();
      await cardStatus(groups, 'Current');

      const check = card(page, 'Group check');
      await check.getByRole('button', { name: 'Run group check' }).click();
      await cardStatus(check, 'Current');
      await check.getByRole('table', { name: 'Pairwise separation' }).waitFor(RUN_WAIT);

      const assign = card(page, 'Assign');
      await assign.getByRole('button', { name: 'Assign the unknowns' }).click();
      await cardStatus(assign, 'Current');
      const table = assign.getByRole('table', { name: 'Assignments of the unknowns' });
      await table.getByRole('row', { name: /TR2-001/ }).waitFor(RUN_WAIT);
      await expect.poll(() => assign.getByText('Evidence, not proof').count()).toBeGreaterThan(0);

      await assign.getByRole('tab', { name: 'Probability heat map' }).click();
      await assign.locator('.js-plotly-plot').first().waitFor(RUN_WAIT);
      await assign.getByRole('tab', { name: 'Two elements' }).click();
      await expect.poll(() => assign.locator('.js-plotly-plot').count()).toBeGreaterThan(0);
    }));
});
