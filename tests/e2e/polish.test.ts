/**
 * Loose ends in the browser: the firm's home area picked at sign-up; the camera page's numbers by
 * site (summed over deployments) with the activity-by-hour chart and the roster's age and notes; the
 * plan map at 1280 px: the map wide, the drawing tools in one row with a 'More' menu, the one side panel
 * folded at first and beside the map when opened (the choice remembered).
 */
import { describe, expect, inject, it } from 'vitest';
import crypto from 'node:crypto';
import { journeyBrowser, screenshot, signIn, watchPage } from '../support/browser';

const baseUrl = inject('baseUrl');
const mailUrl = inject('mailUrl');
const WAIT = { timeout: 20_000 };
const poll = <T>(fn: () => Promise<T> | T) => expect.poll(fn, { timeout: 20_000, interval: 150 });

type Summary = { id: number; to: string[] };
const mailTo = async (address: string) => ((await (await fetch(`${mailUrl}/messages`)).json()) as { data: Summary[] }).data.filter((m) => m.to.includes(address));
const mailText = async (id: number) => ((await (await fetch(`${mailUrl}/messages/${id}`)).json()) as { data: { text: string } }).data.text;

const browser = journeyBrowser();

describe('home area at sign-up', () => {
  it('a new firm picks its county on the sign-up form; after confirming, the firm has it and the first step is ticked', async () => {
    const stamp = crypto.randomBytes(3).toString('hex');
    const email = `home-${stamp}@driftless.example`;
    const password = 'a long enough password';
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    const watch = watchPage(page);
    await page.goto(`${baseUrl}/signup`);
    await page.getByLabel('Firm name').fill(`Driftless Habitat ${stamp}`);
    await page.getByLabel('Your name').fill('Sam Oyen');
    await page.getByLabel('E-mail').fill(email);
    await page.getByLabel('Password').fill(password);
    const home = page.getByRole('region', { name: 'Home area' });
    await home.getByRole('combobox', { name: 'Find a place' }).fill('Vernon County, WI');
    await home.getByRole('option', { name: /Vernon County, WI/ }).click();
    await poll(() => home.getByTestId('home-area').textContent()).toMatch(/Now: Vernon County, WI/);
    await screenshot(page, 'polish-signup-home-area');
    await page.getByRole('button', { name: 'Create the firm' }).click();
    await poll(() => page.getByRole('status').filter({ hasText: 'Check your e-mail' }).count()).toBe(1);

    await poll(async () => (await mailTo(email)).length).toBe(1);
    const link = /(http:\/\/\S+\/verify-email\/[A-Za-z0-9_-]+)/.exec(await mailText((await mailTo(email))[0]!.id))![1]!;
    await page.goto(link);
    await poll(() => page.getByRole('status').filter({ hasText: 'Your e-mail is confirmed' }).count()).toBe(1);
    await page.goto(`${baseUrl}/login`);
    await page.getByLabel('E-mail').fill(email);
    await page.getByLabel('Password').fill(password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(`${baseUrl}/desk`, WAIT);
    const firm = await page.evaluate(async () => (await (await fetch('/api/firm')).json()).data);
    // Vernon County, WI: its box from the Census county outline (us-atlas), about 91.28–90.31 W, 43.42–43.73 N.
    expect(firm.settings.homeArea.name).toBe('Vernon County, WI');
    const [w, s, e, n] = firm.settings.homeArea.bbox as number[];
    expect([w! < -91.2, e! > -90.4, s! < 43.45, n! > 43.7]).toEqual([true, true, true, true]);
    const steps = page.getByRole('list', { name: 'First steps' });
    await steps.waitFor(WAIT);
    expect(await steps.locator('li[data-done="true"]').filter({ hasText: 'Choose where you work' }).count()).toBe(1);
    watch.assertClean();
    await context.close();
  });
});

describe('camera numbers by site and the roster', () => {
  it('shows each site summed over its deployments, the hour chart for a site and kind, and saves a buck’s age class and notes', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 }, timezoneId: 'America/Chicago' });
    const page = await context.newPage();
    const watch = watchPage(page);
    await signIn(page, baseUrl, 'consultant@browseline.test');
    await page.waitForURL(`${baseUrl}/desk`);
    await page.getByRole('navigation', { name: 'Places' }).getByRole('link', { name: 'Properties' }).click();
    await page.getByRole('link', { name: 'Kettle Hollow Farm', exact: true }).click();
    await page.waitForURL(/\/properties\/\d+$/);
    await page.getByRole('link', { name: 'Cameras', exact: true }).click();
    await page.waitForURL(/\/properties\/\d+\/cameras$/);

    const table = page.getByRole('table', { name: 'Camera sites, all deployments' });
    const hollow = table.getByRole('row', { name: /Camera 2 — hollow/ });
    await poll(() => hollow.count()).toBe(1);
    // The demo: the hollow had Cam 2 for 75 nights over the summer, then Cam 1 for 14 nights up to its card pull.
    const cells = await hollow.getByRole('cell').allTextContents();
    expect(cells.slice(0, 2)).toEqual(['2', '89']);
    const deer = Number(cells[2]);
    expect(Number(cells[3])).toBeCloseTo((deer / 89) * 100, 1);

    const activity = page.getByRole('region', { name: 'Activity by hour' });
    await activity.getByLabel('Site').selectOption({ label: 'Camera 2 — hollow' });
    await activity.getByLabel('Kind').selectOption('deer');
    const chart = activity.getByRole('img', { name: /Deer events by hour at Camera 2 — hollow/ });
    await chart.waitFor(WAIT);
    // 24 hours on the axis, every third labelled (0, 3, … 21).
    await poll(() => chart.locator('.recharts-xAxis .recharts-cartesian-axis-tick').count()).toBe(8);
    await poll(() => chart.locator('.recharts-bar-rectangle path').count()).toBeGreaterThan(3);
    await chart.scrollIntoViewIfNeeded();
    await screenshot(page, 'polish-camera-sites');

    await page.getByRole('button', { name: 'Age and notes of Split brow' }).click();
    const editor = page.getByRole('form', { name: 'Edit Split brow' });
    const seasons = await editor.getByLabel('Season').count();
    await editor.getByRole('button', { name: /^Add season/ }).click();
    await poll(() => editor.getByLabel('Season').count()).toBe(seasons + 1);
    await editor.getByLabel('Age class').last().selectOption('1.5');
    await editor.getByLabel('Notes').fill('Split brow tine on the right; beds on the south point.');
    await screenshot(page, 'polish-buck-editor');
    await editor.getByRole('button', { name: 'Save buck' }).click();
    await poll(() => editor.count()).toBe(0);
    const row = page.getByRole('listitem').filter({ hasText: 'beds on the south point' });
    await poll(() => row.count()).toBe(1);
    await poll(() => row.textContent()).toMatch(/20\d\d: 1½/);
    watch.assertClean();
    await context.close();
  });
});

