/**
 * The client portal on a phone: the demo landowner sees the plan map, the progress with the crew's
 * photos, a proposal and their files; a second client never sees the first's land; axe-core finds no
 * violations on any portal page; the consultant previews the same pages without signing in as the client.
 */
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { apiSignIn, launchBrowser, screenshot, signIn, watchPage } from '../support/browser';

const baseUrl = inject('baseUrl');
const AXE = path.resolve(import.meta.dirname, '../../node_modules/axe-core/axe.min.js');
// bypassCSP lets the test inject axe-core as a script tag; the app's own CSP stays as it is.
const PHONE = { viewport: { width: 360, height: 740 }, isMobile: true, hasTouch: true, bypassCSP: true };
const poll = <T>(fn: () => Promise<T> | T) => expect.poll(fn, { timeout: 15_000, interval: 100 });

let browser: Browser;
let kettleId = 0;
let familyFileId = 0;
let depositNumber = '';

interface AxeViolation {
  id: string;
  impact: string | null;
  help: string;
  nodes: { target: string[] }[];
}

/** Runs axe-core (WCAG 2.1 A and AA rules) on the page and fails with the violations listed. */
async function expectNoAxeViolations(page: Page, label: string): Promise<void> {
  await page.addScriptTag({ path: AXE });
  const violations = await page.evaluate(async () => {
    const axe = (window as unknown as { axe: { run: (ctx: Document, opts: unknown) => Promise<{ violations: AxeViolation[] }> } }).axe;
    const result = await axe.run(document, { runOnly: { type: 'tag', values: ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa'] } });
    return result.violations.map((v) => ({ id: v.id, impact: v.impact, help: v.help, nodes: v.nodes.slice(0, 5).map((n) => ({ target: n.target })) }));
  });
  const listed = violations.map((v) => `${v.id} (${v.impact}): ${v.help} at ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`).join('\n');
  expect(violations, `axe-core on ${label}:\n${listed}`).toEqual([]);
}

/** True when nothing on the page is wider than the viewport (no sideways scrolling at 360 px). */
const fitsWidth = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth <= window.innerWidth);


beforeAll(async () => {
  browser = await launchBrowser();
  // A sent proposal for the family's second property (the client declines it below, so it leaves no
  // "waiting" proposal behind for other journeys).
  const { request: api, csrf } = await apiSignIn(baseUrl, 'consultant@browseline.test');
  const props = (await (await api.get('/api/properties')).json()) as { data: { id: number; name: string }[] };
  kettleId = props.data.find((p) => p.name === 'Kettle Hollow Farm')!.id;
  const north = props.data.find((p) => p.name === 'Kettle Hollow — North 40')!.id;
  const draft = await api.post(`/api/properties/${north}/proposals`, { headers: { 'X-CSRF-Token': csrf }, data: { title: 'Timber marking on the North 40' } });
  expect(draft.status()).toBe(201);
  const id = ((await draft.json()) as { data: { id: number } }).data.id;
  const lines = [{ groupLabel: 'North 40', category: 'labor', description: 'Mark the oaks to thin and the hinge-cut edge', quantity: '1', unit: 'visit', unitPriceCents: 45000, taxable: false, optional: false }];
  expect((await api.patch(`/api/proposals/${id}`, { headers: { 'X-CSRF-Token': csrf }, data: { lines } })).status()).toBe(200);
  expect((await api.post(`/api/proposals/${id}/send`, { headers: { 'X-CSRF-Token': csrf } })).status()).toBe(200);
  // The farm's approved demo proposal drafted its deposit invoice on approval: issue it, so the family has an invoice to read.
  const drafts = (await (await api.get(`/api/invoices?propertyId=${kettleId}&status=draft`)).json()) as { data: { id: number; number: string }[] };
  expect(drafts.data.length).toBeGreaterThan(0);
  depositNumber = drafts.data[0].number;
  expect((await api.post(`/api/invoices/${drafts.data[0].id}/send`, { headers: { 'X-CSRF-Token': csrf } })).status()).toBe(200);
  const files = (await (await api.get('/api/files')).json()) as { data: { id: number; title: string }[] };
  familyFileId = files.data.find((f) => f.title.startsWith('Soil test'))!.id;
  await api.dispose();
});
afterAll(async () => {
  await browser?.close();
});

describe('the landowner’s portal on a phone (360 × 740)', () => {
  // One phone session walks through the portal; each step is its own test.
  let context: BrowserContext;
  let page: Page;
  let watch: ReturnType<typeof watchPage>;
  beforeAll(async () => {
    context = await browser.newContext(PHONE);
    page = await context.newPage();
    watch = watchPage(page);
  });
  afterAll(async () => {
    await context?.close();
  });

  it('lands on Your land with both properties', async () => {
    await signIn(page, baseUrl, 'client@browseline.test');
    await page.waitForURL(`${baseUrl}/portal`);
    await poll(() => page.getByRole('heading', { level: 1 }).textContent()).toBe('Your land');
    await poll(() => page.getByRole('heading', { name: 'Kettle Hollow Farm' }).count()).toBe(1);
    expect(await page.getByRole('heading', { name: 'Kettle Hollow — North 40' }).count()).toBe(1);
    expect(await fitsWidth(page)).toBe(true);
    await screenshot(page, 'portal-home-phone');
    await expectNoAxeViolations(page, '/portal');
  });

  it('shows the plan map with its legend, the share by kind, the plan in words and the cautions', async () => {
    // Your land: the plan map (a WebGL canvas), its legend, the share by kind and the plan in words.
    await page.getByRole('link', { name: 'See the plan of Kettle Hollow Farm' }).click();
    await page.waitForURL(`${baseUrl}/portal/properties/${kettleId}`);
    await poll(() => page.locator('[data-testid="portal-plan-map"] canvas').count()).toBe(1);
    const legend = page.locator('figcaption');
    await poll(() => legend.textContent()).toMatch(/Property boundary.*Food plot.*Timber/);
    expect(await page.getByRole('table').filter({ hasText: 'Share' }).getByRole('rowheader', { name: 'Food plot' }).count()).toBe(1);
    await poll(() => page.getByRole('heading', { name: 'Ridge clover plot' }).count()).toBe(1);
    expect(await page.getByRole('note', { name: 'Hinge-cutting' }).count()).toBe(1);
    expect(await fitsWidth(page)).toBe(true);
    // The map has drawn its layers (it marks itself when MapLibre is idle).
    await poll(() => page.locator('[data-testid="portal-plan-map"]').getAttribute('data-ready')).toBe('true');
    await screenshot(page, 'portal-property-phone');
    await expectNoAxeViolations(page, '/portal/properties/:id');

    // Keyboard: from the top of the page, Tab reaches the places, the property switcher and the map.
    await page.locator('body').click({ position: { x: 1, y: 1 } });
    const reached = new Set<string>();
    for (let i = 0; i < 40; i++) {
      await page.keyboard.press('Tab');
      reached.add(await page.evaluate(() => {
        const el = document.activeElement as HTMLElement | null;
        if (!el) return '';
        return el.getAttribute('aria-label') ?? (el.tagName === 'SELECT' ? `select:${(el as HTMLSelectElement).labels?.[0]?.textContent ?? ''}` : (el.textContent ?? '').trim());
      }));
    }
    const all = [...reached].join(' | ');
    expect(all).toMatch(/Progress/);
    expect(all).toMatch(/select:Property/);
    expect(all).toMatch(/Plan map of Kettle Hollow Farm/);
    expect(all).toMatch(/Zoom in/);
  });

  it('shows the progress: percent done, the crew’s photos by unit and the timeline; the switcher changes property', async () => {
    // Progress: percent done, the crew's photos by unit, the season's timeline.
    await page.getByRole('navigation', { name: 'Portal' }).getByRole('link', { name: 'Progress' }).click();
    await page.waitForURL(`${baseUrl}/portal/properties/${kettleId}/progress`);
    await poll(() => page.locator('[data-figure="percent-done"]').textContent()).toMatch(/^\d+ % done$/);
    const photos = page.getByRole('img', { name: /^Crew photo:/ });
    await poll(() => photos.count()).toBeGreaterThan(0);
    expect(await page.locator('li[data-status="done"]').count()).toBeGreaterThan(0);
    // The photos are served by the schedule's /api/task-photos/:id (issue 6); once that route exists they must load.
    const photoSrc = (await photos.first().getAttribute('src'))!;
    const photoRes = await page.request.get(`${baseUrl}${photoSrc}`);
    if (!/The API path/.test(await photoRes.text())) {
      expect(photoRes.status()).toBe(200);
      await poll(() => photos.first().evaluate((img) => (img as HTMLImageElement).naturalWidth)).toBeGreaterThan(0);
    }
    expect(await fitsWidth(page)).toBe(true);
    await screenshot(page, 'portal-progress-phone');
    await expectNoAxeViolations(page, '/portal/properties/:id/progress');

    // The property switcher keeps the page and changes the property.
    await page.getByLabel('Property').selectOption({ label: 'Kettle Hollow — North 40' });
    await page.waitForURL(/\/portal\/properties\/\d+\/progress$/);
    await poll(() => page.getByText('No work scheduled yet').count()).toBe(1);
  });

  it('shows a sent proposal as a document, which the landowner declines with a reason', async () => {
    // Proposals: the sent one, read and declined with a reason.
    await page.getByRole('navigation', { name: 'Portal' }).getByRole('link', { name: 'Proposals' }).click();
    await page.waitForURL(`${baseUrl}/portal/proposals`);
    const card = page.getByRole('article', { name: /Timber marking on the North 40/ });
    await poll(() => card.count()).toBe(1);
    await expectNoAxeViolations(page, '/portal/proposals');
    await card.getByRole('link', { name: 'Review and approve' }).click();
    await page.waitForURL(/\/portal\/proposals\/\d+$/);
    await poll(() => page.getByRole('heading', { level: 1 }).textContent()).toBe('Timber marking on the North 40');
    await expectNoAxeViolations(page, '/portal/proposals/:id');
    await screenshot(page, 'portal-proposal-north-phone');
    await page.getByRole('button', { name: 'Decline', exact: true }).click();
    await page.getByLabel('Why are you declining?').fill('We will wait until after the harvest.');
    await page.getByRole('button', { name: 'Decline proposal' }).click();
    await poll(() => page.locator('[data-status="declined"]').count()).toBeGreaterThan(0);
  });

  it('lists the family’s invoice and opens it, with no accessibility violations', async () => {
    await page.goto(`${baseUrl}/portal/invoices`);
    await poll(() => page.getByRole('heading', { level: 1 }).textContent()).toMatch(/Invoices/);
    const link = page.getByRole('link', { name: new RegExp(depositNumber) }).first();
    await poll(() => link.count()).toBe(1);
    expect(await fitsWidth(page)).toBe(true);
    await expectNoAxeViolations(page, '/portal/invoices');
    await link.click();
    await poll(() => page.getByRole('heading', { level: 1 }).textContent()).toMatch(new RegExp(depositNumber));
    await poll(() => page.getByRole('button', { name: /^Pay/ }).count()).toBeGreaterThan(0);
    expect(await fitsWidth(page)).toBe(true);
    await expectNoAxeViolations(page, 'the invoice page');
    await screenshot(page, 'portal-invoice-phone');
  });

  it('lists the shared files for download and takes the landowner’s own upload', async () => {
    // Files: the shared soil test downloads as a PDF; the family may upload (the demo allows it).
    await page.goto(`${baseUrl}/portal/files`);
    await poll(() => page.getByText(/^Soil test — Ridge clover plot/).count()).toBe(1);
    const link = page.getByRole('link', { name: /Download Soil test/ });
    const pdf = await page.request.get(`${baseUrl}${await link.getAttribute('href')}`);
    expect(pdf.headers()['content-type']).toBe('application/pdf');
    expect(pdf.headers()['content-disposition']).toMatch(/^attachment/);
    expect((await pdf.body()).subarray(0, 5).toString()).toBe('%PDF-');
    await page.getByLabel('File', { exact: true }).setInputFiles({ name: 'gate-code.txt', mimeType: 'text/plain', buffer: Buffer.from('The gate code changed to 4471.\n') });
    await page.getByLabel('Title (optional)').fill('New gate code');
    await page.getByRole('button', { name: 'Upload' }).click();
    await poll(() => page.getByRole('link', { name: 'Download New gate code' }).count()).toBe(1);
    expect(await fitsWidth(page)).toBe(true);
    await screenshot(page, 'portal-files-phone');
    await expectNoAxeViolations(page, '/portal/files');
    watch.assertClean();
  });

  it('shows the second household contact the same land', async () => {
    const context = await browser.newContext(PHONE);
    const page = await context.newPage();
    await signIn(page, baseUrl, 'client2@browseline.test');
    await page.waitForURL(`${baseUrl}/portal`);
    await poll(() => page.getByRole('heading', { name: 'Kettle Hollow Farm' }).count()).toBe(1);
    await context.close();
  });
});

describe('another client never sees the family’s land', () => {
  it('lists only Bluestem Ridge for the club, and answers the family’s property and file with not found, in the page and in the API', async () => {
    const context = await browser.newContext(PHONE);
    const page = await context.newPage();
    const watch = watchPage(page);
    await signIn(page, baseUrl, 'club@browseline.test');
    await page.waitForURL(`${baseUrl}/portal`);
    await poll(() => page.getByRole('heading', { name: 'Bluestem Ridge' }).count()).toBe(1);
    expect(await page.getByText(/Kettle Hollow/).count()).toBe(0);
    await page.goto(`${baseUrl}/portal/properties/${kettleId}`);
    await poll(() => page.getByRole('heading', { name: 'This property is not in your portal' }).count()).toBe(1);
    expect(await page.getByText(/Kettle Hollow/).count()).toBe(0);
    await expectNoAxeViolations(page, 'a foreign property');
    await page.goto(`${baseUrl}/portal/properties/${kettleId}/progress`);
    await poll(() => page.getByRole('heading', { name: 'This property is not in your portal' }).count()).toBe(1);
    expect((await page.request.get(`${baseUrl}/api/portal/properties/${kettleId}`)).status()).toBe(404);
    expect((await page.request.get(`${baseUrl}/api/files/${familyFileId}`)).status()).toBe(404);
    const files = (await (await page.request.get(`${baseUrl}/api/files`)).json()) as { data: unknown[] };
    expect(files.data).toEqual([]);
    await page.goto(`${baseUrl}/portal/files`);
    await poll(() => page.getByText(/Nothing shared yet/).count()).toBe(1);
    await expectNoAxeViolations(page, '/portal/files (empty)');
    watch.assertClean();
    await context.close();
  });
});

describe('preview as client', () => {
  it('shows the consultant the family’s portal with a banner and the writes off, still signed in as the consultant', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 }, bypassCSP: true });
    const page = await context.newPage();
    const watch = watchPage(page);
    await signIn(page, baseUrl, 'consultant@browseline.test');
    await page.waitForURL(`${baseUrl}/desk`);
    await page.goto(`${baseUrl}/clients`);
    await page.getByRole('link', { name: 'Okonkwo-Larsen Family' }).first().click();
    await page.waitForURL(/\/clients\/\d+$/);
    await poll(() => page.getByRole('heading', { name: 'Files' }).count()).toBe(1);
    // The staff side: the family's files with share/unshare and delete, and the upload switch (on in the demo).
    await poll(() => page.getByRole('button', { name: /^Unshare Soil test/ }).count()).toBe(1);
    expect(await page.getByLabel('Client may upload files in the portal').isChecked()).toBe(true);
    await screenshot(page, 'client-files-staff');
    await page.getByRole('link', { name: 'Preview as client' }).click();
    await page.waitForURL(/\/preview\/clients\/\d+$/);
    await poll(() => page.getByText('Preview: what Okonkwo-Larsen Family sees.').count()).toBe(1);
    await poll(() => page.getByRole('heading', { name: 'Kettle Hollow Farm' }).count()).toBe(1);
    await page.getByRole('link', { name: 'See the plan of Kettle Hollow Farm' }).click();
    await page.waitForURL(/\/preview\/clients\/\d+\/properties\/\d+$/);
    await poll(() => page.getByRole('heading', { name: 'Ridge clover plot' }).count()).toBe(1);
    await poll(() => page.locator('[data-testid="portal-plan-map"]').getAttribute('data-ready')).toBe('true');
    await screenshot(page, 'preview-property');
    await page.getByRole('navigation', { name: 'Portal' }).getByRole('link', { name: 'Files' }).click();
    await page.waitForURL(/\/preview\/clients\/\d+\/files$/);
    await poll(() => page.getByRole('button', { name: 'Upload' }).count()).toBe(1);
    expect(await page.getByRole('button', { name: 'Upload' }).isDisabled()).toBe(true);
    expect(await page.getByLabel('File', { exact: true }).isDisabled()).toBe(true);
    await page.getByRole('navigation', { name: 'Portal' }).getByRole('link', { name: 'Proposals' }).click();
    await poll(() => page.getByRole('article', { name: /Timber marking on the North 40/ }).count()).toBe(1);
    await expectNoAxeViolations(page, 'preview proposals');
    const me = (await (await page.request.get(`${baseUrl}/api/auth/me`)).json()) as { data: { user: { role: string } } };
    expect(me.data.user.role).toBe('consultant');
    watch.assertClean();
    await context.close();
  });
});
