import { createRequire } from 'node:module';
import { describe, expect, inject, it } from 'vitest';
import type { Page } from 'playwright-core';
import { journeyBrowser, screenshot, signIn, watchPage } from '../support/browser';

const baseUrl = inject('baseUrl');
const require = createRequire(import.meta.url);

const browser = journeyBrowser();

/** The names in the first column of the visible table, top to bottom. */
const rowNames = (page: Page) => page.locator('table tbody th[scope="row"]').allTextContents();
/** The figures of a right-aligned column ("276.4 ac" → 276.4; "—" → NaN). */
const columnFigures = async (page: Page, index: number) =>
  (await page.locator(`table tbody tr td:nth-of-type(${index})`).allTextContents()).map((t) => Number.parseFloat(t.replace(/,/g, '')));

async function signInAsConsultant(page: Page) {
  await signIn(page, baseUrl, 'consultant@browseline.test');
  await page.waitForURL(`${baseUrl}/desk`);
}

describe('the consultant keeps clients and properties', () => {
  it('sorts the clients table by a header and finds clients from the table search and the top bar', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 800 } });
    const page = await context.newPage();
    const watch = watchPage(page);
    await signInAsConsultant(page);
    await page.getByRole('navigation', { name: 'Places' }).getByRole('link', { name: 'Clients' }).click();
    await page.waitForURL(`${baseUrl}/clients`);
    // Demo seed: Bluestem Ridge Hunting Club, Havlicek, Okonkwo-Larsen Family; sorted by name at first.
    await expect.poll(() => rowNames(page)).toContain('Bluestem Ridge Hunting Club');
    const byName = await rowNames(page);
    expect(byName).toEqual([...byName].sort((a, b) => a.localeCompare(b, 'en', { sensitivity: 'base', numeric: true })));

    const acresHeader = page.getByRole('columnheader', { name: /Acres/ });
    await acresHeader.getByRole('button').click();
    await expect.poll(() => acresHeader.getAttribute('aria-sort')).toBe('descending');
    // Demo seed: the club's Bluestem Ridge (about 276 ac) is the largest holding.
    expect((await rowNames(page))[0]).toBe('Bluestem Ridge Hunting Club');
    const desc = (await columnFigures(page, 4)).filter((n) => !Number.isNaN(n));
    expect(desc).toEqual([...desc].sort((a, b) => b - a));
    // The same header from the keyboard.
    await acresHeader.getByRole('button').focus();
    await page.keyboard.press('Enter');
    await expect.poll(() => acresHeader.getAttribute('aria-sort')).toBe('ascending');
    const asc = (await columnFigures(page, 4)).filter((n) => !Number.isNaN(n));
    expect(asc).toEqual([...asc].sort((a, b) => a - b));
    expect(await page.getByRole('columnheader', { name: /Name/ }).getAttribute('aria-sort')).toBe('none');

    await page.getByLabel('Filter clients', { exact: true }).fill('OKONKWO');
    await expect.poll(() => rowNames(page)).toEqual(['Okonkwo-Larsen Family']);
    expect(new URL(page.url()).searchParams.get('q')).toBe('OKONKWO');
    await page.getByLabel('Filter clients', { exact: true }).fill('no such client anywhere');
    await expect.poll(() => page.getByText('No clients match “no such client anywhere”.').count()).toBe(1);
    await page.getByRole('button', { name: 'clear the search' }).click();
    await expect.poll(async () => (await rowNames(page)).length).toBeGreaterThanOrEqual(3);

    // The top bar's search lists matching records of every kind, a typo forgiven; choosing one opens it.
    await page.goto(`${baseUrl}/desk`);
    await page.locator('#global-search').fill('blustem ridge hunting');
    const option = page.getByRole('listbox', { name: 'Search results' }).getByRole('option').filter({ hasText: 'Bluestem Ridge Hunting Club' }).first();
    await option.waitFor();
    await screenshot(page, 'clients-search');
    await option.click();
    await page.waitForURL(/\/clients\/\d+$/);
    await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toContain('Bluestem Ridge Hunting Club');
    watch.assertClean();
    await context.close();
  });

  it('creates a client, opens it, adds a property and finds it in the properties list', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    const watch = watchPage(page);
    const stamp = Date.now().toString(36);
    const clientName = `Juniper Flats Trust ${stamp}`;
    const propertyName = `Cedar Draw ${stamp}`;
    await signInAsConsultant(page);
    await page.goto(`${baseUrl}/clients`);

    await page.getByRole('button', { name: 'New client' }).click();
    const form = page.getByRole('form', { name: 'New client' });
    await form.getByRole('button', { name: 'Add client' }).click();
    await expect.poll(() => form.getByText('enter the client’s name').count()).toBe(1);
    await form.getByLabel('Name').fill(clientName);
    await form.getByLabel('E-mail').fill('not-an-address');
    await form.getByRole('button', { name: 'Add client' }).click();
    await expect.poll(() => form.getByText('enter an e-mail address like name@example.com').count()).toBe(1);
    await form.getByLabel('E-mail').fill(`trustee-${stamp}@example.test`);
    await form.getByLabel('Phone').fill('(555) 010-4477');
    await form.getByRole('button', { name: 'Add client' }).click();
    await page.waitForURL(/\/clients\/\d+$/);
    await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toBe(clientName);
    await expect.poll(() => page.getByRole('status').filter({ hasText: `${clientName} added` }).count()).toBe(1);
    const clientPath = new URL(page.url()).pathname;

    // Open it again from the table: search, then click the row outside the name link.
    await page.getByRole('navigation', { name: 'Places' }).getByRole('link', { name: 'Clients' }).click();
    await page.getByLabel('Filter clients', { exact: true }).fill(stamp);
    await expect.poll(() => rowNames(page)).toEqual([clientName]);
    await page.locator('table tbody tr').first().locator('td').last().click();
    await page.waitForURL(`${baseUrl}${clientPath}`);
    await expect.poll(() => page.getByText('No properties yet').count()).toBe(1);
    await expect.poll(() => page.getByText('No portal contacts yet').count()).toBe(1);

    // Invite the landowner to the portal: the contact shows as invited.
    const invite = page.getByRole('form', { name: 'Invite a contact' });
    await invite.getByLabel('Contact name').fill('Dana Whitcomb');
    await invite.getByLabel('Contact e-mail').fill(`dana-${stamp}@example.test`);
    await invite.getByRole('button', { name: 'Send invitation' }).click();
    await expect.poll(() => page.getByRole('status').filter({ hasText: `Invitation sent to dana-${stamp}@example.test` }).count()).toBe(1);
    const contacts = page.getByRole('list', { name: 'Portal contacts' });
    await expect.poll(() => contacts.getByRole('listitem').filter({ hasText: 'Dana Whitcomb' }).filter({ hasText: 'Invited' }).count()).toBe(1);

    await page.getByRole('button', { name: 'New property' }).click();
    const propertyForm = page.getByRole('form', { name: 'New property' });
    await expect.poll(() => propertyForm.getByText(/saving opens the property’s plan map, where you draw it or import it/).count()).toBe(1);
    await propertyForm.getByLabel('Property name').fill(propertyName);
    await propertyForm.getByLabel('County').fill('Crawford');
    await propertyForm.getByLabel('State').fill('WI');
    await propertyForm.getByLabel('Region').selectOption('midwest');
    await propertyForm.getByLabel('Objectives').fill('Hold deer through the late season on the south slope.');
    await screenshot(page, 'client-new-property');
    await propertyForm.getByRole('button', { name: 'Add property' }).click();
    // "Add property" lands on the new property's plan map.
    await page.waitForURL(/\/properties\/\d+\/map$/);
    await page.goBack();
    await page.waitForURL(/\/clients\/\d+$/);
    await expect.poll(() => rowNames(page)).toEqual([propertyName]);
    expect(await page.getByRole('link', { name: `Plan map of ${propertyName}` }).getAttribute('href')).toMatch(/^\/properties\/\d+\/map$/);
    await screenshot(page, 'client-page');

    await page.getByRole('navigation', { name: 'Places' }).getByRole('link', { name: 'Properties' }).click();
    await page.waitForURL(`${baseUrl}/properties`);
    await expect.poll(() => rowNames(page)).toContain(propertyName);
    // Demo seed: Kettle Hollow Farm belongs to another client, so filtering by ours leaves only the new property.
    expect(await rowNames(page)).toContain('Kettle Hollow Farm');
    await page.getByLabel('Client', { exact: true }).selectOption({ label: clientName });
    await expect.poll(() => rowNames(page)).toEqual([propertyName]);
    await screenshot(page, 'properties-filtered');

    await page.getByRole('link', { name: propertyName, exact: true }).click();
    await page.waitForURL(/\/properties\/\d+$/);
    await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toBe(propertyName);
    await expect.poll(() => page.getByRole('img', { name: 'No boundary yet' }).count()).toBe(1);
    expect(await page.getByRole('link', { name: 'Open plan map' }).getAttribute('href')).toMatch(/^\/properties\/\d+\/map$/);
    await screenshot(page, 'property-page');

    const edit = page.getByRole('form', { name: 'Edit property' });
    await edit.getByLabel('Objectives').fill('More browse on the east edge.');
    await edit.getByRole('button', { name: 'Save changes' }).click();
    await expect.poll(() => page.getByRole('status').filter({ hasText: `${propertyName} saved.` }).count()).toBe(1);
    await page.reload();
    await expect.poll(() => page.getByLabel('Objectives').inputValue()).toBe('More browse on the east edge.');

    // Deleting asks first, then goes back to the list, where the property is gone.
    await page.getByRole('button', { name: 'Delete property' }).click();
    const dialog = page.getByRole('dialog', { name: `Delete ${propertyName}?` });
    await dialog.getByRole('button', { name: 'Delete property' }).click();
    await page.waitForURL(/\/properties\?client=\d+$/);
    await expect.poll(() => page.getByText('has no properties yet').count()).toBe(1);
    watch.assertClean();
    await context.close();
  });

  it('shows a demo property with its measured boundary and the way to its plan map', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    const watch = watchPage(page);
    await signInAsConsultant(page);
    await page.goto(`${baseUrl}/properties?q=sawmill`);
    await expect.poll(() => rowNames(page)).toEqual(['Sawmill Ridge 80']);
    await page.getByRole('link', { name: 'Sawmill Ridge 80', exact: true }).click();
    await page.waitForURL(/\/properties\/\d+$/);
    // Demo seed: Sawmill Ridge 80 is a surveyed "80" of about 78 acres.
    await expect.poll(() => page.getByRole('img', { name: /Outline of Sawmill Ridge 80, 78\.\d ac/ }).count()).toBe(1);
    expect(await page.locator('svg[role="img"] path').first().getAttribute('d')).toMatch(/^M[\d.]+[ ,][\d.]+L/);
    await expect.poll(() => page.getByText('Hectares').count()).toBe(1);
    await screenshot(page, 'property-demo');
    watch.assertClean();
    await context.close();
  });

  it('fits the clients and property pages on a 360 px phone', async () => {
    const context = await browser.newContext({ viewport: { width: 360, height: 740 } });
    const page = await context.newPage();
    await signInAsConsultant(page);
    for (const path of ['/clients', '/properties']) {
      await page.goto(`${baseUrl}${path}`);
      await expect.poll(async () => (await rowNames(page)).length).toBeGreaterThan(0);
      const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
      expect(overflow).toBeLessThanOrEqual(0);
      await screenshot(page, `phone${path.replace('/', '-')}`);
    }
    await context.close();
  });

  it('has no serious or critical accessibility problems on the clients and properties pages (axe-core)', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 }, bypassCSP: true });
    const page = await context.newPage();
    const seriousProblems = async () => {
      await page.addScriptTag({ path: require.resolve('axe-core/axe.min.js') });
      return page.evaluate(async () => {
        const result = await (window as unknown as { axe: { run: () => Promise<{ violations: { id: string; impact: string | null }[] }> } }).axe.run();
        return result.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical').map((v) => `${v.impact} ${v.id}`);
      });
    };
    await signInAsConsultant(page);
    for (const list of ['clients', 'properties']) {
      await page.goto(`${baseUrl}/${list}`);
      await expect.poll(async () => (await rowNames(page)).length).toBeGreaterThan(0);
      expect(await seriousProblems(), `/${list}`).toEqual([]);
      await page.locator('table tbody tr').first().getByRole('link').first().click();
      await page.waitForURL(new RegExp(`/${list}/\\d+$`));
      await expect.poll(() => page.getByRole('heading', { name: list === 'clients' ? 'Portal contacts' : 'Boundary' }).count()).toBe(1);
      expect(await seriousProblems(), page.url()).toEqual([]);
    }
    await context.close();
  });
});
