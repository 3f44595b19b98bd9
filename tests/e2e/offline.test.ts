/**
 * Installable and offline, on a phone: the field sheet is loaded once, the phone loses its signal,
 * the page is reloaded (the service worker serves the app, the persisted query cache the last tasks),
 * a task is opened and marked done; back online, the completion is sent exactly once. Also: the web
 * app manifest and icons, no /api answer in the service worker's caches, and sign-out clears the
 * persisted cache.
 */
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { APIRequestContext, Browser, Page } from 'playwright-core';
import { apiSignIn, launchBrowser, screenshot, signIn, watchPage } from '../support/browser';
import { ownApprovedPlot } from '../support/journey-data';

const baseUrl = inject('baseUrl');
const mailUrl = inject('mailUrl');
/** Waits for the page or the server to catch up (a sync, a service worker install): up to 30 s, no fixed sleeps. */
const poll = <T>(fn: () => Promise<T> | T, timeout = 30_000) => expect.poll(fn, { timeout, interval: 150 });

interface ApiTask {
  id: number;
  name: string;
  unitName: string;
  status: string;
  notes: string | null;
}

let browser: Browser;
let consultant: { request: APIRequestContext; csrf: string };
let propertyId = 0;
let task: ApiTask;

const write = (method: 'post' | 'patch', url: string, data: unknown = {}) => consultant.request[method](url, { data, headers: { 'X-CSRF-Token': consultant.csrf } });
const taskById = async (id: number): Promise<ApiTask> => {
  const res = await consultant.request.get(`/api/tasks?propertyId=${propertyId}`);
  return ((await res.json()) as { data: { tasks: ApiTask[] } }).data.tasks.find((t) => t.id === id)!;
};

beforeAll(async () => {
  browser = await launchBrowser();
  consultant = await apiSignIn(baseUrl, 'consultant@browseline.test');
  // The journey's own client, contact, plot and approved proposal: no other journey touches them.
  const owned = await ownApprovedPlot(baseUrl, mailUrl, consultant, 'Offline');
  propertyId = owned.propertyId;
  const team = (await (await consultant.request.get('/api/team')).json()) as { data: { id: number; email: string }[] };
  const crewId = team.data.find((m) => m.email === 'crew@browseline.test')!.id;
  const list = (await (await consultant.request.get(`/api/tasks?propertyId=${propertyId}`)).json()) as { data: { tasks: ApiTask[] } };
  await owned.contact.request.dispose();
  // The last open task of the plot.
  const open = list.data.tasks.filter((t) => t.status === 'planned' || t.status === 'scheduled');
  task = open[open.length - 1];
  expect(task).toBeDefined();
  const res = await write('patch', `/api/tasks/${task.id}`, { assigneeId: crewId, startDate: new Date().toISOString().slice(0, 10) });
  expect(res.status()).toBe(200);
});

afterAll(async () => {
  await consultant?.request.dispose();
  await browser?.close();
});

/** The persisted query cache in IndexedDB (lib/persisted-cache.ts), as text, or null. */
const persistedCache = (page: Page) =>
  page.evaluate(
    () =>
      new Promise<string | null>((resolve) => {
        const open = indexedDB.open('browseline-cache');
        open.onerror = () => resolve(null);
        open.onupgradeneeded = () => undefined;
        open.onsuccess = () => {
          const db = open.result;
          if (!db.objectStoreNames.contains('queries')) return resolve(null);
          const get = db.transaction('queries').objectStore('queries').get('query-cache');
          get.onsuccess = () => resolve((get.result as string | undefined) ?? null);
          get.onerror = () => resolve(null);
        };
      }),
  );

