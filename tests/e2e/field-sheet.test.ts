/**
 * The crew's field sheet at a phone's size: marking a task done with a photo (seen by the
 * consultant's schedule and the landowner's progress), marking one done with no signal (sent once
 * when the phone is back online), and a completion whose answer is lost on the way back (sent again
 * with the same key, recorded once).
 */
import fs from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { request, type APIRequestContext, type Browser, type BrowserContext, type Locator, type Page } from 'playwright-core';
import { apiSignIn, launchBrowser, screenshot, signIn, watchPage } from '../support/browser';
import { withGpsExif } from '../support/exif';
import { todayIn } from '../../shared/domain/clock';
import { expectNoAxeViolations } from '../support/axe';
import { JOURNEY_PASSWORD, ownApprovedPlot } from '../support/journey-data';

const baseUrl = inject('baseUrl');
const mailUrl = inject('mailUrl');
const JPEG = fs.readFileSync(path.resolve(import.meta.dirname, '../fixtures/photos/field-plot.jpg'));
/** Waits for the page or the server to catch up (a sync, a refetch): up to 20 s, no fixed sleeps. */
const poll = <T>(fn: () => Promise<T> | T, timeout = 20_000) => expect.poll(fn, { timeout, interval: 150 });

interface ApiTask {
  id: number;
  name: string;
  unitId: number;
  unitName: string;
  status: string;
  assigneeId: number | null;
  costCents: number | null;
  photos: { id: number; url: string; latitude: number | null }[];
  hours: number | null;
  notes: string | null;
}

const apiAs = (email: string) => apiSignIn(baseUrl, email);

let browser: Browser;
let consultant: Awaited<ReturnType<typeof apiAs>>;
let club: Awaited<ReturnType<typeof apiAs>>;
let ownerEmail = '';
let propertyId = 0;
let crewId = 0;
/** Three tasks on the journey's own club plot, assigned to the demo crew member for today. */
let tasks: ApiTask[] = [];

const write = (who: { request: APIRequestContext; csrf: string }, method: 'post' | 'patch', url: string, data: unknown = {}) => who.request[method](url, { data, headers: { 'X-CSRF-Token': who.csrf } });
const taskById = async (id: number): Promise<ApiTask> => {
  const res = await consultant.request.get(`/api/tasks?propertyId=${propertyId}`);
  expect(res.status()).toBe(200);
  return ((await res.json()) as { data: { tasks: ApiTask[] } }).data.tasks.find((t) => t.id === id)!;
};
/** Today for the demo firm, which works on Central time (the server's "today" is the firm's). */
const today = () => todayIn('America/Chicago', new Date());

beforeAll(async () => {
  browser = await launchBrowser();
  consultant = await apiAs('consultant@browseline.test');
  // The journey's own client, contact, plot and approved proposal: no other journey touches them.
  const owned = await ownApprovedPlot(baseUrl, mailUrl, consultant, 'Field sheet');
  propertyId = owned.propertyId;
  club = owned.contact;
  ownerEmail = owned.contact.email;
  const team = (await (await consultant.request.get('/api/team')).json()) as { data: { id: number; email: string }[] };
  crewId = team.data.find((m) => m.email === 'crew@browseline.test')!.id;

  const list = (await (await consultant.request.get(`/api/tasks?propertyId=${propertyId}`)).json()) as { data: { tasks: ApiTask[] } };
  const open = list.data.tasks.filter((t) => t.status === 'planned' || t.status === 'scheduled');
  expect(open.length).toBeGreaterThanOrEqual(3);
  tasks = open.slice(0, 3);
  for (const t of tasks) {
    const res = await write(consultant, 'patch', `/api/tasks/${t.id}`, { assigneeId: crewId, startDate: today() });
    expect(res.status()).toBe(200);
  }
});

afterAll(async () => {
  await consultant?.request.dispose();
  await club?.request.dispose();
  await browser?.close();
});

