import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import type { APIRequestContext, Browser } from 'playwright-core';
import { apiSignIn, launchBrowser, screenshot, SCREENSHOTS, signIn, watchPage } from '../support/browser';
import { formatDateWithWeekday, todayIn } from '../../shared/domain/clock';

const baseUrl = inject('baseUrl');
const WAIT = { timeout: 20_000 };
let browser: Browser;
let owner: { request: APIRequestContext; csrf: string };

beforeAll(async () => {
  browser = await launchBrowser();
  owner = await apiSignIn(baseUrl, 'owner@browseline.test');
});
afterAll(async () => {
  // The demo firm works on Central time; leave it so for the other journeys.
  await owner?.request.patch('/api/firm/settings', { headers: { 'X-CSRF-Token': owner.csrf }, data: { timezone: 'America/Chicago' } });
  await owner?.request.dispose();
  await browser?.close();
});

describe('the firm’s clock', () => {
  it('the owner moves the firm to a zone whose date differs from UTC; the crew’s phone (set to UTC) shows the firm’s today', async () => {
    // Whatever the hour, one of these zones is on another calendar day than UTC: Kiritimati is
    // UTC+14 (a day ahead from 10:00 UTC), Pago Pago UTC−11 (a day behind until 11:00 UTC) (IANA tz database).
    const zone = new Date().getUTCHours() >= 10 ? 'Pacific/Kiritimati' : 'Pacific/Pago_Pago';
    const firmToday = todayIn(zone, new Date());
    const utcToday = new Date().toISOString().slice(0, 10);
    expect(firmToday).not.toBe(utcToday);

    const desk = await browser.newContext({ viewport: { width: 1280, height: 900 }, timezoneId: 'UTC' });
    const page = await desk.newPage();
    const watch = watchPage(page);
    await signIn(page, baseUrl, 'owner@browseline.test');
    await page.waitForURL(`${baseUrl}/desk`, WAIT);
    await page.goto(`${baseUrl}/settings/team`);
    const select = page.getByLabel('Time zone');
    await select.waitFor(WAIT);
    // The form may show before the firm's settings arrive: wait for the saved zone, not for time.
    await expect.poll(() => select.inputValue(), WAIT).toBe('America/Chicago');
    await select.selectOption(zone);
    await page.getByRole('button', { name: 'Save firm settings' }).click();
    await page.getByText('Firm settings saved.').waitFor(WAIT);
    await screenshot(page, 'firm-clock-settings');
    watch.assertClean();
    await desk.close();

    const phone = await browser.newContext({ viewport: { width: 360, height: 740 }, timezoneId: 'UTC', isMobile: true, hasTouch: true });
    const field = await phone.newPage();
    const fieldWatch = watchPage(field);
    await signIn(field, baseUrl, 'crew@browseline.test');
    await field.waitForURL(`${baseUrl}/field`, WAIT);
    const today = field.locator('[data-firm-today]');
    await today.waitFor(WAIT);
    expect(await today.getAttribute('data-firm-today')).toBe(firmToday);
    expect(await today.textContent()).toBe(formatDateWithWeekday(firmToday)); // e.g. "Sunday, Dec 6, 2026"
    await screenshot(field, 'firm-clock-field-sheet');
    fieldWatch.assertClean();
    await phone.close();

    const back = await owner.request.patch('/api/firm/settings', { headers: { 'X-CSRF-Token': owner.csrf }, data: { timezone: 'America/Chicago' } });
    expect(back.status()).toBe(200);
  });
});

/** A small rectangle of lon/lat degrees as a GeoJSON polygon. */
const box = (lon: number, lat: number, dLon: number, dLat: number) => ({
  type: 'Polygon',
  coordinates: [[[lon, lat], [lon + dLon, lat], [lon + dLon, lat + dLat], [lon, lat + dLat], [lon, lat]]],
});

