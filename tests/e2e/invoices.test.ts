import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { APIRequestContext, Browser } from 'playwright-core';
import { launchBrowser, screenshot, signIn, watchPage } from '../support/browser';

const baseUrl = inject('baseUrl');
const mailUrl = inject('mailUrl');
const paymentsUrl = inject('paymentsUrl');
// Test card as published in the payments service's testing docs (from memory).
const CARD_PAYS = '4242 4242 4242 4242';
let browser: Browser;
let proposalId = 0;
let depositCents = 0;
let invoiceId = 0;
let proposalNumber = '';

const poll = <T>(fn: () => Promise<T> | T) => expect.poll(fn, { timeout: 20_000, interval: 150 });
/** "$1,234.56" → 123456. */
const cents = (text: string | null): number => {
  const m = /\$([\d,]+)\.(\d{2})/.exec(text ?? '');
  if (!m) throw new Error(`no dollar amount in "${text}"`);
  return Number(m[1].replace(/,/g, '')) * 100 + Number(m[2]);
};

/** A JSON write through the signed-in page's cookies, with the session's CSRF token. */
async function write(request: APIRequestContext, url: string, data: unknown = {}) {
  const { csrfToken } = (await (await request.get(`${baseUrl}/api/auth/csrf`)).json()) as { csrfToken: string };
  const res = await request.post(`${baseUrl}${url}`, { data: data as object, headers: { 'X-CSRF-Token': csrfToken } });
  expect(res.status(), `${url}: ${await res.text()}`).toBeLessThan(300);
  return ((await res.json()) as { data: Record<string, unknown> }).data;
}

beforeAll(async () => {
  browser = await launchBrowser();
  // An approved proposal of the demo client's, made through the API so the journey does not depend on the seed's proposals.
  const staff = await browser.newContext();
  const sp = await staff.newPage();
  await signIn(sp, baseUrl, 'consultant@browseline.test');
  await sp.waitForURL(`${baseUrl}/desk`);
  const properties = ((await (await sp.request.get(`${baseUrl}/api/properties`)).json()) as { data: { id: number; name: string }[] }).data;
  const farm = properties.find((p) => p.name === 'Kettle Hollow Farm')!;
  const prescriptions = ((await (await sp.request.get(`${baseUrl}/api/properties/${farm.id}/prescriptions`)).json()) as { data: { id: number }[] }).data;
  const drafted = await write(sp.request, `/api/properties/${farm.id}/proposals`, { prescriptionIds: [prescriptions[0].id], title: 'Fall plot work for Kettle Hollow Farm', depositPct: 25 });
  proposalId = drafted.id as number;
  proposalNumber = drafted.number as string;
  await write(sp.request, `/api/proposals/${proposalId}/send`);
  await staff.close();
  const owner = await browser.newContext();
  const cp = await owner.newPage();
  await signIn(cp, baseUrl, 'client@browseline.test');
  await cp.waitForURL(`${baseUrl}/portal`);
  const approved = await write(cp.request, `/api/proposals/${proposalId}/approve`, { signedName: 'Priya Okonkwo' });
  depositCents = approved.depositCents as number;
  expect(depositCents).toBeGreaterThan(0);
  await owner.close();
});
afterAll(async () => {
  await browser?.close();
});