/** A phone: 360 × 740, touch, in the demo firm's time zone (behind UTC, like the server's calendar or earlier). */
async function phone(): Promise<{ context: BrowserContext; page: Page; assertClean: () => void }> {
  // bypassCSP only lets the journey inject axe-core; the app's own CSP is unchanged.
  const context = await browser.newContext({ viewport: { width: 360, height: 740 }, isMobile: true, hasTouch: true, deviceScaleFactor: 2, timezoneId: 'America/Chicago', bypassCSP: true });
  const page = await context.newPage();
  const { errors } = watchPage(page);
  // Requests that fail while the phone is offline are the point of the second journey, not errors.
  return { context, page, assertClean: () => expect(errors.filter((e) => !/net::ERR_INTERNET_DISCONNECTED|ERR_CONNECTION_RESET|ERR_FAILED|Failed to fetch/.test(e))).toEqual([]) };
}

async function openTask(page: Page, task: ApiTask): Promise<void> {
  await page.goto(`${baseUrl}/field`);
  // By its address: another journey's plot may carry the same task and unit names.
  await page.locator(`a[href="/field/tasks/${task.id}"]`).click();
  await page.waitForURL(new RegExp(`/field/tasks/${task.id}$`));
  await poll(() => page.getByRole('heading', { level: 1 }).textContent()).toBe(task.name);
}

/** A herbicide step asks for its spray record (7 CFR Part 110 fields and weather): fill it in. */
async function fillSprayRecordIfAsked(page: Page, form: Locator): Promise<void> {
  await form.getByLabel('Done on').waitFor(); // the form is loaded lazily
  const record = form.getByRole('group', { name: 'Spray record' });
  if ((await record.count()) === 0) return;
  await record.getByLabel('Area treated (acres)').fill('0.5');
  await record.getByLabel('Wind (mph)').fill('4');
  await record.getByLabel('Wind from').selectOption('SW');
  await record.getByLabel('Air temp (°F)').fill('72');
  await record.getByLabel('Applicator’s name').fill('Sam Crew');
  await record.scrollIntoViewIfNeeded();
  await screenshot(page, 'field-spray-record-360');
}

/** No horizontal scrolling at the phone's width. */
const fitsWidth = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth <= window.innerWidth + 1);

