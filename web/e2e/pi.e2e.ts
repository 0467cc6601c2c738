import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser, saveScreenshot } from './browser';
import { card, journey, REVIEWED_STUDY, RUN_WAIT, signIn } from './journey';

describe('the PI', () => {
  let browser: Browser;
  beforeAll(async () => {
    browser = await launchBrowser();
  });
  afterAll(() => browser.close());

  it('invites a member and reads the invitation in the outbox', () =>
    journey(browser, 'pi-invite', async (page) => {
      const labId = await signIn(page, 'pi');
      await page.goto(`/labs/${labId}/members`);
      const form = page.getByRole('form', { name: 'Invite someone' });
      await form.getByLabel('E-mail to invite').fill('new.student@example.test');
      await form.getByLabel('Invite as', { exact: true }).first().click();
      await page
        .getByRole('listbox', { name: 'Invite as' })
        .getByRole('option', { name: 'Student', exact: true })
        .click();
      await form.getByRole('button', { name: 'Send invitation' }).click();
      await page.getByRole('table', { name: 'Pending invitations' }).getByText('new.student@example.test').waitFor();
      await page.getByRole('link', { name: 'Outbox' }).click();
      const mail = page.getByText('to new.student@example.test', { exact: false });
      await mail.waitFor();
      await mail.click();
      await expect.poll(() => page.locator('a[href*="accept-invitation"]').count()).toBeGreaterThan(0);
    }));

  it('reviews the demo study, signs it off, builds a bundle and downloads it', () =>
    journey(browser, 'pi-sign-off', async (page) => {
      await signIn(page, 'pi');
      await page.getByRole('link', { name: REVIEWED_STUDY }).click();
      const review = card(page, 'Review');
      await review.getByRole('table', { name: 'Overridden verdicts' }).getByText('Schist valley').first().waitFor();
      await page.waitForLoadState('networkidle');
      await saveScreenshot(page, 'notebook-review');
      await review.getByLabel('Sign-off statement').fill('Checked the group check and the one override.');
      await review.getByRole('button', { name: 'Sign off this study' }).click();
      await review.getByText('Signed off', { exact: true }).first().waitFor();

      const exportCard = card(page, 'Export');
      await exportCard.getByRole('button', { name: 'Build a result bundle' }).click();
      const link = exportCard.locator('a[download]').first();
      await link.waitFor(RUN_WAIT);
      const [download] = await Promise.all([page.waitForEvent('download'), link.click()]);
      expect(download.suggestedFilename()).toMatch(/\.zip$/);
      expect(await download.failure()).toBeNull();
    }));
});
