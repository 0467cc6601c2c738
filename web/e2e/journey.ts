import { fileURLToPath } from 'node:url';
import type { Browser, Locator, Page } from 'playwright-core';
import { expect } from 'vitest';
import { openPage, saveScreenshot, type WatchedPage } from './browser';

export const DEMO_PASSWORD = 'provenote-demo';
export const demoEmail = (role: 'pi' | 'analyst' | 'student') => `${role}@demo.provenote.test`;
export const samplesFile = (name: string) => fileURLToPath(new URL(`../../samples/data/${name}`, import.meta.url));

export const REVIEWED_STUDY = 'Core TR-2 sources (synthetic demo)';
export const FRESH_STUDY = 'Core TR-2, your own try (synthetic demo)';

/** Long enough for a run on the queue; every wait ends as soon as the page shows the state. */
export const RUN_WAIT = { timeout: 30_000 };

/**
 * Runs one journey in a page of its own: a failure saves a screenshot named after the journey, and
 * whatever the page recorded as broken (console errors, failed or outside requests) fails it too.
 */
export async function journey(browser: Browser, name: string, steps: (page: Page) => Promise<void>) {
  const watched: WatchedPage = await openPage(browser);
  try {
    await steps(watched.page);
    // A request the app cancels itself (a query left behind by navigation, an event stream of a finished run) is not a fault.
    expect(watched.problems.filter((problem) => !problem.includes('net::ERR_ABORTED'))).toEqual([]);
  } catch (error) {
    await saveScreenshot(watched.page, `${name}-failure`);
    throw error;
  } finally {
    await watched.page.context().close();
  }
}

/** Signs in through the form and waits for the study list; returns the lab id from the address. */
export async function signIn(page: Page, role: 'pi' | 'analyst' | 'student'): Promise<string> {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(demoEmail(role));
  await page.locator('input[type="password"]').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  await page.getByRole('table', { name: 'Studies of this lab' }).waitFor();
  const me = await page.request.get('/api/me');
  return ((await me.json()) as { memberships: { labId: string }[] }).memberships[0].labId;
}

export const card = (page: Page, title: string) => page.getByRole('region', { name: new RegExp(`^\\d\\. ${title}`) });

/** Waits until a card's status badge reads `status`. */
export async function cardStatus(region: Locator, status: string, options = RUN_WAIT) {
  await region.getByText(status, { exact: true }).first().waitFor(options);
}

/** Picks options of a Mantine Select or MultiSelect by their visible labels. */
export async function choose(page: Page, input: Locator, labels: string[]) {
  for (const label of labels) {
    await input.click();
    // Mantine's options only: a native <select> elsewhere on the page has options of the same names.
    await page.getByRole('option', { name: label, exact: true }).and(page.locator('[data-combobox-option]')).click();
  }
  await page.keyboard.press('Escape');
}

/** Uploads a file on the import page (Dropzone's hidden input), keeps the guessed mapping and imports it. */
export async function importDataset(
  page: Page,
  labId: string,
  file: string,
  name: string,
  kind: 'Reference data (with groups)' | 'Unknowns to assign',
) {
  await page.goto(`/labs/${labId}/datasets/new`);
  await page.locator('input[type="file"]').setInputFiles(samplesFile(file));
  await page.getByRole('table', { name: 'Column mapping' }).waitFor();
  await page.getByLabel('Dataset name').fill(name);
  await page.getByText(kind, { exact: true }).click();
  await page.getByRole('button', { name: 'Preview' }).click();
  const importButton = page.getByRole('button', { name: 'Import', exact: true });
  await expect.poll(() => importButton.isEnabled()).toBe(true);
  await importButton.click();
  await page.waitForURL(/\/datasets\/[0-9a-f-]{36}$/);
}