describe('the crew’s field sheet on a phone', () => {
  it('the crew member opens the field sheet, marks a task done with a photo; the schedule and the landowner’s progress show it', async () => {
    const { context, page, assertClean } = await phone();
    await signIn(page, baseUrl, 'crew@browseline.test');
    await page.waitForURL(`${baseUrl}/field`);
    await poll(() => page.getByRole('link', { name: new RegExp(tasks[0].unitName) }).count()).toBeGreaterThanOrEqual(3);
    expect(await page.getByText('$').count()).toBe(0); // crew never see prices
    expect(await fitsWidth(page)).toBe(true);
    await screenshot(page, 'field-home-360');
    await expectNoAxeViolations(page, 'the field sheet');

    const task = tasks[0];
    await openTask(page, task);
    const maps = page.getByRole('link', { name: /Open in maps/ });
    // RFC 5870: geo:<latitude>,<longitude>; the journey's plot lies near 43.55° N, 90.88° W (demo data).
    expect(await maps.getAttribute('href')).toMatch(/^geo:43\.5\d*,-90\.8\d*/);
    await expect.poll(() => page.getByRole('img', { name: /Map of Club plot/ }).count()).toBe(1);
    expect(await page.getByText('$').count()).toBe(0);
    await screenshot(page, 'field-task-360');
    await expectNoAxeViolations(page, 'a field sheet task');

    await page.getByRole('button', { name: 'Mark done' }).click();
    const form = page.getByRole('form', { name: 'Mark done' });
    await fillSprayRecordIfAsked(page, form);
    await form.getByLabel('Hours worked').fill('2.5');
    await form.getByLabel('Notes').fill('Broadcast before the rain; good seed-to-soil contact.');
    // A photo taken in the plot (its GPS position is read back and drawn on the unit map).
    await form.getByLabel('Photos').setInputFiles({ name: 'club-plot.jpg', mimeType: 'image/jpeg', buffer: withGpsExif(JPEG, 43.5494, -90.8785) });
    await poll(() => form.getByRole('img', { name: /Photo 1: club-plot\.jpg/ }).count()).toBe(1);
    expect(await fitsWidth(page)).toBe(true);
    await screenshot(page, 'field-mark-done-360');
    await form.getByRole('button', { name: /Save/ }).click();

    await poll(() => page.getByRole('heading', { name: 'Done', exact: true }).count()).toBe(1);
    await poll(() => page.getByRole('img', { name: new RegExp(`Photo 1 of ${task.name}`) }).count()).toBe(1);
    // The photo's position is a dot on the unit map.
    await poll(() => page.locator('[data-photo-dot]').count()).toBe(1);
    await poll(() => page.getByRole('img', { name: new RegExp(`Photo 1 of ${task.name}`) }).evaluate((img) => (img as HTMLImageElement).naturalWidth)).toBeGreaterThan(0);
    expect(await fitsWidth(page)).toBe(true);
    await screenshot(page, 'field-task-done-360');

    // The consultant's schedule (GET /api/tasks) has it done, with the one photo, the hours and notes.
    const done = await taskById(task.id);
    expect(done).toMatchObject({ status: 'done', hours: 2.5, notes: 'Broadcast before the rain; good seed-to-soil contact.' });
    expect(done.photos).toHaveLength(1);
    expect(done.photos[0].latitude).toBeCloseTo(43.5494, 4);

    // The landowner's progress shows the plot under way (or finished), and they may see the crew's photo.
    const progress = await club.request.get(`/api/properties/${propertyId}/progress`);
    expect(progress.status()).toBe(200);
    const body = (await progress.json()) as { data: { plan: { done: number }; units: { unitId: number; status: string; percentByCount: number }[] } };
    const unit = body.data.units.find((u) => u.unitId === task.unitId)!;
    expect(['in-progress', 'done']).toContain(unit.status);
    expect(unit.percentByCount).toBeGreaterThan(0);
    expect(body.data.plan.done).toBeGreaterThanOrEqual(1);
    expect((await club.request.get(done.photos[0].url)).status()).toBe(200);

    // Back on the field sheet the task has left the open lists for "Finished".
    await page.getByRole('link', { name: '← Field sheet' }).click();
    await poll(() => page.getByText(/Finished \(\d+\)/).count()).toBe(1);
    assertClean();
    await context.close();

    // The consultant's schedule page: the task opens done, by the crew member, with the photo.
    const desk = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const staff = await desk.newPage();
    await signIn(staff, baseUrl, 'consultant@browseline.test');
    await staff.waitForURL(`${baseUrl}/desk`);
    await staff.goto(`${baseUrl}/schedule?property=${propertyId}&task=${task.id}`);
    const panel = staff.getByRole('dialog', { name: task.name });
    await poll(() => panel.getByRole('heading', { name: /^Done / }).count()).toBe(1);
    await poll(() => panel.getByRole('img', { name: new RegExp(`Photo 1 of ${task.name}`) }).evaluate((img) => (img as HTMLImageElement).naturalWidth)).toBeGreaterThan(0);
    await screenshot(staff, 'field-done-on-schedule');
    await desk.close();

    // The landowner's progress page in the portal, on a phone: the crew's photo of this task.
    const landowner = await browser.newContext({ viewport: { width: 360, height: 740 }, isMobile: true, hasTouch: true });
    const owner = await landowner.newPage();
    await signIn(owner, baseUrl, ownerEmail, JOURNEY_PASSWORD);
    await owner.waitForURL(`${baseUrl}/portal`);
    await owner.goto(`${baseUrl}/portal/properties/${propertyId}/progress`);
    await poll(() => owner.getByRole('heading', { name: 'Progress', level: 1 }).count()).toBe(1);
    const crewPhoto = owner.getByRole('img', { name: new RegExp(`Crew photo: ${task.name}`) }).first();
    await poll(() => crewPhoto.evaluate((img) => (img as HTMLImageElement).naturalWidth).catch(() => 0)).toBeGreaterThan(0);
    await screenshot(owner, 'field-done-on-portal-progress');
    await landowner.close();
  });

  it('marks a task done with no signal: it waits on the phone, then lands exactly once when the phone is back online', async () => {
    const { context, page, assertClean } = await phone();
    await signIn(page, baseUrl, 'crew@browseline.test');
    await page.waitForURL(`${baseUrl}/field`);
    const task = tasks[1];
    await openTask(page, task);
    // The signal goes as soon as the task shows: on a fresh phone the service worker may not hold the forms yet,
    // and the page must have them already (field-task.tsx fetches them before it shows).
    await context.setOffline(true);
    await page.getByRole('button', { name: 'Mark done' }).click();
    const form = page.getByRole('form', { name: 'Mark done' });
    await fillSprayRecordIfAsked(page, form);
    await form.getByLabel('Notes').fill('No signal in the bottom; saved on the phone.');
    await form.getByLabel('Photos').setInputFiles({ name: 'offline.jpg', mimeType: 'image/jpeg', buffer: JPEG });
    await form.getByRole('button', { name: /Save/ }).click();
    await poll(() => page.getByText('Saved on this phone — will send when you’re back online.').first().isVisible()).toBe(true);
    await poll(() => page.getByText('Done (waiting to send)').count()).toBeGreaterThanOrEqual(1);
    expect(await fitsWidth(page)).toBe(true);
    await screenshot(page, 'field-offline-task-360');

    // The field sheet (reached inside the app, no reload) shows the pending count and the card as waiting.
    await page.getByRole('link', { name: '← Field sheet' }).click();
    await poll(() => page.getByTestId('pending-count').textContent()).toBe('1');
    const card = page.getByRole('link', { name: new RegExp(`^${task.name.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}`) });
    await poll(() => card.getByText('Done (waiting to send)').count()).toBe(1);
    expect(await fitsWidth(page)).toBe(true);
    await screenshot(page, 'field-offline-home-360');
    expect((await taskById(task.id)).status).not.toBe('done'); // nothing reached the server

    await context.setOffline(false);
    await poll(() => page.getByTestId('pending-completions').count()).toBe(0);
    await poll(async () => (await taskById(task.id)).status).toBe('done');
    const landed = await taskById(task.id);
    expect(landed.photos).toHaveLength(1);
    expect(landed.notes).toBe('No signal in the bottom; saved on the phone.');

    // Another "online" (a flaky link flapping) sends nothing more: the queue on the phone is empty.
    await page.evaluate(() => window.dispatchEvent(new Event('online')));
    await poll(() =>
      page.evaluate(
        () =>
          new Promise<number>((resolve, reject) => {
            const open = indexedDB.open('browseline-field');
            open.onerror = () => reject(open.error);
            open.onsuccess = () => {
              const count = open.result.transaction('completions').objectStore('completions').count();
              count.onsuccess = () => resolve(count.result);
            };
          }),
      ),
    ).toBe(0);
    expect((await taskById(task.id)).photos).toHaveLength(1);
    await screenshot(page, 'field-back-online-360');
    assertClean();
    await context.close();
  });

  it('says so when the Mark done form has not reached the phone and there is no signal, then opens it once it can', async () => {
    // A fresh phone: no service worker yet, and the form's code cannot be fetched (no signal when it was asked for).
    const context = await browser.newContext({ viewport: { width: 360, height: 740 }, isMobile: true, hasTouch: true, timezoneId: 'America/Chicago', serviceWorkers: 'block' });
    const page = await context.newPage();
    const { errors } = watchPage(page);
    const blocked = /\/assets\/complete-form-[^/]+\.js$/;
    await context.route(blocked, (route) => route.abort('internetdisconnected'));
    await signIn(page, baseUrl, 'crew@browseline.test');
    await page.waitForURL(`${baseUrl}/field`);
    const task = tasks[2]; // opened only: the next journey marks it done
    await openTask(page, task);
    await page.getByRole('button', { name: 'Mark done' }).click();
    const notice = page.getByRole('alert').filter({ hasText: 'The Mark done form has not reached this phone yet' });
    await poll(() => notice.count()).toBe(1);
    expect(await page.getByRole('heading', { level: 1 }).textContent()).toBe(task.name); // the page stays, no crash
    await screenshot(page, 'field-form-not-loaded-360');

    // The signal is back: a tap on "Try again" opens the form.
    await context.unroute(blocked);
    await notice.getByRole('button', { name: 'Try again' }).click();
    await poll(() => page.getByRole('form', { name: 'Mark done' }).getByLabel('Done on').count()).toBe(1);
    expect(errors.filter((e) => !/net::ERR_INTERNET_DISCONNECTED|ERR_FAILED|Failed to fetch|dynamically imported module/.test(e))).toEqual([]);
    await context.close();
  });

  it('sends a completion again with the same key when the server’s answer is lost, and it is recorded once', async () => {
    const { context, page, assertClean } = await phone();
    await signIn(page, baseUrl, 'crew@browseline.test');
    await page.waitForURL(`${baseUrl}/field`);
    const task = tasks[2];
    await openTask(page, task);

    // The first send reaches the server, but the answer never gets back to the phone.
    const keys: string[] = [];
    let lost = 0;
    let firstStatus = 0;
    await page.route(`**/api/tasks/${task.id}/complete`, async (route) => {
      keys.push(route.request().headers()['idempotency-key'] ?? '');
      if (lost === 0) {
        lost += 1;
        firstStatus = (await route.fetch()).status();
        await route.abort('connectionreset');
        return;
      }
      await route.continue();
    });
    await page.getByRole('button', { name: 'Mark done' }).click();
    const form = page.getByRole('form', { name: 'Mark done' });
    await fillSprayRecordIfAsked(page, form);
    await form.getByLabel('Photos').setInputFiles({ name: 'lost-answer.jpg', mimeType: 'image/jpeg', buffer: JPEG });
    await form.getByRole('button', { name: /Save/ }).click();
    await poll(() => firstStatus).toBe(201);
    await poll(() => page.getByText('Sending now; it stays on this phone until Browseline has it.').count()).toBe(1);
    expect((await taskById(task.id)).status).toBe('done'); // the server has it; the phone does not know yet
    await page.getByRole('link', { name: '← Field sheet' }).click();
    await poll(() => page.getByTestId('pending-count').textContent()).toBe('1');
    await screenshot(page, 'field-answer-lost-360');
    // "Send now" (the runner's timer may beat the tap to it; either way the same key goes again).
    await page.getByRole('button', { name: 'Send now' }).click({ timeout: 3000 }).catch(() => undefined);
    await poll(() => page.getByTestId('pending-completions').count()).toBe(0);
    expect(keys).toHaveLength(2);
    expect(keys[1]).toBe(keys[0]);
    expect(keys[0]).toMatch(/^done-[0-9a-f-]{36}$/);
    expect((await taskById(task.id)).photos).toHaveLength(1);
    await poll(() => page.getByText(/Finished \(\d+\)/).count()).toBe(1);
    assertClean();
    await context.close();
  });

  it('makes a private calendar feed, shows its address once with a webcal:// twin, and revokes it', async () => {
    const { context, page, assertClean } = await phone();
    await signIn(page, baseUrl, 'crew@browseline.test');
    await page.waitForURL(`${baseUrl}/field`);
    await page.getByRole('button', { name: 'Make a calendar feed' }).click();
    const fresh = page.getByTestId('new-feed');
    await poll(() => fresh.getByLabel('Feed address').inputValue()).toMatch(/\/api\/calendar\/[A-Za-z0-9_-]+\.ics$/);
    const url = await fresh.getByLabel('Feed address').inputValue();
    expect(await fresh.getByLabel('For calendar apps (webcal)').inputValue()).toBe(url.replace(/^https?:\/\//, 'webcal://'));
    // RFC 5545: the feed is an iCalendar object, and the crew member's tasks are in it.
    const anon = await request.newContext();
    const feed = await anon.get(url);
    expect(feed.status()).toBe(200);
    expect(await feed.text()).toMatch(/^BEGIN:VCALENDAR\r\n/);
    await screenshot(page, 'field-calendar-360');
    await page.getByRole('button', { name: /^Revoke the feed/ }).first().click();
    await poll(async () => (await anon.get(url)).status()).toBe(404);
    await anon.dispose();
    assertClean();
    await context.close();
  });
});
