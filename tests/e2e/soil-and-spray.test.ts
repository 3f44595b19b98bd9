import { describe, expect, inject, it } from 'vitest';
import type { Page } from 'playwright-core';
import { journeyBrowser, screenshot, signIn, watchPage } from '../support/browser';
import { expectNoAxeViolations } from '../support/axe';

const baseUrl = inject('baseUrl');

const poll = <T>(fn: () => Promise<T> | T) => expect.poll(fn, { timeout: 20_000, interval: 100 });

const browser = journeyBrowser();

async function demoFarm(page: Page) {
  const properties = (await (await page.request.get(`${baseUrl}/api/properties`)).json()) as { data: { id: number; name: string }[] };
  const farm = properties.data.find((p) => p.name === 'Kettle Hollow Farm')!;
  const units = (await (await page.request.get(`${baseUrl}/api/properties/${farm.id}/units`)).json()) as { data: { id: number; name: string }[] };
  return { farm, units: units.data };
}

describe('soil tests on screen, spray records and the EPA Reg. No.', () => {
  it('the consultant types a soil test with its live recommendation, then imports a lab file for several units, all rows or none', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 }, bypassCSP: true }); // bypassCSP only to inject axe
    const page = await context.newPage();
    const watch = watchPage(page);
    await signIn(page, baseUrl, 'consultant@browseline.test');
    await page.waitForURL(`${baseUrl}/desk`);
    const { farm, units } = await demoFarm(page);
    const ridge = units.find((u) => u.name === 'Ridge clover plot')!;

    await page.goto(`${baseUrl}/properties/${farm.id}/units/${ridge.id}`);
    const form = page.getByRole('form', { name: 'Enter a soil test' });
    await form.getByLabel('Laboratory').fill('Valley soil lab');
    await form.getByLabel('Soil pH').fill('5.6');
    await form.getByLabel('ENM, lb/acre').fill('1200');
    await form.getByLabel('P, ppm').fill('20');
    await form.getByLabel('K, ppm').fill('110');
    // The demo firm is in the Midwest: University of Missouri ENM method; 1,200 lb ENM ÷ 400 lb ENM/ton = 3 t/acre (MU Extension),
    // to the clover's target pH 6.5 (Univ. of Kentucky AGR-33; Tri-State Table 1). P (25 − 20) × 20 ÷ 4 + 30 = 55 (Tri-State);
    // K 110 ≥ 105 ppm, the critical level without a CEC (2020 Tri-State 120 ppm Mehlich-3 ÷ 1.14, Ohio State ANR-75): maintenance 60 (from memory).
    const preview = form.getByTestId('soil-test-preview');
    await poll(() => preview.textContent()).toMatch(/Lime 3 t\/acre to pH 6\.5.*P2O5 55 lb\/acre, K2O 60 lb\/acre/);
    // The same numbers from a Mehlich-3 report are converted first (ANR-75): P 20 ÷ 1.35 = 14.8 → (25 − 14.8) × 20 ÷ 4 + 30 = 81;
    // K 110 ÷ 1.14 = 96.5 → (105 − 96.5) × 8 ÷ 4 + 60 = 77.
    await form.getByLabel('P and K method').selectOption('mehlich-3');
    await poll(() => preview.textContent()).toMatch(/P2O5 81 lb\/acre, K2O 77 lb\/acre.*Bray P1 14\.8, ammonium-acetate K 96\.5/);
    await form.getByLabel('P and K method').selectOption('bray-nh4oac');
    await poll(() => preview.textContent()).toMatch(/P2O5 55 lb\/acre, K2O 60 lb\/acre/);
    // A pH outside 3–10 is refused in the form, naming the field; nothing is sent.
    await form.getByLabel('Soil pH').fill('12');
    await poll(() => preview.textContent()).toMatch(/ph must lie between 3 and 10/i);
    await form.getByRole('button', { name: 'Save the soil test' }).click();
    await poll(() => form.getByText('Ph must lie between 3 and 10', { exact: true }).isVisible()).toBe(true);
    await form.getByLabel('Soil pH').fill('5.6');
    await expectNoAxeViolations(page, 'soil test form');
    await screenshot(page, 'soil-test-form-preview');
    await form.getByRole('button', { name: 'Save the soil test' }).click();
    const soilTests = page.locator('section', { has: page.getByRole('heading', { name: 'Soil tests', exact: true }) });
    await poll(() => soilTests.textContent()).toMatch(/Valley soil lab: pH 5\.6.*Lime 3 t\/acre/);

    // A fresh form for the next sample: the date and lab stay, the readings are cleared.
    await poll(() => page.getByRole('form', { name: 'Enter a soil test' }).getByLabel('Soil pH').inputValue()).toBe('');
    expect(await page.getByRole('form', { name: 'Enter a soil test' }).getByLabel('Laboratory').inputValue()).toBe('Valley soil lab');
    // The unit's history gathers the season: the demo's browse check and the soil test just typed.
    const history = page.locator('section', { has: page.getByRole('heading', { name: 'Season by season', exact: true }) });
    await poll(() => history.last().textContent()).toMatch(/Valley soil lab: pH 5\.6; lime 3 t\/acre/);
    await screenshot(page, 'unit-history');

    // A lab's file for several units, in the lab's own column names.
    await page.getByRole('link', { name: 'Import a lab’s results file for several units' }).click();
    await page.waitForURL(`${baseUrl}/properties/${farm.id}/soil-tests`);
    const names = units.slice(0, 2).map((u) => u.name);
    const bad = `Field ID,Date Sampled,Lab,Soil pH,ENM,P (ppm),K (ppm)\n${names[0]},2026-03-02,Valley soil lab,5.8,800,25,120\nBack forty,2026-03-02,Valley soil lab,6.0,400,30,150\n${names[1]},2026-03-02,Valley soil lab,11,400,30,150\n`;
    await page.getByLabel('Results file (CSV)').setInputFiles({ name: 'valley-lab.csv', mimeType: 'text/csv', buffer: Buffer.from(bad) });
    // The columns are guessed from the header; each wrong row says what to change; the import waits.
    await poll(() => page.getByLabel('Unit name').inputValue()).toBe('Field ID');
    await poll(() => page.getByTestId('soil-csv-row-3').textContent()).toMatch(/“Back forty” is not a unit of this property/);
    await poll(() => page.getByTestId('soil-csv-row-4').textContent()).toMatch(/ph must lie between 3 and 10/);
    await poll(() => page.getByTestId('soil-csv-row-2').textContent()).toMatch(/Lime 2 t\/acre/); // 800 ÷ 400 (MU Extension)
    expect(await page.getByRole('button', { name: 'Import 3 rows' }).isDisabled()).toBe(true);
    await expectNoAxeViolations(page, 'soil test import');
    await screenshot(page, 'soil-test-import-problems');
    const before = (await (await page.request.get(`${baseUrl}/api/units/${units[0]!.id}/soil-tests`)).json()) as { data: unknown[] };

    const good = `Field ID,Date Sampled,Lab,Soil pH,ENM,P (ppm),K (ppm)\n${names[0]},2026-03-02,Valley soil lab,5.8,800,25,120\n${names[1]},2026-03-02,Valley soil lab,6.6,,30,150\n`;
    await page.getByLabel('Results file (CSV)').setInputFiles({ name: 'valley-lab-fixed.csv', mimeType: 'text/csv', buffer: Buffer.from(good) });
    await poll(() => page.getByRole('button', { name: 'Import 2 rows' }).isEnabled()).toBe(true);
    await page.getByRole('button', { name: 'Import 2 rows' }).click();
    await poll(() => page.getByText('2 soil tests imported with their recommendations.').isVisible()).toBe(true);
    const after = (await (await page.request.get(`${baseUrl}/api/units/${units[0]!.id}/soil-tests`)).json()) as { data: unknown[] };
    expect(after.data.length).toBe(before.data.length + 1);
    watch.assertClean();
    await context.close();
  });

  it('the consultant gives a herbicide its EPA Reg. No. and reads the season’s spray records from the task', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 }, bypassCSP: true }); // bypassCSP only to inject axe
    const page = await context.newPage();
    const watch = watchPage(page);
    await signIn(page, baseUrl, 'consultant@browseline.test');
    await page.waitForURL(`${baseUrl}/desk`);
    const { farm } = await demoFarm(page);

    // The demo's record: the herbicide it used gets its EPA Reg. No. in the library.
    const today = new Date().toISOString().slice(0, 10);
    const year = Number(today.slice(0, 4));
    const lists = await Promise.all([year, year - 1].map(async (y) => ((await (await page.request.get(`${baseUrl}/api/spray-records?season=${y}`)).json()) as { data: { season: number; records: { taskId: number; productName: string; propertyId: number }[] } }).data));
    const list = lists.find((l) => l.records.length > 0)!;
    const record = list.records[0]!;

    await page.goto(`${baseUrl}/library/materials`);
    await page.getByRole('button', { name: `Edit ${record.productName}`, exact: true }).click();
    const epa = page.getByLabel('EPA Reg. No.');
    await epa.fill('524 475');
    await page.getByRole('button', { name: 'Save material' }).click();
    await poll(() => page.getByText(/EPA Reg\. No\. \(epaRegNo\): write it as on the label, e\.g\. 524-475/i).isVisible()).toBe(true);
    await screenshot(page, 'library-epa-reg-no-refused');
    await epa.fill('524-475');
    await page.getByRole('button', { name: 'Save material' }).click();
    await poll(() => page.getByRole('cell', { name: '524-475', exact: true }).isVisible()).toBe(true);

    // From the task on the schedule to its spray record.
    await page.goto(`${baseUrl}/schedule?task=${record.taskId}`);
    await page.getByRole('link', { name: 'Spray record of this application' }).click();
    await page.waitForURL(/\/spray-records\?/);
    const row = page.locator('tr[aria-current="true"]');
    // A record is a copy made at the application (the demo's came before the number was entered), so it keeps what it had.
    await poll(() => row.textContent()).toContain(record.productName);
    await poll(() => row.textContent()).toMatch(/EPA Reg\. No\./);
    await poll(() => page.getByRole('note', { name: 'Herbicides: the label is the law' }).textContent()).toMatch(/certified applicator.*local licensed practice/);
    expect(await page.getByLabel('Property').inputValue()).toBe(String(farm.id === record.propertyId ? farm.id : record.propertyId));
    // Filters: a word no record holds empties the table; restricted-use only keeps none of the demo's.
    await page.getByLabel('Product, unit or applicator').fill('nothing-like-this');
    await poll(() => page.getByText('No record matches the filters').isVisible()).toBe(true);
    await page.getByLabel('Product, unit or applicator').fill('');
    await poll(() => page.getByTestId('spray-record-row').count()).toBeGreaterThan(0);
    await expectNoAxeViolations(page, 'spray records');
    await screenshot(page, 'spray-records');
    // The CSV export of the same season and property: the 7 CFR 110.3 columns and the demo's application.
    const csvHref = await page.getByRole('link', { name: 'CSV' }).getAttribute('href');
    expect(csvHref).toBe(`/api/spray-records?season=${list.season}&format=csv&propertyId=${record.propertyId}`);
    const csv = await (await page.request.get(`${baseUrl}${csvHref}`)).text();
    expect(csv.split('\n')[0]).toMatch(/Product,EPA Reg\. No\.,Restricted use,Total amount applied.*Applicator,Certification No\./);
    expect(csv).toContain(record.productName);
    watch.assertClean();
    await context.close();
  });
  it('the owner chooses the firm’s lime method and retest years for soil tests', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    const watch = watchPage(page);
    await signIn(page, baseUrl, 'owner@browseline.test');
    await page.waitForURL(`${baseUrl}/desk`);
    await page.goto(`${baseUrl}/settings/team`);
    const form = page.getByRole('form', { name: 'Soil-test settings' });
    // The demo firm is in the Midwest: by default the University of Missouri ENM method, retest after 3 years.
    await poll(() => form.getByLabel('Lime by').inputValue()).toBe('');
    expect(await form.getByLabel('Retest soil after (years)').inputValue()).toBe('3');
    await form.getByLabel('Retest soil after (years)').fill('0');
    await form.getByRole('button', { name: 'Save soil-test settings' }).click();
    await poll(() => form.getByText(/at least 1 year/).isVisible()).toBe(true);
    await form.getByLabel('Retest soil after (years)').fill('4');
    await form.getByRole('button', { name: 'Save soil-test settings' }).click();
    await poll(() => page.getByText('Soil-test settings saved; new soil tests use them.').isVisible()).toBe(true);
    await form.scrollIntoViewIfNeeded();
    await screenshot(page, 'soil-test-settings');
    const firm = (await (await page.request.get(`${baseUrl}/api/firm`)).json()) as { data: { settings: { soilRetestYears: number; limeMethod: string | null } } };
    expect(firm.data.settings).toMatchObject({ soilRetestYears: 4, limeMethod: null });
    watch.assertClean();
    await context.close();
  });
});