describe('a deposit invoice from approval to payment', () => {
  it('the consultant issues the deposit invoice of the approved proposal', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    const watch = watchPage(page);
    await signIn(page, baseUrl, 'consultant@browseline.test');
    await page.waitForURL(`${baseUrl}/desk`);
    // The Desk says the approval drafted the deposit invoice and leads to it.
    const drafts = ((await (await page.request.get(`${baseUrl}/api/invoices?proposalId=${proposalId}`)).json()) as { data: { id: number; kind: string; status: string }[] }).data;
    const draftId = drafts.find((i) => i.kind === 'deposit' && i.status === 'draft')!.id;
    const prompt = page.getByRole('region', { name: /^Deposit invoices? to send$/ }).getByRole('listitem').filter({ has: page.locator(`a[href="/invoices/${draftId}"]`) });
    await poll(() => prompt.count()).toBe(1);
    expect(await prompt.textContent()).toMatch(new RegExp(`approved ${proposalNumber}.*Browseline drafted deposit invoice INV-`));
    await screenshot(page, 'desk-deposit-prompt');
    await prompt.getByRole('link', { name: /^Review and send INV-/ }).click();
    await page.waitForURL(/\/invoices\/\d+$/);
    invoiceId = Number(new URL(page.url()).pathname.split('/').pop());
    await poll(() => page.locator('[data-status="draft"]').count()).toBeGreaterThan(0);
    expect(cents(await page.getByTestId('invoice-total').textContent())).toBe(depositCents);
    await screenshot(page, 'invoice-draft-consultant');
    // Sending asks first, as sending a proposal does; Cancel sends nothing.
    await page.getByRole('button', { name: 'Send…', exact: true }).click();
    const confirm = page.getByRole('dialog', { name: /^Send INV-.* to Okonkwo-Larsen Family\?$/ });
    await confirm.waitFor();
    await screenshot(page, 'invoice-send-confirm');
    await confirm.getByRole('button', { name: 'Cancel' }).click();
    expect(await page.locator('[data-status="draft"]').count()).toBeGreaterThan(0);
    await page.getByRole('button', { name: 'Send…', exact: true }).click();
    await confirm.getByRole('button', { name: 'Send invoice' }).click();
    await poll(() => page.locator('[data-status="open"]').count()).toBeGreaterThan(0);
    expect(await page.getByRole('button', { name: 'Send again…' }).count()).toBe(1);
    watch.assertClean();
    await context.close();
  });

  it('the landowner pays it on the payment page with the test card and sees it paid', async () => {
    expect(invoiceId).toBeGreaterThan(0);
    const context = await browser.newContext({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true });
    const page = await context.newPage();
    const watch = watchPage(page);
    await signIn(page, baseUrl, 'client@browseline.test');
    await page.waitForURL(`${baseUrl}/portal`);
    await page.getByRole('navigation', { name: 'Portal' }).getByRole('link', { name: 'Invoices' }).click();
    await page.waitForURL(`${baseUrl}/portal/invoices`);
    await page.locator(`a[href="/portal/invoices/${invoiceId}"]`).click();
    await page.waitForURL(`${baseUrl}/portal/invoices/${invoiceId}`);
    await screenshot(page, 'invoice-portal-open');
    const payButton = page.getByRole('button', { name: /^Pay \$[\d,]+\.\d{2} by card$/ });
    expect(cents(await payButton.textContent())).toBe(depositCents);
    await payButton.click();
    await page.waitForURL((url) => url.href.startsWith(`${paymentsUrl}/pay/`));
    // The hosted page asks for exactly the invoice's balance.
    expect(cents(await page.getByRole('button', { name: /^Pay / }).textContent())).toBe(depositCents);
    await page.getByLabel('Card number').fill(CARD_PAYS);
    await page.getByRole('button', { name: /^Pay / }).click();
    await page.waitForURL((url) => url.href.startsWith(`${baseUrl}/portal/invoices/${invoiceId}?paid=1`));
    await poll(() => page.getByText('Paid — thank you.', { exact: false }).count()).toBe(1);
    await poll(() => page.locator('[data-status="paid"]').count()).toBeGreaterThan(0);
    expect(cents(await page.getByTestId('invoice-balance').textContent())).toBe(0);
    await screenshot(page, 'invoice-portal-paid');
    watch.assertClean();
    await context.close();
  });

  it('the consultant sees it paid, with the payment, and the receipt e-mail reached the landowner', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    const watch = watchPage(page);
    await signIn(page, baseUrl, 'consultant@browseline.test');
    await page.waitForURL(`${baseUrl}/desk`);
    await page.getByRole('navigation', { name: 'Places' }).getByRole('link', { name: 'Invoices' }).click();
    await page.waitForURL(`${baseUrl}/invoices`);
    await poll(() => page.getByTestId('outstanding').count()).toBe(1);
    await screenshot(page, 'invoices-receivables');
    await page.goto(`${baseUrl}/invoices/${invoiceId}`);
    await poll(() => page.locator('[data-status="paid"]').count()).toBeGreaterThan(0);
    const payments = page.getByRole('list', { name: 'Payments' }).getByRole('listitem');
    expect(await payments.count()).toBe(1);
    expect(cents(await payments.first().textContent())).toBe(depositCents);
    await screenshot(page, 'invoice-paid-consultant');

    type Summary = { id: number; subject: string; to: string[] };
    const receipt = async () => ((await (await fetch(`${mailUrl}/messages`)).json()) as { data: Summary[] }).data.filter((m) => m.to.includes('client@browseline.test') && /^Receipt: /.test(m.subject));
    await poll(async () => (await receipt()).length).toBe(1);
    expect(cents((await receipt())[0].subject)).toBe(depositCents);
    // The consultant is e-mailed that the client paid, and the Desk shows the money in.
    const told = async () => ((await (await fetch(`${mailUrl}/messages`)).json()) as { data: Summary[] }).data.filter((m) => m.to.includes('consultant@browseline.test') && /^Okonkwo-Larsen Family paid \$/.test(m.subject));
    await poll(async () => (await told()).length).toBe(1);
    expect(cents((await told())[0].subject)).toBe(depositCents);
    await page.goto(`${baseUrl}/desk`);
    const moneyIn = page.getByRole('list', { name: 'Payments received' }).getByRole('listitem').filter({ has: page.locator(`a[href="/invoices/${invoiceId}"]`) });
    await poll(() => moneyIn.count()).toBe(1);
    expect(cents(await moneyIn.textContent())).toBe(depositCents);
    expect(await moneyIn.textContent()).toContain('paid in full');
    await screenshot(page, 'desk-money-in');
    watch.assertClean();
    await context.close();
  });
});
