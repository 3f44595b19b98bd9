import { describe, expect, inject, it } from 'vitest';
import type { Page } from 'playwright-core';
import { journeyBrowser, screenshot, signIn, watchPage } from '../support/browser';
import { formatDollars } from '../../shared/domain/prescription-summary';

const baseUrl = inject('baseUrl');

const browser = journeyBrowser();

async function signInAsConsultant(page: Page) {
  await signIn(page, baseUrl, 'consultant@browseline.test');
  await page.waitForURL(`${baseUrl}/desk`);
}

/** An API answer's data, read with the signed-in page's cookie. */
async function apiData<T>(page: Page, path: string): Promise<T> {
  const res = await page.request.get(`${baseUrl}${path}`);
  expect(res.status()).toBe(200);
  return ((await res.json()) as { data: T }).data;
}

describe('the consultant writes prescriptions and keeps the practice library', () => {
  it('writes a fall brassica prescription on a demo food plot and sees its quantities, schedule, cost and the herbicide caution', async () => {
    const context = await browser.newContext({ viewport: { width: 1366, height: 1000 } });
    const page = await context.newPage();
    const watch = watchPage(page);
    await signInAsConsultant(page);
    // Demo seed: Kettle Hollow Farm has the food plots "Hollow brassica plot" and "Ridge clover plot".
    const properties = await apiData<{ id: number; name: string }[]>(page, '/api/properties');
    const property = properties.find((p) => p.name === 'Kettle Hollow Farm');
    expect(property).toBeDefined();
    const before = await apiData<{ totalCents: number; unitName: string }[]>(page, `/api/properties/${property!.id}/prescriptions`);
    const beforeTotal = before.reduce((sum, p) => sum + p.totalCents, 0);

    await page.goto(`${baseUrl}/properties/${property!.id}/prescriptions`);
    await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toBe('Prescriptions — Kettle Hollow Farm');
    expect(await page.getByText('Property total').locator('..').textContent()).toContain(formatDollars(beforeTotal));
    const foodPlots = page.getByRole('region', { name: /Food plot/ });
    await foodPlots.getByRole('button', { name: /Ridge clover plot/ }).click();
    const panel = page.getByRole('region', { name: 'Prescriptions for Ridge clover plot' });
    await panel.getByRole('button', { name: 'Write prescription' }).click();

    // Only practices written for food plots are offered.
    const practiceOptions = await panel.getByLabel('Practice').locator('option').allTextContents();
    expect(practiceOptions).toContain('Fall brassica plot');
    expect(practiceOptions).not.toContain('Mock scrape');
    await panel.getByLabel('Practice').selectOption({ label: 'Fall brassica plot' });
    const year = new Date().getUTCFullYear() + 1;
    await panel.getByLabel('Season year').fill(String(year));
    await panel.getByLabel('Target date').fill(`${year}-08-05`);
    const preview = panel.getByRole('region', { name: 'Preview' });
    // Starter library: 2 t/acre of lime on the plot's 6.9525 acres (measured on the WGS84 ellipsoid) = 13.91 tons.
    await expect.poll(() => preview.textContent()).toContain('13.91 tons');
    // An unreadable tank size is marked at its box and the preview waits for a number.
    await panel.getByLabel('Tank, gal').fill('big');
    await expect.poll(() => panel.getByText('“big” is not a number.').count()).toBe(1);
    await panel.getByLabel('Tank, gal').fill('25');
    await expect.poll(() => preview.textContent()).toContain('5 tank loads');
    await screenshot(page, 'prescription-preview');
    await panel.getByRole('button', { name: 'Save prescription' }).click();
    await expect.poll(() => page.getByText('Fall brassica plot written for Ridge clover plot.').count()).toBe(1);

    const saved = panel.getByRole('article', { name: /Fall brassica plot/ });
    await expect.poll(() => saved.getByRole('region', { name: 'Quantities' }).count()).toBe(1);
    const quantities = (await saved.getByRole('region', { name: 'Quantities' }).textContent()) ?? '';
    // Worked from the starter library on 6.9525 acres (the plot on the WGS84 ellipsoid): seed
    // (2.7 + 1.65 + 4) lb/acre = 58.05 lb bulk; lime 2 t/acre = 13.91 tons; fertilizer 40 lb N as
    // 13-13-13 (307.7 lb/acre) + 40 lb N as 46-0-0 (86.96 lb/acre) = 2,744 lb in 43 + 13 = 56 bags of
    // 50 lb; glyphosate 2 qt/acre = 3.48 gal, and 104.3 gal of spray at 15 GPA fill a 25-gal tank 5 times.
    expect(quantities).toMatch(/58(\.1)? lb/);
    expect(quantities).toContain('13.91 tons');
    expect(quantities).toContain('2,744 lb');
    expect(quantities).toContain('56 bags');
    expect(quantities).toContain('3.48 gal');
    expect(quantities).toContain('5 tank loads');
    const toBuy = (await saved.getByRole('region', { name: 'To buy' }).textContent()) ?? '';
    expect(toBuy).toContain('Dwarf Essex rape seed'); // 4 lb/acre × 6.9525 = 27.81 lb → 3 bags of 10 lb
    expect(toBuy).toContain('27.81 lb → 3 × 10-lb bag, 2.19 lb left over');
    const schedule = (await saved.getByRole('region', { name: 'Schedule' }).textContent()) ?? '';
    for (const step of ['Soil test', 'Burn-down spray', 'Broadcast brassica seed', 'Nitrogen topdress']) expect(schedule).toContain(step);
    // Burn-down 7–14 days before seeding on Aug 5 (starter library): Jul 22 – Jul 29.
    expect(schedule).toContain(`Jul 22 – Jul 29, ${year}`);

    // The cost on screen is the server's figure.
    const afterList = await apiData<{ id: number; unitName: string; practiceName: string; totalCents: number }[]>(page, `/api/properties/${property!.id}/prescriptions`);
    const written = afterList.find((p) => p.unitName === 'Ridge clover plot' && p.practiceName === 'Fall brassica plot');
    expect(written).toBeDefined();
    expect(await saved.getByTestId('prescription-total').textContent()).toBe(formatDollars(written!.totalCents));
    await expect.poll(async () => page.getByText('Property total').locator('..').textContent()).toContain(formatDollars(beforeTotal + written!.totalCents));

    const caution = saved.getByRole('note', { name: 'Herbicide work' });
    expect(await caution.textContent()).toContain('the label is the law');
    await screenshot(page, 'prescription-saved');

    // Delete it again, leaving the demo as it was.
    await saved.getByRole('button', { name: 'Delete' }).click();
    await saved.getByRole('button', { name: 'Yes, delete' }).click();
    await expect.poll(() => panel.getByRole('article', { name: /Fall brassica plot/ }).count()).toBe(0);
    const finalList = await apiData<{ id: number }[]>(page, `/api/properties/${property!.id}/prescriptions`);
    expect(finalList.some((p) => p.id === written!.id)).toBe(false);
    watch.assertClean();
    await context.close();
  });

  it('refuses a seed purity above 100 % at the field, then adds the fixed seed to the table', async () => {
    const context = await browser.newContext({ viewport: { width: 1366, height: 1000 } });
    const page = await context.newPage();
    const watch = watchPage(page);
    await signInAsConsultant(page);
    await page.getByRole('navigation', { name: 'Places' }).getByRole('link', { name: 'Library' }).click();
    await page.waitForURL(`${baseUrl}/library/practices`);
    await page.getByRole('navigation', { name: 'Library' }).getByRole('link', { name: 'Materials' }).click();
    await page.waitForURL(`${baseUrl}/library/materials`);

    const name = `Medium red clover ${Date.now().toString(36)}`;
    await page.getByRole('button', { name: 'Add material' }).click();
    const form = page.getByRole('form', { name: 'New seed' });
    await form.getByLabel('Name').fill(name);
    await form.getByLabel('Species').fill('red clover');
    await form.getByLabel('Purity, %').fill('120');
    await form.getByLabel('Germination, %').fill('85');
    await form.getByLabel('Package size, lb').fill('50');
    await form.getByLabel('Package price, $').fill('212.50');
    await form.getByRole('button', { name: 'Add material' }).click();

    const purity = form.getByLabel('Purity, %');
    await expect.poll(() => purity.getAttribute('aria-invalid')).toBe('true');
    const errorId = await purity.getAttribute('aria-describedby');
    // MaterialCreateSchema: purity is a percentage from 0 to 100.
    expect(await page.locator(`[id="${errorId}"]`).textContent()).toBe('Purity must be between 0 and 100');
    await screenshot(page, 'material-purity-error');

    await purity.fill('98');
    await form.getByRole('button', { name: 'Add material' }).click();
    await expect.poll(() => page.getByText(`${name} added to the library.`).count()).toBe(1);
    const seedTable = page.getByRole('region', { name: 'Seed' });
    const row = seedTable.getByRole('row', { name: new RegExp(name) });
    await expect.poll(() => row.count()).toBe(1);
    const cells = await row.getByRole('cell').allTextContents();
    // PLS = purity × germination = 0.98 × 0.85 = 83.3 % (AOSA definition of pure live seed).
    expect(cells).toEqual(expect.arrayContaining(['red clover', '98 % × 85 %', '83.3 %', '50 lb', '$212.50']));
    await screenshot(page, 'material-added');

    // Archive it again.
    await row.getByRole('button', { name: `Archive ${name}` }).click();
    await row.getByRole('button', { name: 'Archive it' }).click();
    await expect.poll(() => seedTable.getByRole('row', { name: new RegExp(name) }).count()).toBe(0);
    watch.assertClean();
    await context.close();
  });
});
