/**
 * Background work: the demo's sent proposal was e-mailed by a job; the owner sees it under
 * Settings · Team → Background work, done.
 */
import { describe, expect, inject, it } from 'vitest';
import { journeyBrowser, screenshot, signIn, watchPage } from '../support/browser';

const baseUrl = inject('baseUrl');

const browser = journeyBrowser();

describe('background work', () => {
  it('shows the owner the job that e-mailed the demo proposal with its PDF, done', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    const watch = watchPage(page);
    await signIn(page, baseUrl, 'owner@browseline.test');
    await page.waitForURL(`${baseUrl}/desk`);
    await page.goto(`${baseUrl}/settings/team`);
    const card = page.locator('section, div').filter({ has: page.getByRole('heading', { name: 'Background work' }) }).last();
    const item = card.getByRole('listitem').filter({ hasText: /E-mail proposal P-\d{4}-\d{3} v\d with its PDF/ }).first();
    await expect.poll(() => item.getByText('Done', { exact: true }).count(), { timeout: 30_000, interval: 250 }).toBe(1);
    await screenshot(page, 'background-work');
    watch.assertClean();
    await context.close();
  });
});