describe('the plan map’s side panel', () => {
  it('at 1280 × 800 the map opens wide with its tools in one row; the folded panel opens beside the map, not over it, and the choice is remembered', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 800 } });
    const page = await context.newPage();
    const watch = watchPage(page);
    await signIn(page, baseUrl, 'consultant@browseline.test');
    await page.waitForURL(`${baseUrl}/desk`);
    await page.getByRole('navigation', { name: 'Places' }).getByRole('link', { name: 'Properties' }).click();
    await page.getByRole('link', { name: 'Plan map of Kettle Hollow Farm' }).click();
    await page.waitForURL(/\/properties\/\d+\/map$/);
    await page.locator('[data-testid=plan-map] canvas.maplibregl-canvas').waitFor(WAIT);
    const panel = page.getByRole('complementary', { name: 'Map panel' });
    // First open below 1440 px: the panel is folded, the map has at least 60 % of the width and the
    // drawing tools sit in one row (one chip high), the rest behind "More" (our layout target, no source).
    expect(await panel.isVisible()).toBe(false);
    const wide = (await page.locator('[data-testid=plan-map]').boundingBox())!;
    expect(wide.width).toBeGreaterThanOrEqual(0.6 * 1280);
    const toolbar = page.getByRole('toolbar', { name: 'Drawing tools' });
    await poll(() => toolbar.getByRole('button', { name: 'More', exact: true }).count()).toBe(1);
    expect((await toolbar.boundingBox())!.height).toBeLessThan(60);
    expect(await toolbar.getByRole('button', { name: 'Food plot', exact: true }).count()).toBe(1);
    await screenshot(page, 'polish-plan-map-1280-first-open');

    // "More" is a menu button: arrow down opens it on the chosen tool or the first, Escape closes it
    // and gives the focus back; a tool picked from it is checked there.
    const more = toolbar.getByRole('button', { name: 'More', exact: true });
    await more.focus();
    await page.keyboard.press('ArrowDown');
    const menu = page.getByRole('menu', { name: 'More drawing tools' });
    await poll(() => menu.isVisible()).toBe(true);
    expect(await more.getAttribute('aria-expanded')).toBe('true');
    await poll(() => page.evaluate(() => document.activeElement?.getAttribute('role'))).toBe('menuitemradio');
    await page.keyboard.press('ArrowDown');
    await screenshot(page, 'polish-plan-map-more-menu');
    await page.keyboard.press('Escape');
    await poll(() => menu.isVisible()).toBe(false);
    expect(await more.getAttribute('aria-expanded')).toBe('false');
    expect(await page.evaluate(() => document.activeElement?.textContent?.trim())).toMatch(/^More/);
    await more.click();
    await menu.getByRole('menuitemradio', { name: 'Measure distance' }).click();
    await poll(() => menu.isVisible()).toBe(false);
    await more.click();
    expect(await menu.getByRole('menuitemradio', { name: 'Measure distance' }).getAttribute('aria-checked')).toBe('true');
    await page.keyboard.press('Escape');
    await page.keyboard.press('Escape'); // the second one stops measuring

    await page.getByRole('button', { name: 'Show map panel' }).click();
    await panel.getByRole('region', { name: 'Aerial photos' }).waitFor(WAIT);
    await panel.getByRole('region', { name: 'Observations' }).waitFor(WAIT);
    await panel.getByRole('group', { name: 'Legend' }).waitFor(WAIT);
    await screenshot(page, 'polish-plan-map-panel');
    const box = (await panel.boundingBox())!;
    const map = (await page.locator('[data-testid=plan-map]').boundingBox())!;
    expect(box.x + box.width).toBeLessThanOrEqual(map.x + 1);
    expect(map.width).toBeGreaterThan(450);
    // The choice outlives a reload in this browser.
    await page.reload();
    await panel.getByRole('group', { name: 'Legend' }).waitFor(WAIT);

    await panel.getByRole('button', { name: 'Hide map panel' }).click();
    await poll(() => panel.isVisible()).toBe(false);
    await poll(async () => (await page.locator('[data-testid=plan-map]').boundingBox())!.width).toBeGreaterThan(map.width + 200);
    // Folding hides the sections but keeps their layers on the map.
    expect(await page.evaluate(() => !!(window.__planMapStats?.map() as { getSource: (id: string) => unknown } | undefined)?.getSource('observations'))).toBe(true);
    await screenshot(page, 'polish-plan-map-folded');
    await page.getByRole('button', { name: 'Show map panel' }).click();
    await poll(() => panel.isVisible()).toBe(true);
    watch.assertClean();
    await context.close();
  });
});