describe('the app on a phone with no signal', () => {
  it('is installable: a manifest with our icons, a service worker, and no source maps in production', async () => {
    const res = await fetch(`${baseUrl}/manifest.webmanifest`);
    expect(res.status).toBe(200);
    const manifest = (await res.json()) as { name: string; display: string; icons: { src: string; sizes: string; purpose?: string }[] };
    expect(manifest).toMatchObject({ name: 'Browseline', display: 'standalone' });
    // Installability (W3C Web App Manifest; Chromium's install criteria): icons of 192 and 512 px.
    expect(manifest.icons.map((i) => i.sizes)).toEqual(expect.arrayContaining(['192x192', '512x512']));
    for (const icon of manifest.icons) expect((await fetch(`${baseUrl}${icon.src}`)).status).toBe(200);
    const sw = await fetch(`${baseUrl}/sw.js`);
    expect(sw.status).toBe(200);
    expect(sw.headers.get('cache-control')).toBe('no-cache');
    const html = await (await fetch(`${baseUrl}/field`)).text();
    const script = /src="(\/assets\/app-[^"]+\.js)"/.exec(html)![1];
    expect((await fetch(`${baseUrl}${script}.map`)).status).toBe(404);
    expect((await fetch(`${baseUrl}/assets/no-such-chunk.js`)).status).toBe(404);
  });

  it('loads the field sheet, goes offline, reloads, opens a task and marks it done; online again, it is sent once', async () => {
    const context = await browser.newContext({ viewport: { width: 360, height: 740 }, isMobile: true, hasTouch: true, deviceScaleFactor: 2, timezoneId: 'America/Chicago' });
    const page = await context.newPage();
    const { errors } = watchPage(page);
    const completions: number[] = [];
    page.on('response', (r) => {
      if (r.request().method() === 'POST' && /\/api\/tasks\/\d+\/complete$/.test(r.url())) completions.push(r.status());
    });

    await signIn(page, baseUrl, 'crew@browseline.test');
    await page.waitForURL(`${baseUrl}/field`);
    const card = page.getByRole('link', { name: new RegExp(`^${task.name.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}.*${task.unitName}`) });
    await poll(() => card.count()).toBe(1);
    // The service worker has installed the app shell, and the tasks are kept on the phone.
    await poll(() => page.evaluate(async () => Boolean((await navigator.serviceWorker.ready).active))).toBe(true);
    await poll(async () => (await persistedCache(page))?.includes(task.name) ?? false).toBe(true);

    await context.setOffline(true);
    await page.reload();
    await poll(() => card.count()).toBe(1);
    await poll(() => page.getByRole('status').filter({ hasText: 'No signal.' }).count()).toBeGreaterThanOrEqual(1);
    expect(await page.getByText(/Showing what you saw (just now|\d+ minutes? ago)/).count()).toBeGreaterThanOrEqual(1);
    await screenshot(page, 'offline-field-sheet-360');

    await card.click();
    await page.waitForURL(new RegExp(`/field/tasks/${task.id}$`));
    await poll(() => page.getByRole('heading', { level: 1 }).textContent()).toBe(task.name);
    await poll(() => page.getByRole('img', { name: new RegExp(`Map of ${task.unitName}`) }).count()).toBe(1);
    await page.getByRole('button', { name: 'Mark done' }).click();
    const form = page.getByRole('form', { name: 'Mark done' });
    await form.getByLabel('Notes').fill('Reloaded with no signal; saved on the phone.');
    await form.getByRole('button', { name: /Save/ }).click();
    await poll(() => page.getByText('Saved on this phone — will send when you’re back online.').first().isVisible()).toBe(true);
    await screenshot(page, 'offline-task-done-360');
    expect((await taskById(task.id)).status).not.toBe('done');

    await context.setOffline(false);
    await poll(async () => (await taskById(task.id)).status).toBe('done');
    await poll(() => page.getByTestId('pending-completions').count()).toBe(0);
    expect((await taskById(task.id)).notes).toBe('Reloaded with no signal; saved on the phone.');
    expect(completions.filter((s) => s >= 200 && s < 300)).toEqual([201]);

    // The service worker never keeps an /api answer.
    const apiCached = await page.evaluate(async () => {
      const found: string[] = [];
      for (const name of await caches.keys()) for (const req of await (await caches.open(name)).keys()) if (new URL(req.url).pathname.startsWith('/api')) found.push(req.url);
      return found;
    });
    expect(apiCached).toEqual([]);

    // Signing out forgets what this person saw.
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL(/\/login/);
    await page.getByRole('button', { name: 'Sign in' }).waitFor();
    await page.waitForLoadState('load');
    expect(await persistedCache(page)).toBeNull();
    // Nor the copy kept in localStorage as a page is left (lib/persisted-cache.ts).
    expect(await page.evaluate(() => localStorage.getItem('browseline-cache-unload'))).toBeNull();
    expect(errors.filter((e) => !/net::ERR_INTERNET_DISCONNECTED|ERR_CONNECTION_RESET|ERR_FAILED|Failed to fetch/.test(e))).toEqual([]);
    await context.close();
  });

  it('gives an iPhone directions that open Apple Maps, and the coordinates to copy', async () => {
    const iphone = 'Mozilla/5.0 (iPhone; CPU iPhone OS 17_5 like Mac OS X) AppleWebKit/605.1.15 (KHTML, like Gecko) Version/17.5 Mobile/15E148 Safari/604.1';
    const context = await browser.newContext({ viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true, userAgent: iphone, permissions: ['clipboard-read', 'clipboard-write'] });
    const page = await context.newPage();
    await signIn(page, baseUrl, 'crew@browseline.test');
    await page.waitForURL(`${baseUrl}/field`);
    await page.goto(`${baseUrl}/field/tasks/${task.id}`);
    const maps = page.getByRole('link', { name: /Open in maps/ });
    // Apple's Map Links: daddr is the destination; the journey's plot lies near 43.55° N, 90.88° W (demo data).
    await poll(() => maps.getAttribute('href')).toMatch(/^https:\/\/maps\.apple\.com\/\?daddr=43\.5\d*,-90\.8\d*&dirflg=d/);
    await page.getByRole('button', { name: 'Copy coordinates' }).click();
    await poll(() => page.getByText(/^Copied 43\.5\d{4}, -90\.8\d{4}$/).count()).toBe(1);
    expect(await page.evaluate(() => navigator.clipboard.readText())).toMatch(/^43\.5\d{4}, -90\.8\d{4}$/);
    await screenshot(page, 'field-task-iphone-directions');
    await context.close();
  });
});
