import { describe, expect, inject, it } from 'vitest';
import type { Page } from 'playwright-core';
import { apiSignIn, journeyBrowser, screenshot, signIn, watchPage } from '../support/browser';
import { expectNoAxeViolations } from '../support/axe';
import { ellipsoidalAreaSqM, rectangle } from '../support/geodesy';
import { SQ_M_PER_ACRE } from '../../shared/units';

const baseUrl = inject('baseUrl');
/** The map chunk and the plan load over a few requests: give the page time. */
const WAIT = { timeout: 15_000 };

const browser = journeyBrowser();

/** Opens a demo property's plan map the way a consultant does: Properties, then the property's "Plan map". */
async function openPlanMap(page: Page, propertyName: string): Promise<void> {
  await signIn(page, baseUrl, 'consultant@browseline.test');
  await page.waitForURL(`${baseUrl}/desk`);
  await page.getByRole('navigation', { name: 'Places' }).getByRole('link', { name: 'Properties' }).click();
  await page.getByRole('link', { name: `Plan map of ${propertyName}` }).click();
  await page.waitForURL(/\/properties\/\d+\/map$/);
  await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent(), WAIT).toBe(propertyName);
  // The map is ready when its canvas is drawn and the ledger has loaded.
  await page.locator('[data-testid=plan-map] canvas.maplibregl-canvas').waitFor();
  await page.getByRole('heading', { name: /^Units/ }).waitFor();
}

/** The number in a "12.34 ac" figure. */
const acresIn = (text: string | null) => Number((text ?? '').replace(/,/g, '').match(/([\d.]+)\s*ac/)?.[1] ?? NaN);

