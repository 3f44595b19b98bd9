/**
 * Sign from the field to the plan: a crew member on a phone opens "Log sign", loses the signal,
 * logs a scrape with a photo (a JPEG the test draws, EXIF written with piexifjs) at a position
 * inside a known unit, sees it wait on the phone, gets the signal back and sees it sent once; then
 * the consultant opens the plan map and finds the scrape in the right unit, on the layer and in the
 * per-unit table. Screenshots of the form, the layer, the table and chart, and the portal's map.
 */
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser } from 'playwright-core';
import pointOnFeature from '@turf/point-on-feature';
import type { MultiPolygon, Polygon } from 'geojson';
import fs from 'node:fs';
import path from 'node:path';
import { apiSignIn, launchBrowser, screenshot, SCREENSHOTS, signIn, watchPage } from '../support/browser';
import { makeJpeg } from '../support/photo-fixtures';
import { ObservationSchema } from '../../shared/schemas/observation';

const baseUrl = inject('baseUrl');
/** Waits for the page or the server to catch up (a sync, a lazy chunk): up to 30 s, no fixed sleeps. */
const poll = <T>(fn: () => Promise<T> | T) => expect.poll(fn, { timeout: 30_000, interval: 150 });

const PROPERTY = 'Kettle Hollow Farm';
const UNIT = 'Hollow brassica plot';
const NOTE = 'Fresh scrape under a licking branch (e2e)';

let browser: Browser;
let propertyId = 0;
let unit: { id: number; name: string; geometry: Polygon | MultiPolygon };

beforeAll(async () => {
  browser = await launchBrowser();
  const consultant = await apiSignIn(baseUrl, 'consultant@browseline.test');
  const properties = (await (await consultant.request.get('/api/properties')).json()) as { data: { id: number; name: string }[] };
  propertyId = properties.data.find((p) => p.name === PROPERTY)!.id;
  const units = (await (await consultant.request.get(`/api/properties/${propertyId}/units`)).json()) as { data: { id: number; name: string; geometry: Polygon | MultiPolygon }[] };
  unit = units.data.find((u) => u.name === UNIT)!;
  expect(unit).toBeDefined();
  await consultant.request.dispose();
});

afterAll(async () => {
  await browser?.close();
});

