import { describe, expect, inject, it } from 'vitest';
import type { Locator, Page } from 'playwright-core';
import { journeyBrowser, screenshot, signIn, watchPage } from '../support/browser';
import { openProperty, signInAsConsultant } from '../support/journey-steps';

const baseUrl = inject('baseUrl');
/** The proposal the consultant drafts and sends in the first journey and the client approves in the second. */
let proposalId = 0;
let sentTotalCents = 0;

const browser = journeyBrowser();

/** "$15,209.24" → 1520924 (whole cents; the page writes every amount with two decimals). */
const cents = (text: string | null): number => {
  const m = /\$([\d,]+)\.(\d{2})/.exec(text ?? '');
  if (!m) throw new Error(`no dollar amount in "${text}"`);
  return Number(m[1].replace(/,/g, '')) * 100 + Number(m[2]);
};
/** Round half up of a non-negative n / d on integers (the money rule of shared/domain/money.ts). */
const halfUp = (n: bigint, d: bigint): number => Number((2n * n + d) / (2n * d));
/** Waits for a value (saving re-prices 60-odd lines; sending renders the PDF): up to 20 s. */
const poll = <T>(fn: () => Promise<T> | T) => expect.poll(fn, { timeout: 20_000, interval: 100 });
const figure = (scope: Page | Locator, name: string) => scope.locator(`[data-figure="${name}"]`).first();
const figureCents = async (scope: Page | Locator, name: string) => cents(await figure(scope, name).textContent());

