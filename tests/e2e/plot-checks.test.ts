import { describe, expect, inject, it } from 'vitest';
import { journeyBrowser, screenshot, signIn, watchPage } from '../support/browser';
import { expectNoAxeViolations } from '../support/axe';
import { PLOT_STATUS_LABELS } from '../../shared/schemas/checks';

const baseUrl = inject('baseUrl');

const poll = <T>(fn: () => Promise<T> | T) => expect.poll(fn, { timeout: 20_000, interval: 100 });

const browser = journeyBrowser();

describe('plots that report back', () => {
  it('the consultant records a failed establishment check and a browse check, accepts the re-seeding, and drafts next season with the shifted mix', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 }, bypassCSP: true }); // bypassCSP only to inject axe
    const page = await context.newPage();
    const watch = watchPage(page);
    await signIn(page, baseUrl, 'consultant@browseline.test');
    await page.waitForURL(`${baseUrl}/desk`);
    const properties = (await (await page.request.get(`${baseUrl}/api/properties`)).json()) as { data: { id: number; name: string }[] };
    const farm = properties.data.find((p) => p.name === 'Kettle Hollow Farm')!;
    const units = (await (await page.request.get(`${baseUrl}/api/properties/${farm.id}/units`)).json()) as { data: { id: number; name: string }[] };
    const hollow = units.data.find((u) => u.name === 'Hollow brassica plot')!;
    const ridge = units.data.find((u) => u.name === 'Ridge clover plot')!;

    // The plan map's ledger lists the demo's checked plots with their status.
    await page.goto(`${baseUrl}/properties/${farm.id}/map`);
    const panel = page.getByRole('region', { name: 'Plot checks' });
    // Each plot shows the label of its latest check's status, as the API gives it (the demo's seasons decide which).
    const statuses = (await (await page.request.get(`${baseUrl}/api/properties/${farm.id}/plot-statuses`)).json()) as { data: { unitId: number; status: keyof typeof PLOT_STATUS_LABELS }[] };
    const hollowStatus = statuses.data.find((s) => s.unitId === hollow.id)!;
    const hollowRow = panel.getByRole('listitem').filter({ hasText: 'Hollow brassica plot' });
    await poll(() => hollowRow.isVisible()).toBe(true);
    expect(await hollowRow.textContent()).toContain(PLOT_STATUS_LABELS[hollowStatus.status]);
    await screenshot(page, 'plot-checks-plan-map');

    // A failed stand: one rape seedling in three square-foot frames.
    await page.goto(`${baseUrl}/properties/${farm.id}/units/${hollow.id}`);
    await poll(() => page.getByRole('heading', { name: 'Hollow brassica plot' }).isVisible()).toBe(true);
    const form = page.getByRole('form', { name: 'Record a check' });
    await form.getByLabel('Ground cover, %').fill('10');
    await form.getByLabel('Species, line 1').fill('rape');
    await form.getByLabel('Plants in the frame, line 1').fill('1');
    await form.getByRole('button', { name: 'Add a line' }).click();
    await form.getByLabel('Plants in the frame, line 2').fill('0');
    // The preview is computed in the browser with the server's function.
    // Rape is canola: 5 plants/ft² is the low end of the optimum stand (OMAFRA Field Crop News 2025; NDSU Crop & Pest Report 1999: 4 minimum).
    await poll(() => form.getByText(/^Failed: rape 0\.5\/ft² of 5/).isVisible()).toBe(true);
    // A count with a fraction is refused in the form, naming the field.
    await form.getByLabel('Plants in the frame, line 2').fill('0.5');
    await form.getByRole('button', { name: 'Save the check' }).click();
    await poll(() => form.getByRole('alert').textContent()).toMatch(/whole number/);
    await form.getByLabel('Plants in the frame, line 2').fill('0');
    await form.getByRole('button', { name: 'Save the check' }).click();
    await poll(() => page.getByText('Failed stand').first().isVisible()).toBe(true);
    await poll(() => page.getByRole('button', { name: 'Accept the re-seeding' }).count()).toBe(2); // the demo's thin stand and this one
    await expectNoAxeViolations(page, 'unit checks');
    await screenshot(page, 'plot-checks-failed-stand');
    await page.getByRole('button', { name: 'Accept the re-seeding' }).first().click();
    await poll(() => page.getByText(/Re-seeding accepted/).first().isVisible()).toBe(true);

    // A browse check on the clover plot: clover eaten hard, chicory barely.
    await page.goto(`${baseUrl}/properties/${farm.id}/units/${ridge.id}`);
    const browseForm = page.getByRole('form', { name: 'Record a check' });
    await browseForm.getByLabel('Kind of check').selectOption('browse');
    await browseForm.getByLabel('Species, line 1').fill('white clover');
    await browseForm.getByLabel('Caged, line 1').fill('10');
    await browseForm.getByLabel('Open, line 1').fill('1');
    await browseForm.getByRole('button', { name: 'Add a line' }).click();
    await browseForm.getByLabel('Species, line 2').fill('forage chicory');
    await browseForm.getByLabel('Caged, line 2').fill('10');
    await browseForm.getByLabel('Open, line 2').fill('9');
    // An open sample taller than its cage is refused with the reason.
    await browseForm.getByLabel('Open, line 2').fill('12');
    await browseForm.getByRole('button', { name: 'Save the check' }).click();
    await poll(() => browseForm.getByRole('alert').textContent()).toMatch(/open cannot exceed caged/);
    await browseForm.getByLabel('Open, line 2').fill('9');
    await browseForm.getByRole('button', { name: 'Save the check' }).click();
    await poll(() => page.getByText('Browsed hard').first().isVisible()).toBe(true);
    await screenshot(page, 'plot-checks-browse');

    // Next season: the failed plot sown again and the clover mix shifted toward what deer ate.
    const hollowRx = (await (await page.request.get(`${baseUrl}/api/units/${hollow.id}/prescriptions`)).json()) as { data: { year: number }[] };
    const season = Math.max(...hollowRx.data.map((p) => p.year)) + 1;
    await page.goto(`${baseUrl}/properties/${farm.id}/next-season`);
    await page.getByLabel('Season (year)').fill(String(season));
    await page.getByRole('button', { name: 'Draft the plan' }).click();
    await poll(() => page.getByText(/Failed stand at the check of/).first().isVisible()).toBe(true);
    await poll(() => page.getByText(/deer prefer white clover/).isVisible()).toBe(true);
    const accepts = page.getByRole('button', { name: /^Accept: / });
    const count = await accepts.count();
    for (let i = 0; i < count; i++) {
      await accepts.nth(i).click();
      await poll(() => accepts.nth(i).getAttribute('aria-pressed')).toBe('true');
    }
    await screenshot(page, 'plot-checks-next-season');
    await page.getByRole('button', { name: 'Write the season and draft the proposal' }).click();
    await page.getByRole('link', { name: `Open the draft proposal for ${season}` }).click();
    await page.waitForURL(/\/proposals\/\d+$/);
    await poll(() => page.getByText(/Hollow brassica plot/).first().isVisible()).toBe(true);
    await screenshot(page, 'plot-checks-next-season-proposal');
    watch.assertClean();
    await context.close();
  });
});
