/**
 * The landowner on a phone sees this season and last side by side: from the property page to the
 * comparison, the brassica plot's failed or thin stand last season and its established stand this
 * season, the soil-test pH of both, read-only (no form, no button that writes).
 */
import { describe, expect, inject, it } from 'vitest';
import { journeyBrowser, screenshot, signIn, watchPage } from '../support/browser';

const baseUrl = inject('baseUrl');

const browser = journeyBrowser();

describe('seasons side by side in the portal', () => {
  it('shows each plot’s two seasons on a 390 × 844 phone without a write control', async () => {
    const context = await browser.newContext({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true, timezoneId: 'America/Chicago' });
    const page = await context.newPage();
    const watch = watchPage(page);
    await signIn(page, baseUrl, 'client@browseline.test');
    await page.waitForURL(/\/portal/);
    await page.getByRole('link', { name: 'See the plan of Kettle Hollow Farm' }).click();
    await page.getByRole('link', { name: 'This season and last, side by side' }).click();
    await page.waitForURL(/\/portal\/properties\/\d+\/seasons/);
    const brassica = page.getByRole('listitem').filter({ has: page.getByRole('heading', { name: 'Hollow brassica plot' }) });
    await brassica.waitFor();
    // The demo seed (demo-checks.ts, demo-seasons.ts) gives the plot a check in each season; another journey may add
    // a later check this season, so each season shows a status, whichever it is, and a soil-test pH.
    await expect.poll(() => brassica.getByText(/^(Established|Thin stand|Failed stand)$/).count(), { timeout: 20_000 }).toBe(2);
    expect(await brassica.getByText(/^\d\.\d$/).count()).toBeGreaterThanOrEqual(1);
    const clover = page.getByRole('listitem').filter({ has: page.getByRole('heading', { name: 'Ridge clover plot' }) });
    expect(await clover.getByText(/Deer ate \d+ % of the forage/).count()).toBeGreaterThanOrEqual(1);
    // Read-only: nothing to type into and no button on the page's main content.
    expect(await page.locator('main form, main input, main textarea, main select').count()).toBe(0);
    // Fits the phone: no sideways scrolling.
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await screenshot(page, 'portal-seasons-390');
    watch.assertClean();
    await context.close();
  });

  it('opens the same page from the consultant’s preview as client, staying inside the preview', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 }, timezoneId: 'America/Chicago' });
    const page = await context.newPage();
    const watch = watchPage(page);
    await signIn(page, baseUrl, 'consultant@browseline.test');
    await page.waitForURL(`${baseUrl}/desk`);
    await page.goto(`${baseUrl}/clients`);
    await page.getByRole('link', { name: 'Okonkwo-Larsen Family' }).first().click();
    await page.waitForURL(/\/clients\/\d+$/);
    await page.getByRole('link', { name: 'Preview as client' }).click();
    await page.getByRole('link', { name: 'See the plan of Kettle Hollow Farm' }).click();
    await page.waitForURL(/\/preview\/clients\/\d+\/properties\/\d+$/);
    await page.getByRole('link', { name: 'This season and last, side by side' }).click();
    await page.waitForURL(/\/preview\/clients\/\d+\/properties\/\d+\/seasons$/);
    const brassica = page.getByRole('listitem').filter({ has: page.getByRole('heading', { name: 'Hollow brassica plot' }) });
    await expect.poll(() => brassica.getByText(/^(Established|Thin stand|Failed stand)$/).count(), { timeout: 20_000 }).toBe(2);
    // The crumbs lead back inside the preview, not to the client's own portal.
    expect(await page.getByRole('navigation', { name: 'Breadcrumb' }).getByRole('link', { name: 'Kettle Hollow Farm' }).getAttribute('href')).toMatch(/^\/preview\/clients\/\d+\/properties\/\d+$/);
    await screenshot(page, 'preview-seasons');
    watch.assertClean();
    await context.close();
  });
});