describe('a proposal from the plan to the landowner’s approval', () => {
  it('the consultant drafts a proposal for Kettle Hollow Farm, re-prices a line, adds an option, saves and sends it', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    const watch = watchPage(page);
    await signInAsConsultant(page, baseUrl);
    await openProperty(page, 'Kettle Hollow Farm');
    await page.getByRole('button', { name: 'New proposal' }).click();
    await page.waitForURL(/\/proposals\/\d+$/);
    proposalId = Number(new URL(page.url()).pathname.split('/').pop());
    await poll(() => page.getByRole('heading', { level: 1 }).textContent()).toBe('Habitat plan for Kettle Hollow Farm');

    // Demo seed: the ridge clover plot's prescription is priced into the draft, lime first.
    const ridge = page.getByRole('region', { name: 'Ridge clover plot' });
    const lime = ridge.getByRole('group').first();
    await poll(() => lime.getByLabel('Description').inputValue()).toMatch(/lime/i);
    const totalBefore = await figureCents(page, 'total');
    const taxableBefore = await figureCents(page, 'tax-note');
    const quantity = await lime.getByLabel('Quantity').inputValue();
    const oldPriceCents = cents(`$${await lime.getByLabel('Unit price').inputValue()}`);
    expect(await lime.getByLabel('Taxable').isChecked()).toBe(true);

    // $48.00 → $52.00 a ton. The line amount is round-half-up(quantity × price) and, as the line is
    // taxable, the tax is 5.5 % (the demo firm's rate) of the new taxable base, rounded once.
    await lime.getByLabel('Unit price').fill('52.00');
    const [whole, frac = ''] = quantity.split('.');
    const qty4 = BigInt(whole) * 10_000n + BigInt(frac.padEnd(4, '0'));
    const deltaLine = halfUp(qty4 * 5200n, 10_000n) - halfUp(qty4 * BigInt(oldPriceCents), 10_000n);
    const taxBefore = halfUp(BigInt(taxableBefore) * 55_000n, 1_000_000n);
    const taxAfter = halfUp(BigInt(taxableBefore + deltaLine) * 55_000n, 1_000_000n);
    const expectedTotal = totalBefore + deltaLine + (taxAfter - taxBefore);
    await poll(() => figureCents(page, 'total')).toBe(expectedTotal);
    expect(cents(await lime.getByLabel('Amount').textContent())).toBe(halfUp(qty4 * 5200n, 10_000n));
    expect(cents(await page.getByTestId('sticky-total').textContent())).toBe(expectedTotal);

    // An optional line in the same group: offered to the client, not in the total.
    await ridge.getByRole('button', { name: 'Add a line' }).click();
    const option = ridge.getByRole('group').last();
    await poll(() => option.getByLabel('Description').evaluate((el) => el === document.activeElement)).toBe(true);
    await option.getByLabel('Description').fill('Frost-seed red clover into the ridge plot next February');
    await option.getByLabel('Unit', { exact: true }).fill('visit');
    await option.getByLabel('Unit price').fill('180');
    await option.getByLabel('Optional').check();
    await poll(() => page.getByText(/1 option offered, \$180\.00/).count()).toBe(1);
    expect(await figureCents(page, 'total')).toBe(expectedTotal);
    await poll(() => page.getByText('Unsaved changes', { exact: true }).count()).toBe(1);
    await screenshot(page, 'proposal-builder-edited');

    // Save: the server re-prices with the same rule and agrees to the cent.
    await page.getByRole('button', { name: 'Save draft' }).first().click();
    await poll(() => page.getByText('All changes saved', { exact: true }).count()).toBe(1);
    const saved = (await (await page.request.get(`${baseUrl}/api/proposals/${proposalId}`)).json()) as { data: { totalCents: number; lines: { optional: boolean; description: string }[] } };
    expect(saved.data.totalCents).toBe(expectedTotal);
    expect(saved.data.lines.filter((l) => l.optional).map((l) => l.description)).toEqual(['Frost-seed red clover into the ridge plot next February']);
    expect(await figureCents(page, 'total')).toBe(expectedTotal);

    // Send, after a confirmation; then the page is a read-only document.
    await page.getByRole('button', { name: 'Send to client…' }).click();
    const dialog = page.getByRole('dialog', { name: /Send P-\d{4}-\d{3} v1 to Okonkwo-Larsen Family\?/ });
    await dialog.getByRole('button', { name: 'Send proposal' }).click();
    await poll(() => page.locator('[data-status="sent"]').count()).toBeGreaterThan(0);
    expect(await page.getByRole('button', { name: 'Save draft' }).count()).toBe(0);
    expect(await page.getByLabel('Unit price').count()).toBe(0);
    await poll(() => page.getByText(/not opened by the client yet/).count()).toBe(1);
    sentTotalCents = await figureCents(page, 'total');
    expect(sentTotalCents).toBe(expectedTotal);
    // The PDF link serves the document.
    const pdfHref = await page.getByRole('link', { name: 'PDF', exact: true }).getAttribute('href');
    const pdf = await page.request.get(`${baseUrl}${pdfHref}`);
    expect(pdf.status()).toBe(200);
    expect(pdf.headers()['content-type']).toBe('application/pdf');
    expect((await pdf.body()).subarray(0, 5).toString()).toBe('%PDF-');
    await screenshot(page, 'proposal-sent-consultant');
    watch.assertClean();
    await context.close();
  });

  it('the landowner ticks the option on a phone, types their name and approves; the consultant sees the approval', async () => {
    expect(proposalId).toBeGreaterThan(0);
    const context = await browser.newContext({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true });
    const page = await context.newPage();
    const watch = watchPage(page);
    await signIn(page, baseUrl, 'client@browseline.test');
    await page.waitForURL(`${baseUrl}/portal`);
    await page.getByRole('navigation', { name: 'Portal' }).getByRole('link', { name: 'Proposals' }).click();
    await page.waitForURL(`${baseUrl}/portal/proposals`);
    await page.getByRole('link', { name: 'Review and approve' }).click();
    // The e-mail's link goes to this same path.
    await page.waitForURL(`${baseUrl}/portal/proposals/${proposalId}`);
    await poll(() => page.getByRole('heading', { level: 1 }).textContent()).toBe('Habitat plan for Kettle Hollow Farm');
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    // Cautions of the planned herbicide work are boxed for the landowner.
    await poll(() => page.getByRole('note', { name: 'Herbicide work' }).count()).toBe(1);
    const price = page.getByLabel('Price', { exact: true });
    expect(await figureCents(price, 'total')).toBe(sentTotalCents);
    await screenshot(page, 'portal-proposal-phone');

    // The option is not taxable and there is no discount, so it adds exactly $180.00; the deposit
    // is 30 % of the new total, rounded half up (shared/domain/proposal-totals.ts).
    await page.getByRole('checkbox', { name: /Frost-seed red clover/ }).check();
    const withOption = sentTotalCents + 18000;
    await poll(() => figureCents(price, 'total')).toBe(withOption);
    expect(await figureCents(price, 'deposit')).toBe(halfUp(BigInt(withOption) * 30n, 100n));

    await page.getByLabel('Type your full name to approve').fill('Priya Okonkwo');
    await page.getByRole('button', { name: /^Approve/ }).click();
    await poll(() => page.getByText(/Approved by Priya Okonkwo on/).count()).toBe(1);
    expect(await page.locator('[data-status="approved"]').count()).toBeGreaterThan(0);
    expect(await page.getByLabel('Type your full name to approve').count()).toBe(0);
    expect(await figureCents(page.getByLabel('Price', { exact: true }), 'total')).toBe(withOption);
    await screenshot(page, 'portal-proposal-approved-phone');
    watch.assertClean();
    await context.close();

    // The consultant: approved in the list and on the document, with the approval record.
    const desk = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const staff = await desk.newPage();
    const staffWatch = watchPage(staff);
    await signIn(staff, baseUrl, 'consultant@browseline.test');
    await staff.waitForURL(`${baseUrl}/desk`);
    await staff.goto(`${baseUrl}/proposals?status=approved`);
    // The demo has an approved proposal for the farm already: pick this one's row by its link.
    const row = staff.locator('table tbody tr', { has: staff.locator(`a[href="/proposals/${proposalId}"]`) });
    await poll(() => row.count()).toBe(1);
    expect(await row.locator('[data-status="approved"]').count()).toBe(1);
    await row.getByRole('link').click();
    await staff.waitForURL(`${baseUrl}/proposals/${proposalId}`);
    const record = staff.getByRole('region', { name: 'Approval record' });
    await poll(() => record.textContent()).toMatch(/Approved by Priya Okonkwo on/);
    expect(await record.textContent()).toMatch(/Options chosen: Frost-seed red clover/);
    expect(await record.textContent()).toMatch(/[0-9a-f]{64}/);
    expect(await figureCents(staff, 'total')).toBe(withOption);
    await screenshot(staff, 'proposal-approved-consultant');
    staffWatch.assertClean();
    await desk.close();
  });

  it('tells a landowner who approves a version the consultant has just withdrawn why it did not go through', async () => {
    // The consultant drafts and sends a second proposal for the same farm.
    const desk = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const staff = await desk.newPage();
    await signIn(staff, baseUrl, 'consultant@browseline.test');
    await staff.waitForURL(`${baseUrl}/desk`);
    await staff.goto(`${baseUrl}/properties`);
    await staff.getByRole('link', { name: 'Kettle Hollow Farm', exact: true }).click();
    await staff.getByRole('button', { name: 'New proposal' }).click();
    await staff.waitForURL(/\/proposals\/\d+$/);
    const secondId = Number(new URL(staff.url()).pathname.split('/').pop());
    expect(secondId).not.toBe(proposalId);
    await staff.getByRole('button', { name: 'Send to client…' }).click();
    await staff.getByRole('dialog').getByRole('button', { name: 'Send proposal' }).click();
    await poll(() => staff.locator('[data-status="sent"]').count()).toBeGreaterThan(0);

    // The landowner opens it from the e-mail's link and starts to approve …
    const phone = await browser.newContext({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true });
    const page = await phone.newPage();
    const watch = watchPage(page);
    await signIn(page, baseUrl, 'client@browseline.test');
    await page.waitForURL(`${baseUrl}/portal`);
    await page.goto(`${baseUrl}/portal/proposals/${secondId}`);
    await page.getByLabel('Type your full name to approve').fill('Priya Okonkwo');

    // … while the consultant withdraws it.
    await staff.getByRole('button', { name: 'Withdraw' }).click();
    await staff.getByRole('dialog').getByRole('button', { name: 'Withdraw' }).click();
    await poll(() => staff.locator('[data-status="withdrawn"]').count()).toBeGreaterThan(0);
    await desk.close();

    await page.getByRole('button', { name: /^Approve/ }).click();
    // The server's 409 (server/commands/proposal-approver.ts) in words, and the page as it stands now.
    await poll(() => page.getByRole('alert').filter({ hasText: 'withdrawn by your consultant' }).count()).toBe(1);
    await poll(() => page.locator('[data-status="withdrawn"]').count()).toBeGreaterThan(0);
    expect(await page.getByLabel('Type your full name to approve').count()).toBe(0);
    expect(await page.getByText(/Approved by/).count()).toBe(0);
    await screenshot(page, 'portal-proposal-withdrawn-phone');
    watch.assertClean();
    await phone.close();
  });
});