describe('a sent proposal reads the same forever', () => {
  it('the consultant sends a proposal, a unit is drawn afterwards, and the proposal PDF (text and map) is unchanged', async () => {
    const consultant = await apiSignIn(baseUrl, 'consultant@browseline.test');
    const post = async <T>(url: string, data: unknown, status = 201): Promise<T> => {
      const res = await consultant.request.post(url, { headers: { 'X-CSRF-Token': consultant.csrf }, data: data as object });
      expect(res.status(), `${url}: ${await res.text()}`).toBe(status);
      return ((await res.json()) as { data: T }).data;
    };
    // A client and forty of our own, so no other journey's plan changes.
    const client = await post<{ id: number }>('/api/clients', { name: 'Clockwork Hollow Family', email: 'clockwork@example.test' });
    const property = await post<{ id: number }>('/api/properties', { clientId: client.id, name: 'Clockwork Forty', county: 'Crawford', state: 'WI', region: 'midwest', boundary: box(-90.95, 43.3, 0.01, 0.006) });
    const plot = await post<{ id: number }>(`/api/properties/${property.id}/units`, { kind: 'food-plot', name: 'Clock plot', geometry: box(-90.948, 43.301, 0.0015, 0.001) });
    const practices = ((await (await consultant.request.get('/api/practices')).json()) as { data: { id: number; key: string }[] }).data;
    await post(`/api/units/${plot.id}/prescriptions`, { practiceId: practices.find((p) => p.key === 'fall-brassica-plot')!.id });
    const draft = await post<{ id: number }>(`/api/properties/${property.id}/proposals`, { depositPct: 30 });

    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    const watch = watchPage(page);
    await signIn(page, baseUrl, 'consultant@browseline.test');
    await page.waitForURL(`${baseUrl}/desk`, WAIT);
    await page.goto(`${baseUrl}/proposals/${draft.id}`);
    await page.getByRole('button', { name: 'Send to client…' }).click(WAIT);
    await page.getByRole('button', { name: /^(Send proposal|Save and send)$/ }).click(WAIT);
    await expect.poll(async () => ((await (await page.request.get(`${baseUrl}/api/proposals/${draft.id}`)).json()) as { data: { status: string } }).data.status, WAIT).toBe('sent');
    await screenshot(page, 'firm-clock-proposal-sent');

    const pdfOf = async (id: number, name: string) => {
      const res = await page.request.get(`${baseUrl}/api/proposals/${id}/pdf`);
      expect(res.status()).toBe(200);
      const file = path.join(SCREENSHOTS, `${name}.pdf`);
      fs.mkdirSync(SCREENSHOTS, { recursive: true });
      fs.writeFileSync(file, await res.body());
      execFileSync('pdftoppm', ['-png', '-r', '60', '-f', '1', '-l', '1', '-singlefile', file, file.replace(/\.pdf$/, '')]);
      return { text: execFileSync('pdftotext', ['-layout', file, '-']).toString(), page1: fs.readFileSync(file.replace(/\.pdf$/, '.png')) };
    };
    const before = await pdfOf(draft.id, 'firm-clock-proposal-before');
    expect(before.text).toContain('Clock plot');
    expect(before.text).not.toContain('Sanctuary');

    // A sanctuary drawn after sending: a live map would grow a "Sanctuary" legend entry and a new area.
    await post(`/api/properties/${property.id}/units`, { kind: 'sanctuary', name: 'Late hollow', geometry: box(-90.945, 43.302, 0.004, 0.003) });
    const units = ((await (await consultant.request.get(`/api/properties/${property.id}/units`)).json()) as { data: unknown[] }).data;
    expect(units).toHaveLength(2);

    const after = await pdfOf(draft.id, 'firm-clock-proposal-after');
    expect(after.text).toBe(before.text);
    expect(after.page1.equals(before.page1)).toBe(true); // the map page renders pixel for pixel the same

    // The same property's next draft shows the live plan, with the sanctuary: the check above can see one.
    const next = await post<{ id: number }>(`/api/properties/${property.id}/proposals`, { depositPct: 30 });
    const live = await pdfOf(next.id, 'firm-clock-proposal-live-draft');
    expect(live.text).toContain('Sanctuary');
    expect(live.page1.equals(before.page1)).toBe(false);

    // Dates on the consultant's pages are written as people write them, never 2026-12-05.
    for (const [url, ready] of [
      [`${baseUrl}/invoices`, 'Bluestem Ridge Hunting Club'],
      [`${baseUrl}/desk`, 'Acres under plan'],
      [`${baseUrl}/proposals/${draft.id}`, 'Clockwork Forty'],
    ] as const) {
      await page.goto(url);
      await page.getByText(ready).first().waitFor(WAIT);
      const text = await page.locator('main').innerText();
      expect(text, url).not.toMatch(/\b\d{4}-\d{2}-\d{2}\b/);
    }
    await screenshot(page, 'firm-clock-proposal-page');

    watch.assertClean();
    await context.close();
    await consultant.request.dispose();
  });
});
