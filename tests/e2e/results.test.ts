import { describe, expect, inject, it } from 'vitest';
import { journeyBrowser, screenshot, signIn, watchPage } from '../support/browser';
import { openProperty, signInAsConsultant } from '../support/journey-steps';

const baseUrl = inject('baseUrl');
let propertyId = 0;

const poll = <T>(fn: () => Promise<T> | T) => expect.poll(fn, { timeout: 20_000, interval: 100 });

const browser = journeyBrowser();

describe('season results from the consultant to the landowner', () => {
  it('the consultant records a survey and a harvest on Kettle Hollow Farm, sees the estimates and charts, and sends the season report', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    const watch = watchPage(page);
    await signInAsConsultant(page, baseUrl);
    propertyId = await openProperty(page, 'Kettle Hollow Farm');
    await page.getByRole('link', { name: 'Results', exact: true }).click();
    await page.waitForURL(`${baseUrl}/properties/${propertyId}/results`);

    // Demo seed: two late-summer surveys, the 2025 one shown first, and two seasons in the chart.
    await poll(() => page.getByRole('heading', { name: 'Late-summer survey 2025' }).count()).toBe(1);
    await poll(() => page.getByRole('figure', { name: 'Estimated deer by season' }).locator('.recharts-surface').first().isVisible()).toBe(true);
    await poll(() => page.getByRole('note', { name: 'Deer scents, baiting and feeding' }).isVisible()).toBe(true);

    // A survey with no recognisable buck is refused in the form, with the same sentence as the API.
    await page.getByRole('button', { name: 'Record a camera survey' }).click();
    const form = page.getByRole('form', { name: 'New camera survey' });
    await form.getByLabel('Survey name').fill('Early-autumn check');
    await form.getByLabel('First day').fill('2025-09-01');
    await form.getByLabel('Last day').fill('2025-09-05');
    await form.getByLabel('Buck photos').fill('30');
    await form.getByLabel('Unique bucks').fill('0');
    await form.getByLabel('Doe photos').fill('60');
    await form.getByLabel('Fawn photos').fill('25');
    expect(await form.getByLabel('Camera 1 — ridge').isChecked()).toBe(true);
    await form.getByRole('button', { name: 'Save survey' }).click();
    await poll(() => form.getByText(/enter at least one buck you can tell apart/).isVisible()).toBe(true);
    await form.getByLabel('Unique bucks').fill('6');
    await form.getByRole('button', { name: 'Save survey' }).click();

    // 30 ÷ 6 = 5 photos per buck; 60 ÷ 5 = 12 does; 25 ÷ 5 = 5 fawns; 6 + 12 + 5 = 23 deer (worked by hand).
    const card = page.getByRole('article', { name: 'Early-autumn check' });
    await poll(() => card.count()).toBe(1);
    const estimates = card.getByRole('definition');
    await poll(() => estimates.first().textContent()).toBe('23');
    await poll(() => card.getByText('1:2.0').isVisible()).toBe(true); // 12 does ÷ 6 bucks
    // Five days is shorter than the method's 10–14 (Jacobson et al. 1997, from memory).
    await poll(() => card.getByRole('note', { name: 'Short survey' }).isVisible()).toBe(true);

    // A harvest record: a yearling doe from the hollow stand.
    await page.getByRole('button', { name: 'Record a harvest' }).click();
    const harvest = page.getByRole('form', { name: 'New harvest record' });
    await harvest.getByLabel('Date taken').fill('2025-12-13');
    await harvest.getByLabel('Sex').selectOption('female');
    await harvest.getByLabel('Age class').selectOption('1.5');
    await harvest.getByLabel('Dressed weight (lb)').fill('81');
    await harvest.getByLabel('Unit or stand').selectOption({ label: 'Hollow stand' });
    await harvest.getByRole('button', { name: 'Save harvest' }).click();
    const records = page.getByRole('table', { name: 'Harvest records' });
    await poll(() => records.getByRole('row').filter({ hasText: 'Dec 13, 2025' }).count()).toBe(1);
    await poll(() => records.getByRole('row').filter({ hasText: 'Dec 13, 2025' }).textContent()).toContain('81 lb');
    await poll(() => page.getByRole('figure', { name: 'Harvest by age class' }).locator('.recharts-surface').first().isVisible()).toBe(true);
    await poll(() => page.getByRole('figure', { name: 'Harvest buck:doe by season' }).locator('.recharts-surface').first().isVisible()).toBe(true);
    await screenshot(page, 'results-consultant');

    // The season report: made, previewed as a PDF, sent to the landowner.
    await page.getByLabel('Season', { exact: true }).selectOption('2025');
    await page.getByLabel('Recommendations for next season').fill('Take two more adult does.\n\nFrost-seed clover into the ridge plot in March.');
    await page.getByRole('button', { name: 'Make season report' }).click();
    await poll(() => page.getByText('Season report 2025–26').count()).toBeGreaterThan(0);
    const preview = page.getByRole('link', { name: 'Preview PDF' }).first();
    const pdf = await page.request.get(`${baseUrl}${await preview.getAttribute('href')}`);
    expect(pdf.status()).toBe(200);
    expect(pdf.headers()['content-type']).toBe('application/pdf');
    expect((await pdf.body()).subarray(0, 5).toString()).toBe('%PDF-');
    await page.getByRole('button', { name: 'Send to client' }).first().click();
    await poll(() => page.getByText(/Sent .* to .*client@browseline\.test/).count()).toBeGreaterThan(0);

    // Made again twice (a second thought each time): one unsent 2025–26 report, not a pile of them.
    for (const words of ['First thoughts.', 'Second thoughts.']) {
      await page.getByLabel('Recommendations for next season').fill(words);
      await page.getByRole('button', { name: 'Make season report' }).click();
      await poll(() => page.getByRole('listitem', { name: 'Season report 2025–26' }).filter({ hasText: 'not sent yet' }).count()).toBe(1);
    }
    await poll(() => page.getByRole('listitem', { name: 'Season report 2025–26' }).count()).toBe(2); // the sent one and one draft
    await screenshot(page, 'results-reports-remade');

    // On a 360 px phone nothing is wider than the screen: the page scrolls only up and down.
    const phone = await browser.newContext({ viewport: { width: 360, height: 800 }, storageState: await context.storageState() });
    const phonePage = await phone.newPage();
    await phonePage.goto(page.url());
    await poll(() => phonePage.getByRole('heading', { name: 'Early-autumn check' }).count()).toBe(1);
    await poll(() => phonePage.getByRole('figure', { name: 'Harvest by age class' }).locator('.recharts-surface').first().isVisible()).toBe(true);
    const overflow = await phonePage.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
    expect(overflow).toBeLessThanOrEqual(0);
    await screenshot(phonePage, 'results-consultant-360');
    await phone.close();
    watch.assertClean();
    await context.close();
  });

  it('the landowner reads the estimates, the charts and the season report in the portal', async () => {
    const context = await browser.newContext({ viewport: { width: 360, height: 800 } });
    const page = await context.newPage();
    const watch = watchPage(page);
    await signIn(page, baseUrl, 'client@browseline.test');
    await page.waitForURL(`${baseUrl}/portal`);
    await page.getByRole('navigation', { name: 'Portal' }).getByRole('link', { name: 'Results' }).click();
    await page.waitForURL(`${baseUrl}/portal/results`);
    await page.getByRole('link', { name: 'See the results for Kettle Hollow Farm', exact: true }).click();
    await page.waitForURL(`${baseUrl}/portal/properties/${propertyId}/results`);

    await poll(() => page.getByRole('heading', { name: 'Early-autumn check' }).count()).toBe(1);
    await poll(() => page.getByRole('note', { name: 'Deer scents, baiting and feeding' }).isVisible()).toBe(true);
    await poll(() => page.getByRole('figure', { name: 'Estimated deer by season' }).locator('.recharts-surface').first().isVisible()).toBe(true);
    await poll(() => page.getByRole('figure', { name: 'Harvest by age class' }).locator('.recharts-surface').first().isVisible()).toBe(true);
    await poll(() => page.getByRole('button', { name: /Record|Delete|Send/ }).count()).toBe(0); // read-only

    const report = page.getByRole('link', { name: 'Open the report (PDF)' });
    await poll(() => report.count()).toBe(1);
    const pdf = await page.request.get(`${baseUrl}${await report.getAttribute('href')}`);
    expect(pdf.status()).toBe(200);
    expect((await pdf.body()).subarray(0, 5).toString()).toBe('%PDF-');
    expect(await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth)).toBeLessThanOrEqual(0);
    await screenshot(page, 'results-portal-360');

    // Another landowner's property answers "not found".
    await page.goto(`${baseUrl}/portal/properties/999999/results`);
    await poll(() => page.getByRole('heading', { name: /This property is not in/ }).isVisible()).toBe(true);
    watch.assertClean();
    await context.close();
  });

  it('the consultant withdraws the sent report; the landowner’s portal no longer lists it', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    const watch = watchPage(page);
    await signIn(page, baseUrl, 'consultant@browseline.test');
    await page.waitForURL(`${baseUrl}/desk`);
    await page.goto(`${baseUrl}/properties/${propertyId}/results`);
    const sent = page.getByRole('listitem', { name: 'Season report 2025–26' }).filter({ hasText: /Sent .* to / });
    await poll(() => sent.count()).toBe(1);
    await sent.getByRole('button', { name: 'Withdraw from the portal' }).click();
    const dialog = page.getByRole('dialog', { name: 'Withdraw season report 2025–26?' });
    await dialog.getByRole('button', { name: 'Withdraw from the portal' }).click();
    await poll(() => page.getByText(/withdrawn from the portal/).count()).toBe(1);
    await screenshot(page, 'results-report-withdrawn');
    watch.assertClean();
    await context.close();

    const landowner = await browser.newContext({ viewport: { width: 360, height: 800 } });
    const phone = await landowner.newPage();
    await signIn(phone, baseUrl, 'client@browseline.test');
    await phone.waitForURL(`${baseUrl}/portal`);
    await phone.goto(`${baseUrl}/portal/properties/${propertyId}/results`);
    await poll(() => phone.getByRole('heading', { name: 'Early-autumn check' }).count()).toBe(1);
    await poll(() => phone.getByText('No season report yet').count()).toBe(1);
    expect(await phone.getByRole('link', { name: 'Open the report (PDF)' }).count()).toBe(0);
    await landowner.close();
  });
});