describe('plan map', () => {
  it('draws a food plot by clicking on the map, shows its acres, keeps it after a reload, deletes it and undoes the delete', async () => {
    const context = await browser.newContext({ viewport: { width: 1440, height: 900 } });
    const page = await context.newPage();
    const watch = watchPage(page);
    page.on('dialog', (d) => void d.accept());
    await openPlanMap(page, 'Kettle Hollow Farm');

    await page.getByRole('button', { name: 'Food plot', exact: true }).click();
    const map = (await page.locator('[data-testid=plan-map]').boundingBox())!;
    // An open stretch of the farm between the demo units at this viewport (fractions of the map box).
    const corners = [
      [0.45, 0.62],
      [0.54, 0.62],
      [0.54, 0.69],
      [0.45, 0.69],
    ].map(([fx, fy]) => ({ x: map.x + map.width * fx, y: map.y + map.height * fy }));
    for (const c of corners) {
      await page.mouse.move(c.x, c.y, { steps: 4 });
      await page.mouse.click(c.x, c.y);
    }
    // terra-draw closes a polygon when its first corner is clicked again.
    await page.mouse.move(corners[0].x, corners[0].y, { steps: 4 });
    await page.mouse.click(corners[0].x, corners[0].y);

    // The demo farm has two food plots, so the new one is "Food plot 3"; its detail opens in the ledger.
    const detail = page.getByRole('region', { name: 'Unit Food plot 3' });
    await detail.waitFor();
    const shownAcres = acresIn(await detail.getByRole('definition').first().textContent());
    const propertyId = Number(new URL(page.url()).pathname.split('/')[2]);
    const units = (await (await page.request.get(`${baseUrl}/api/properties/${propertyId}/units`)).json()) as { data: { name: string; acres: number | null }[] };
    const saved = units.data.find((u) => u.name === 'Food plot 3');
    expect(saved?.acres).toBeGreaterThan(0.5);
    // The ledger shows the server's acres (computed on the server), rounded to hundredths.
    expect(shownAcres).toBeCloseTo(saved!.acres!, 2);
    await screenshot(page, 'plan-map-drawn-food-plot');

    await page.reload();
    await page.getByRole('heading', { name: /^Units/ }).waitFor();
    await page.getByRole('list', { name: 'Food plot' }).getByRole('button', { name: /Food plot 3/ }).click();
    await detail.waitFor();
    expect(acresIn(await detail.getByRole('definition').first().textContent())).toBeCloseTo(saved!.acres!, 2);

    await detail.getByRole('button', { name: 'Delete unit' }).click();
    await expect.poll(() => page.getByRole('list', { name: 'Food plot' }).getByRole('button', { name: /Food plot 3/ }).count(), WAIT).toBe(0);
    // The Undo button now offers to bring it back; Ctrl+Z does it.
    await expect.poll(() => page.getByRole('button', { name: 'Undo' }).getAttribute('title'), WAIT).toMatch(/^Undo: delete Food plot 3/);
    await page.keyboard.press('Control+z');
    await expect.poll(() => page.getByRole('list', { name: 'Food plot' }).getByRole('button', { name: /Food plot 3/ }).count(), WAIT).toBe(1);
    await screenshot(page, 'plan-map-after-undo');
    watch.assertClean();
    await context.close();
  });

  it('imports a KML boundary, lists the placemark it had to skip, and shows the new boundary acres', async () => {
    // bypassCSP only lets the journey inject axe-core; the app's own CSP is unchanged.
    const context = await browser.newContext({ viewport: { width: 1440, height: 900 }, bypassCSP: true });
    const page = await context.newPage();
    const watch = watchPage(page);
    page.on('dialog', (d) => void d.accept());
    // North 40 is used by no other journey, so replacing its boundary disturbs none of them.
    await openPlanMap(page, 'Kettle Hollow — North 40');
    // The toolbar's file input and every other control: WCAG 2.1 A/AA, experimental rules included.
    await expectNoAxeViolations(page, 'the plan map');

    // A 600 m × 540 m rectangle: 324,000 m², about 80 acres.
    const outline = rectangle(-90.9412, 43.2732, 600, 540);
    const coords = outline.coordinates[0].map(([lon, lat]) => `${lon.toFixed(7)},${lat.toFixed(7)}`).join(' ');
    const kml = `<?xml version="1.0" encoding="UTF-8"?>
<kml xmlns="http://www.opengis.net/kml/2.2"><Document><name>Survey</name>
<Placemark><name>Property boundary</name><Polygon><outerBoundaryIs><LinearRing><coordinates>${coords}</coordinates></LinearRing></outerBoundaryIs></Polygon></Placemark>
<Placemark><name>Lost corner</name><Polygon><outerBoundaryIs><LinearRing><coordinates>-90.75,43.45</coordinates></LinearRing></outerBoundaryIs></Polygon></Placemark>
</Document></kml>`;
    await page.locator('#plan-import-file').setInputFiles({ name: 'survey.kml', mimeType: 'application/vnd.google-earth.kml+xml', buffer: Buffer.from(kml) });

    const preview = page.getByRole('region', { name: 'Import preview' });
    await preview.waitFor();
    await expect.poll(() => preview.getByRole('region', { name: 'Skipped features' }).textContent(), WAIT).toMatch(/Lost corner/);
    const choice = preview.getByRole('combobox', { name: 'Property boundary' });
    await choice.selectOption('boundary');
    await screenshot(page, 'plan-map-import-preview');
    await preview.getByRole('button', { name: 'Save 1 feature' }).click();
    await preview.waitFor({ state: 'detached' });

    // Reference: GeographicLib on WGS84 (Karney 2013, via tests/support/geodesy.ts). The server
    // measures on the ellipsoid (within 0.01 %); the header rounds to hundredths of an acre.
    const expectedAcres = ellipsoidalAreaSqM(outline) / SQ_M_PER_ACRE;
    const size = page.getByTestId('property-size');
    await expect.poll(async () => Math.abs(acresIn(await size.textContent()) - expectedAcres), WAIT).toBeLessThan(0.01);
    const headerAcres = acresIn(await size.textContent());
    await expect.poll(async () => acresIn(await page.getByRole('heading', { name: /Acres by kind/ }).textContent()), WAIT).toBeCloseTo(headerAcres, 2);
    await screenshot(page, 'plan-map-imported-boundary');
    watch.assertClean();
    await context.close();
  });

  it('measures next to the cursor while drawing, takes back a point, and asks before keeping a boundary drawn at the opening zoom', async () => {
    // A property of the demo client without a boundary: the map opens at its wide default view.
    const api = await apiSignIn(baseUrl, 'consultant@browseline.test');
    const clients = (await (await api.request.get('/api/clients')).json()) as { data: { id: number }[] };
    const created = await api.request.post('/api/properties', { headers: { 'X-CSRF-Token': api.csrf }, data: { clientId: clients.data[0].id, name: `Zoomed-out tract ${Date.now()}` } });
    expect(created.status()).toBe(201);
    const propertyId = ((await created.json()) as { data: { id: number } }).data.id;

    const context = await browser.newContext({ viewport: { width: 1440, height: 900 } });
    const page = await context.newPage();
    const watch = watchPage(page);
    await signIn(page, baseUrl, 'consultant@browseline.test');
    await page.waitForURL(`${baseUrl}/desk`);
    await page.goto(`${baseUrl}/properties/${propertyId}/map`);
    await page.locator('[data-testid=plan-map] canvas.maplibregl-canvas').waitFor();
    await page.getByRole('heading', { name: /^Units/ }).waitFor();

    await page.getByRole('button', { name: 'Boundary', exact: true }).click();
    const drawing = page.getByRole('group', { name: 'Drawing' });
    await drawing.waitFor();
    expect(await drawing.getByRole('button', { name: 'Finish' }).isDisabled()).toBe(true);
    const map = (await page.locator('[data-testid=plan-map] canvas.maplibregl-canvas').boundingBox())!;
    const at = (fx: number, fy: number) => ({ x: map.x + map.width * fx, y: map.y + map.height * fy });
    const corners = [at(0.3, 0.4), at(0.6, 0.4), at(0.6, 0.75), at(0.45, 0.85)];
    for (const c of corners) {
      await page.mouse.move(c.x, c.y, { steps: 4 });
      await page.mouse.click(c.x, c.y);
    }
    // The live measure rides beside the cursor: acres and the perimeter in feet.
    const label = page.getByTestId('cursor-measure');
    await page.mouse.move(map.x + map.width * 0.35, map.y + map.height * 0.8, { steps: 4 });
    await expect.poll(() => label.textContent(), WAIT).toMatch(/^[\d,.]+ ac · [\d,]+ ft$/);
    const withFour = acresIn(await label.textContent());
    await screenshot(page, 'plan-map-live-measure');

    // Undo point takes back the fourth corner: the area shrinks.
    await drawing.getByRole('button', { name: 'Undo point' }).click();
    await page.mouse.move(map.x + map.width * 0.36, map.y + map.height * 0.8, { steps: 2 });
    await expect.poll(async () => acresIn(await label.textContent()), WAIT).not.toBeCloseTo(withFour, 0);
    await drawing.getByRole('button', { name: 'Finish' }).click();

    // Millions of acres: the server asks for confirmLargeArea and the page asks the person.
    const ask = page.getByRole('dialog', { name: 'Keep this large area?' });
    await ask.waitFor(WAIT);
    await expect.poll(() => ask.textContent()).toMatch(/The boundary measures [\d,]+ acres, more than the 20,000 acres this firm checks/);
    await screenshot(page, 'plan-map-large-area-question');
    await ask.getByRole('button', { name: 'Cancel' }).click();
    await ask.waitFor({ state: 'hidden' });
    const after = (await (await api.request.get(`/api/properties/${propertyId}`)).json()) as { data: { acres: number | null } };
    expect(after.data.acres).toBeNull(); // nothing saved
    watch.assertClean();
    await context.close();
    // Leave the demo data as it was for the other journeys.
    expect((await api.request.delete(`/api/properties/${propertyId}`, { headers: { 'X-CSRF-Token': api.csrf } })).status()).toBeLessThan(300);
    await api.request.dispose();
  });

  it('turns a walked GPS track whose ends nearly meet into a food plot', async () => {
    const context = await browser.newContext({ viewport: { width: 1440, height: 900 } });
    const page = await context.newPage();
    const watch = watchPage(page);
    await openPlanMap(page, 'Kettle Hollow — North 40');
    // An open walk around a 150 m square inside the boundary above (south-west, south-east,
    // north-east, north-west corners), coming back down the west side to about 9 m short of its start.
    const square = rectangle(-90.9412, 43.2732, 150, 150).coordinates[0].slice(0, 4);
    const end = [square[0][0], square[0][1] + 0.00008];
    const points = [...square, end].map(([lon, lat]) => `<trkpt lat="${lat.toFixed(7)}" lon="${lon.toFixed(7)}"/>`).join('');
    const gpx = `<?xml version="1.0"?><gpx version="1.1" creator="handheld" xmlns="http://www.topografix.com/GPX/1/1"><trk><name>Clover walk</name><trkseg>${points}</trkseg></trk></gpx>`;
    await page.locator('#plan-import-file').setInputFiles({ name: 'walk.gpx', mimeType: 'application/gpx+xml', buffer: Buffer.from(gpx) });
    const preview = page.getByRole('region', { name: 'Import preview' });
    await preview.waitFor();
    await expect.poll(() => preview.textContent(), WAIT).toMatch(/ends are 9 m apart/);
    await preview.getByRole('combobox', { name: 'Clover walk' }).selectOption('food-plot');
    await screenshot(page, 'plan-map-import-walked-track');
    await preview.getByRole('button', { name: 'Save 1 feature' }).click();
    await preview.waitFor({ state: 'detached' });
    await expect.poll(() => page.getByText('Clover walk').first().isVisible(), WAIT).toBe(true);
    watch.assertClean();
    await context.close();
  });
});