describe('a scrape logged offline on a phone reaches the consultant’s plan map', () => {
  it('queues with no signal, is sent once when the signal comes back, and lands in the unit that contains it', async () => {
    // A point surely inside the plot (turf's point-on-feature), and a photo taken there that morning.
    const [lon, lat] = pointOnFeature(unit.geometry).geometry.coordinates as [number, number];
    const photo = await makeJpeg({ width: 320, height: 240, rgb: [120, 96, 60], takenAt: '2026:11:02 07:40:00', latitude: lat, longitude: lon });

    const context = await browser.newContext({
      viewport: { width: 360, height: 740 },
      isMobile: true,
      hasTouch: true,
      deviceScaleFactor: 2,
      timezoneId: 'America/Chicago',
      permissions: ['geolocation'],
      geolocation: { longitude: lon, latitude: lat, accuracy: 8 },
    });
    const page = await context.newPage();
    const { errors } = watchPage(page);
    const posts: number[] = [];
    page.on('response', (r) => {
      if (r.request().method() === 'POST' && /\/api\/properties\/\d+\/observations$/.test(r.url())) posts.push(r.status());
    });

    await signIn(page, baseUrl, 'crew@browseline.test');
    await page.waitForURL(`${baseUrl}/field`);
    await page.getByRole('link', { name: 'Log sign' }).click();
    await page.waitForURL(`${baseUrl}/field/log`);
    const form = page.getByRole('form', { name: 'Log sign' });
    await poll(() => form.count()).toBe(1);

    await context.setOffline(true);
    await context.setGeolocation({ longitude: lon, latitude: lat, accuracy: 8 });
    if ((await form.getByLabel('Property').count()) > 0) await form.getByLabel('Property').selectOption({ label: PROPERTY });
    await form.getByRole('button', { name: 'Scrape' }).click();
    await form.getByLabel('Photos').setInputFiles({ name: 'scrape.jpg', mimeType: 'image/jpeg', buffer: photo });
    await form.getByLabel('Note').fill(NOTE);
    await form.getByRole('button', { name: 'Use this phone’s position' }).click();
    await poll(() => page.getByTestId('log-sign-position').textContent()).toContain(lat.toFixed(5));
    await screenshot(page, 'observations-log-form');
    await form.getByRole('button', { name: 'Save sign' }).click();

    // No signal: it waits on the phone, and nothing has reached the server.
    await poll(() => page.getByTestId('observations-waiting').textContent()).toContain('1 observation is saved on this phone');
    await screenshot(page, 'observations-queued');
    expect(posts).toEqual([]);

    await context.setOffline(false);
    await poll(() => page.getByTestId('observations-waiting').count()).toBe(0);
    await poll(() => posts.length).toBe(1);
    expect(posts).toEqual([201]);
    // The queue may try while the phone has no signal; that refusal is the browser's, not a fault.
    expect(errors.filter((e) => !e.includes('net::ERR_INTERNET_DISCONNECTED'))).toEqual([]);
    await context.close();

    // The consultant: the server placed it in the plot, with the phone's position.
    const consultant = await apiSignIn(baseUrl, 'consultant@browseline.test');
    const list = (await (await consultant.request.get(`/api/properties/${propertyId}/observations?kind=scrape`)).json()) as { data: unknown[] };
    const mine = list.data.map((o) => ObservationSchema.parse(o)).filter((o) => o.notes === NOTE);
    expect(mine).toHaveLength(1);
    expect(mine[0]).toMatchObject({ kind: 'scrape', unitId: unit.id, unitName: UNIT, positionSource: 'device', insideBoundary: true });
    expect(mine[0].photos).toHaveLength(1);
    expect(mine[0].position[0]).toBeCloseTo(lon, 6);
    expect(mine[0].position[1]).toBeCloseTo(lat, 6);
    await consultant.request.dispose();

    const desk = await browser.newContext({ viewport: { width: 1400, height: 900 }, timezoneId: 'America/Chicago' });
    const map = await desk.newPage();
    const watch = watchPage(map);
    await signIn(map, baseUrl, 'consultant@browseline.test');
    await map.waitForURL(`${baseUrl}/desk`);
    await map.goto(`${baseUrl}/properties/${propertyId}/map`);
    // Below 1440 px the map's side panel starts folded: open it for the layer's controls.
    await map.getByRole('button', { name: 'Show map panel' }).click();
    const layer = map.getByRole('region', { name: 'Observations' });
    await poll(() => layer.count()).toBe(1);
    // Only scrapes, then the month of the new one: the layer shows exactly it.
    const kinds = layer.getByRole('group', { name: 'Kinds of sign' }).getByRole('button');
    for (const button of await kinds.all()) if ((await button.textContent())?.trim() !== 'Scrape') await button.click();
    await layer.getByLabel('Time range').selectOption('month');
    const slider = layer.getByLabel('Month');
    const last = Number(await slider.getAttribute('max'));
    await slider.fill(String(last));
    await poll(() => layer.getAttribute('data-observations-shown')).toBe('1');
    // The map's own source answers the same point, inside the plot (a feature comes once per tile it touches: by id).
    await poll(() =>
      map.evaluate(() => {
        const m = window.__planMapStats?.map() as { querySourceFeatures: (s: string) => { properties: Record<string, unknown> }[] } | undefined;
        return [...new Set((m?.querySourceFeatures('observations') ?? []).filter((f) => !f.properties.cluster).map((f) => `${f.properties.id}:${f.properties.kind}@${f.properties.unitName}`))];
      }),
    ).toEqual([`${mine[0].id}:scrape@${UNIT}`]);
    await screenshot(map, 'observations-plan-map-layer');
    watch.assertClean();

    // The property page: the per-unit table counts it under the plot.
    await map.goto(`${baseUrl}/properties/${propertyId}`);
    const table = map.getByRole('table', { name: 'Observations by unit' });
    await poll(() => table.count()).toBe(1);
    await poll(() => table.getByRole('row', { name: new RegExp(UNIT) }).count()).toBe(1);
    await screenshot(map, 'observations-summary-by-unit');
    await map.getByRole('group', { name: 'Count by' }).getByRole('button', { name: 'By month' }).click();
    await poll(() => map.getByRole('table', { name: 'Observations by month' }).count()).toBe(1);
    await poll(() => map.locator('.recharts-surface').count()).toBeGreaterThan(0);
    await screenshot(map, 'observations-summary-by-month');
    await desk.close();

    // The landowner's portal: Results show the observation map.
    const portal = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const landowner = await portal.newPage();
    const portalWatch = watchPage(landowner);
    await signIn(landowner, baseUrl, 'client@browseline.test');
    await landowner.waitForURL(`${baseUrl}/portal`);
    await landowner.goto(`${baseUrl}/portal/properties/${propertyId}/results`);
    await poll(() => landowner.getByRole('table', { name: 'Observations by unit' }).getByRole('row', { name: new RegExp(UNIT) }).count()).toBe(1);
    await screenshot(landowner, 'observations-portal-results');
    // The observation map itself, in view (a full-page capture resizes the page under WebGL).
    const portalMap = landowner.getByTestId('observation-map');
    await portalMap.scrollIntoViewIfNeeded();
    await poll(() => portalMap.locator('canvas').count()).toBe(1);
    await landowner.getByRole('region', { name: 'Observations' }).waitFor();
    fs.mkdirSync(SCREENSHOTS, { recursive: true });
    await portalMap.locator('..').screenshot({ path: path.join(SCREENSHOTS, 'observations-portal-map.png') });
    portalWatch.assertClean();
    await portal.close();
  });

  it('the owner sets how far a sign snaps to a unit, and the consultant lets the landowner log sign in the portal', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    const watch = watchPage(page);
    await signIn(page, baseUrl, 'owner@browseline.test');
    await page.waitForURL(`${baseUrl}/desk`);
    await page.goto(`${baseUrl}/settings/team`);
    const snap = page.getByLabel('Place a sign on the nearest unit within (ft)');
    await poll(() => snap.inputValue()).toBe('50');
    await snap.fill('6000');
    await page.getByRole('button', { name: 'Save firm settings' }).click();
    await poll(() => page.getByText('must be at most 5,280 ft (a mile)').count()).toBe(1);
    await snap.fill('80');
    await page.getByRole('button', { name: 'Save firm settings' }).click();
    await poll(() => page.getByText('Firm settings saved.').count()).toBe(1);
    await screenshot(page, 'observations-firm-settings');
    const firm = async () => (await page.evaluate(async () => (await (await fetch('/api/firm')).json()) as { data: { settings: { observationSnapFt: number } } })).data.settings.observationSnapFt;
    expect(await firm()).toBe(80);
    await snap.fill('50');
    await page.getByRole('button', { name: 'Save firm settings' }).click();
    await poll(() => firm()).toBe(50);

    // The client page: the switch for the landowner's contacts.
    await page.goto(`${baseUrl}/clients`);
    await page.getByRole('link', { name: 'Okonkwo-Larsen Family' }).first().click();
    const allow = page.getByRole('checkbox', { name: /Client may log field observations/ });
    await poll(() => allow.count()).toBe(1);
    expect(await allow.isChecked()).toBe(false);
    // A controlled switch: it flips when the server has saved it.
    await allow.click();
    await poll(() => allow.isChecked()).toBe(true);
    await poll(() => page.getByText('may now log field observations').count()).toBeGreaterThan(0);
    await screenshot(page, 'observations-client-switch');
    watch.assertClean();

    // The landowner now has "Log sign" on the Results; switched off again, it goes.
    const portal = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const landowner = await portal.newPage();
    await signIn(landowner, baseUrl, 'client@browseline.test');
    await landowner.waitForURL(`${baseUrl}/portal`);
    await landowner.goto(`${baseUrl}/portal/properties/${propertyId}/results`);
    await poll(() => landowner.getByRole('button', { name: 'Log sign' }).count()).toBe(1);
    await allow.click();
    await poll(() => allow.isChecked()).toBe(false);
    await poll(() => page.getByText('can no longer log field observations').count()).toBeGreaterThan(0);
    await landowner.reload();
    await poll(() => landowner.getByRole('table', { name: 'Observations by unit' }).count()).toBe(1);
    // The portal may first paint from its kept cache; once the home answer is fresh, the button is gone.
    await poll(() => landowner.getByRole('button', { name: 'Log sign' }).count()).toBe(0);
    await portal.close();
    await context.close();
  });
});
