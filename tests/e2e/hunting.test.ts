/**
 * Hunting pressure in the browser: the consultant reads a stand's unsuitable winds with their reasons
 * on "Stands & wind"; a hunter of the family (a client contact, sit logging on in the demo) on a phone
 * picks today's wind, sees the stand it suggests with the route to walk in, loses the signal, logs the
 * sit, and once back online the sit reaches the server exactly once (the pressure answer counts it once);
 * then records the deer taken on that sit with the state's disease-sampling number.
 */
import { describe, expect, inject, it } from 'vitest';
import { apiSignIn, journeyBrowser, screenshot, signIn, watchPage } from '../support/browser';
import { openProperty, signInAsConsultant } from '../support/journey-steps';

const baseUrl = inject('baseUrl');
const poll = <T>(fn: () => Promise<T> | T, timeout = 30_000) => expect.poll(fn, { timeout, interval: 150 });

interface StandsAnswer {
  data: { unitId: number; name: string; winds: { from: string; suitable: boolean; routeIds?: number[]; reasons: { kind: string; name: string }[] }[] }[];
}
interface PressureAnswer {
  data: { unitId: number; sits: number }[];
}

let propertyId = 0;

const browser = journeyBrowser();

describe('stands, winds and the sit log', () => {
  it('the consultant sees the ridge stand’s unsuitable winds with their reasons', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    const watch = watchPage(page);
    await signInAsConsultant(page, baseUrl);
    propertyId = await openProperty(page, 'Kettle Hollow Farm');
    await page.getByRole('link', { name: 'Stands & wind' }).click();
    await page.waitForURL(`${baseUrl}/properties/${propertyId}/stands`);
    // The way back names the farm, not the word "Property".
    await poll(() => page.getByRole('navigation', { name: 'Breadcrumb' }).textContent()).toContain('Kettle Hollow Farm');

    // The demo's ridge stand watches the ridge clover plot, which deer approach from the south: a wind
    // from the north lays scent south over that side (the convention; demo stand details).
    const ridge = page.getByRole('listitem').filter({ has: page.getByRole('heading', { name: 'Ridge stand' }) });
    await poll(() => ridge.count()).toBe(1);
    await ridge.getByText(/Unsuitable winds \(\d+\) and why/).click();
    const north = ridge.getByRole('listitem').filter({ has: page.locator('strong', { hasText: /^N$/ }) });
    await poll(() => north.textContent()).toContain('scent over the side deer approach “Ridge clover plot”');
    await poll(() => page.getByRole('note').filter({ hasText: /harness/i }).count()).toBeGreaterThan(0);
    await screenshot(page, 'hunting-stands-consultant');
    watch.assertClean();
    await context.close();
  });

  it('a hunter on a phone picks today’s wind, sits the suggested stand and logs the sit offline; it is sent once', async () => {
    const hunter = await apiSignIn(baseUrl, 'client@browseline.test');
    const winds = (await (await hunter.request.get(`/api/properties/${propertyId}/stand-winds`)).json()) as StandsAnswer;
    // A wind that some stand suits and for which a route to it suits as well.
    const pick = winds.data.flatMap((s) => s.winds.filter((w) => w.suitable && (w.routeIds?.length ?? 0) > 0).map((w) => ({ stand: s, wind: w.from })))[0];
    expect(pick).toBeDefined();
    const sitsBefore = async () => ((await (await hunter.request.get(`/api/properties/${propertyId}/pressure`)).json()) as PressureAnswer).data.find((r) => r.unitId === pick!.stand.unitId)?.sits ?? 0;
    const before = await sitsBefore();

    const context = await browser.newContext({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true });
    const page = await context.newPage();
    const watch = watchPage(page);
    await signIn(page, baseUrl, 'client@browseline.test');
    await page.waitForURL(/\/portal/);
    await page.goto(`${baseUrl}/portal/properties/${propertyId}/stands`);
    await poll(() => page.getByRole('navigation', { name: 'Breadcrumb' }).textContent()).toContain('Kettle Hollow Farm');
    await page.getByRole('group', { name: 'Wind from' }).getByRole('button', { name: pick!.wind, exact: true }).click();
    const list = page.getByRole('list', { name: `Stands for a wind from ${pick!.wind}` });
    const card = list.getByRole('listitem').filter({ hasText: pick!.stand.name });
    await poll(() => card.count()).toBe(1);
    await poll(() => card.textContent()).toMatch(/Walk in by “.+”/);
    await screenshot(page, 'hunting-phone-list');

    await card.getByRole('button', { name: 'Sit here' }).click();
    const form = page.getByRole('form', { name: 'Log a sit' });
    await context.setOffline(true);
    await form.getByLabel('Does').fill('3');
    // A buck the hunter could tell apart, from the camera roster (the demo's "Wide eight"): the bucks count follows.
    await form.getByRole('group', { name: /Bucks you could tell apart/ }).getByLabel('Wide eight').check();
    expect(await form.getByLabel('bucks', { exact: true }).inputValue()).toBe('1');
    await form.getByRole('button', { name: 'Save sit' }).click();
    await poll(() => form.getByRole('status').textContent()).toContain('Saved on this phone');
    await poll(() => page.getByText('1 sit waiting to send.').isVisible()).toBe(true);
    expect(await sitsBefore()).toBe(before);
    await screenshot(page, 'hunting-phone-offline');

    await context.setOffline(false);
    await poll(() => sitsBefore()).toBe(before + 1);
    await poll(() => page.getByText(/waiting to send/).count()).toBe(0);
    const roster = (await (await hunter.request.get(`/api/properties/${propertyId}/bucks`)).json()) as { data: { id: number; name: string }[] };
    const sits = (await (await hunter.request.get(`/api/properties/${propertyId}/sits`)).json()) as { data: { id: number; buckIds: number[] }[] };
    const newest = sits.data.reduce((a, b) => (b.id > a.id ? b : a));
    expect(newest.buckIds).toEqual([roster.data.find((b) => b.name === 'Wide eight')!.id]);
    // Once: a reload (which runs the queue again) does not send it a second time.
    await page.reload();
    await poll(() => page.getByRole('group', { name: 'Wind from' }).isVisible()).toBe(true);
    expect(await sitsBefore()).toBe(before + 1);

    // The hunter then records the deer taken on that sit, with the state's disease-sampling number.
    const harvest = page.getByRole('form', { name: 'Record a harvest' });
    await harvest.getByLabel(/^Sex/).selectOption('female');
    await harvest.getByLabel(/^Age class/).selectOption('1.5');
    await harvest.getByLabel(/^Stand/).selectOption({ label: pick!.stand.name });
    await poll(() => harvest.getByLabel(/^Sit/).locator('option').count()).toBeGreaterThan(1);
    await harvest.getByLabel(/^Sit/).selectOption({ index: 1 });
    await harvest.getByLabel(/Disease-sampling number/).fill('WI-CWD 2026-0101');
    await harvest.getByRole('button', { name: 'Save harvest' }).click();
    await poll(() => harvest.getByRole('status').textContent()).toBe('Harvest recorded.');
    const harvests = (await (await hunter.request.get(`/api/properties/${propertyId}/harvests`)).json()) as { data: { diseaseSampleNumber: string | null; standUnitId: number | null; sitId: number | null }[] };
    expect(harvests.data.filter((h) => h.diseaseSampleNumber === 'WI-CWD 2026-0101')).toEqual([expect.objectContaining({ standUnitId: pick!.stand.unitId, sitId: expect.any(Number) })]);
    watch.assertClean();
    await hunter.request.dispose();
    await context.close();
  });
});
