import { describe, expect, inject, it } from 'vitest';
import { journeyBrowser, screenshot, signIn, watchPage } from '../support/browser';

const baseUrl = inject('baseUrl');

const browser = journeyBrowser();

describe('each demo role signs in through the form and lands on its own home', () => {
  const cases = [
    { email: 'owner@browseline.test', path: '/desk', heading: 'Desk', viewport: { width: 1280, height: 800 } },
    { email: 'consultant@browseline.test', path: '/desk', heading: 'Desk', viewport: { width: 1280, height: 800 } },
    { email: 'crew@browseline.test', path: '/field', heading: 'Field sheet', viewport: { width: 390, height: 844 } },
    { email: 'client@browseline.test', path: '/portal', heading: 'Your land', viewport: { width: 390, height: 844 } },
  ];
  for (const c of cases) {
    it(`${c.email} → ${c.path}`, async () => {
      const context = await browser.newContext({ viewport: c.viewport });
      const page = await context.newPage();
      const watch = watchPage(page);
      await signIn(page, baseUrl, c.email);
      await page.waitForURL(`${baseUrl}${c.path}`);
      await expect.poll(() => page.getByRole('heading', { level: 1 }).first().textContent()).toBe(c.heading);
      await screenshot(page, `home-${c.email.split('@')[0]}`);
      watch.assertClean();
      await context.close();
    });
  }

  it('shows the demo firm’s real data on the Desk and the client’s own land in the portal', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    await signIn(page, baseUrl, 'consultant@browseline.test');
    await page.waitForURL(`${baseUrl}/desk`);
    await expect.poll(() => page.getByText('Kettle Hollow Farm').count()).toBeGreaterThan(0);
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL(`${baseUrl}/login`);
    await signIn(page, baseUrl, 'client@browseline.test');
    await page.waitForURL(`${baseUrl}/portal`);
    await expect.poll(() => page.getByText('Kettle Hollow Farm').count()).toBeGreaterThan(0);
    expect(await page.getByText('Bluestem Ridge').count()).toBe(0);
    await context.close();
  });

  it('keeps a wrong password on the sign-in page with one neutral message', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    await signIn(page, baseUrl, 'owner@browseline.test', 'not-the-password');
    await expect.poll(() => page.getByRole('alert').textContent()).toMatch(/do not match an account/);
    expect(new URL(page.url()).pathname).toBe('/login');
    await screenshot(page, 'sign-in-wrong-password');
    await context.close();
  });

  it('sends a signed-out visitor of a private page to sign-in, then back to it', async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    await page.goto(`${baseUrl}/settings/team`);
    await page.waitForURL(/\/login\?next=/);
    await page.getByLabel('E-mail').fill('owner@browseline.test');
    await page.getByLabel('Password').fill('demo-browseline');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(`${baseUrl}/settings/team`);
    await expect.poll(() => page.getByText('Rosa Quintero').count()).toBeGreaterThan(0);
    await screenshot(page, 'settings-team');
    await context.close();
  });
});
