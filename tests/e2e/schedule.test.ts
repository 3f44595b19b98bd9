import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import fs from 'node:fs';
import path from 'node:path';
import crypto from 'node:crypto';
import type { APIRequestContext, Browser, BrowserContext } from 'playwright-core';
import { DEMO_PASSWORD, launchBrowser, screenshot, signIn, watchPage } from '../support/browser';
import { withGpsExif } from '../support/exif';
import { todayIn } from '../../shared/domain/clock';
import { expectNoAxeViolations } from '../support/axe';
import { ownApprovedPlot } from '../support/journey-data';

const baseUrl = inject('baseUrl');
const mailUrl = inject('mailUrl');
const WAIT = { timeout: 15_000 };
const JPEG = fs.readFileSync(path.resolve(import.meta.dirname, '../fixtures/photos/field-plot.jpg'));
let browser: Browser;

interface Task {
  id: number;
  name: string;
  unitId: number;
  unitName: string;
  status: string;
  earliest: string;
  latest: string;
  startDate: string | null;
  assigneeId: number | null;
}

/** A signed-in API session (the browser context's cookies) and its CSRF token. */
async function apiSession(email: string): Promise<{ context: BrowserContext; request: APIRequestContext; csrf: string }> {
  const context = await browser.newContext();
  const request = context.request;
  const login = await request.post(`${baseUrl}/api/auth/login`, { data: { email, password: DEMO_PASSWORD } });
  expect(login.status()).toBe(200);
  const csrf = ((await (await request.get(`${baseUrl}/api/auth/csrf`)).json()) as { csrfToken: string }).csrfToken;
  return { context, request, csrf };
}

async function json<T>(res: Awaited<ReturnType<APIRequestContext['get']>>, status = 200): Promise<T> {
  if (res.status() !== status) throw new Error(`${res.url()} answered ${res.status()}: ${await res.text()}`);
  return ((await res.json()) as { data: T }).data;
}

/** "Monday, Jun 8" as the week list writes a day (UTC, like the server's dates). */
const dayHeading = (date: string) => `${new Date(`${date}T00:00:00Z`).toLocaleDateString('en-US', { weekday: 'long', timeZone: 'UTC' })}, ${new Date(`${date}T00:00:00Z`).toLocaleDateString('en-US', { month: 'short', day: 'numeric', timeZone: 'UTC' })}`;
const addDays = (date: string, n: number) => new Date(Date.parse(`${date}T00:00:00Z`) + n * 86_400_000).toISOString().slice(0, 10);

let propertyId = 0;
let propertyName = '';
let crewId = 0;
let task: Task;
let second: Task;
let openTasks: Task[] = [];
let consultantApi: Awaited<ReturnType<typeof apiSession>>;

beforeAll(async () => {
  browser = await launchBrowser();
  consultantApi = await apiSession('consultant@browseline.test');
  const { request } = consultantApi;
  // The journey's own client, contact, plot and approved proposal (through the API, as a person
  // would): no other journey touches them, so the plot's tasks are all planned and unassigned here.
  const owned = await ownApprovedPlot(baseUrl, mailUrl, consultantApi, 'Schedule');
  await owned.contact.request.dispose();
  propertyId = owned.propertyId;
  propertyName = owned.propertyName;
  const team = await json<{ id: number; email: string }[]>(await request.get(`${baseUrl}/api/team`));
  crewId = team.find((m) => m.email === 'crew@browseline.test')!.id;

  const tasks = (await json<{ tasks: Task[] }>(await request.get(`${baseUrl}/api/tasks?propertyId=${propertyId}`))).tasks;
  const open = tasks.filter((t) => t.status === 'planned' && t.assigneeId === null && t.unitName === 'Club plot').sort((a, b) => a.earliest.localeCompare(b.earliest));
  expect(open.length).toBeGreaterThan(1);
  task = open[0];
  second = open[1];
  openTasks = open;
});

afterAll(async () => {
  await consultantApi?.context.close();
  await browser?.close();
});

describe('the consultant’s schedule', () => {
  it('assigns an unassigned task on the timeline by crew member; the week list shows it on its day', async () => {
    const context = await browser.newContext({ viewport: { width: 1366, height: 900 } });
    const page = await context.newPage();
    const watch = watchPage(page);
    await signIn(page, baseUrl, 'consultant@browseline.test');
    await page.waitForURL(`${baseUrl}/desk`);
    await page.getByRole('navigation', { name: 'Places' }).getByRole('link', { name: 'Schedule' }).click();
    await page.waitForURL(`${baseUrl}/schedule`);
    await page.getByRole('heading', { name: 'Schedule', level: 1 }).waitFor();
    // This week of the whole firm (the demo's Kettle Hollow Farm work is on it) before any filter.
    await page.locator('[data-task-id]').first().waitFor(WAIT);
    await screenshot(page, 'schedule-this-week');

    // Filters live in the address: property, then the timeline by crew member over the task's weeks.
    await page.getByLabel('Property', { exact: true }).selectOption({ label: propertyName });
    await expect.poll(() => new URL(page.url()).searchParams.get('property')).toBe(String(propertyId));
    await page.getByRole('group', { name: 'View' }).getByRole('button', { name: 'Timeline' }).click();
    await page.getByRole('group', { name: 'Rows' }).getByRole('button', { name: 'By crew member' }).click();
    await page.getByLabel('From', { exact: true }).fill(task.earliest);
    await page.getByLabel('To', { exact: true }).fill(addDays(task.earliest, 7 * 11));
    await expect.poll(() => new URL(page.url()).searchParams.get('by')).toBe('crew');

    const unassigned = page.getByRole('group', { name: 'Unassigned' });
    await unassigned.locator(`[data-task-id="${task.id}"]`).waitFor(WAIT);
    await screenshot(page, 'schedule-timeline-by-crew');
    await unassigned.locator(`[data-task-id="${task.id}"]`).click();

    // The panel: assign the demo crew member (Rosa Quintero, crew@) and a day inside the window.
    const panel = page.getByRole('dialog', { name: task.name });
    await panel.waitFor();
    const day = addDays(task.earliest, 2) <= task.latest ? addDays(task.earliest, 2) : task.earliest;
    await panel.getByLabel('Crew member', { exact: true }).selectOption({ label: 'Rosa Quintero' });
    await panel.getByLabel('Start date', { exact: true }).fill(day);
    // A bad edit first: the end before the start is refused with a sentence, and nothing is saved.
    await panel.getByLabel('End date', { exact: true }).fill(addDays(day, -1));
    await panel.getByRole('button', { name: 'Save' }).click();
    await expect.poll(() => panel.getByText('the end date must not come before the start date').count()).toBeGreaterThan(0);
    await panel.getByLabel('End date', { exact: true }).fill('');
    await panel.getByRole('button', { name: 'Save' }).click();
    await expect.poll(() => panel.locator('[data-status]').first().getAttribute('data-status'), WAIT).toBe('scheduled');
    await screenshot(page, 'schedule-task-panel-scheduled');

    const saved = await json<Task>(await consultantApi.request.get(`${baseUrl}/api/tasks/${task.id}`));
    expect(saved).toMatchObject({ status: 'scheduled', assigneeId: crewId, startDate: day });

    // On the timeline the task moved to the crew member's row.
    await panel.getByRole('button', { name: 'Close the task panel' }).click();
    await page.getByRole('group', { name: 'Rosa Quintero' }).locator(`[data-task-id="${task.id}"]`).waitFor(WAIT);
    expect(await unassigned.locator(`[data-task-id="${task.id}"]`).count()).toBe(0);

    // "Show its week" opens the week list on that week; the task sits under its day.
    await page.getByRole('group', { name: 'Rosa Quintero' }).locator(`[data-task-id="${task.id}"]`).click();
    await page.getByRole('dialog', { name: task.name }).getByRole('button', { name: 'Show its week' }).click();
    const daySection = page.getByRole('region', { name: new RegExp(`^${dayHeading(day)}`) });
    await daySection.locator(`[data-task-id="${task.id}"]`).waitFor(WAIT);
    expect(await daySection.locator(`[data-task-id="${task.id}"]`).textContent()).toContain('Rosa Quintero');
    await screenshot(page, 'schedule-week-list');
    watch.assertClean();
    await context.close();
  });

  it('saves a crew member and a note on the first Save; after a reload the panel shows both', async () => {
    const context = await browser.newContext({ viewport: { width: 1366, height: 900 } });
    const page = await context.newPage();
    const watch = watchPage(page);
    await signIn(page, baseUrl, 'consultant@browseline.test');
    await page.waitForURL(`${baseUrl}/desk`);
    await page.goto(`${baseUrl}/schedule?property=${propertyId}&view=timeline&from=${second.earliest}&to=${addDays(second.earliest, 77)}`);
    await page.locator(`[data-task-id="${second.id}"]`).click(WAIT);
    const panel = page.getByRole('dialog', { name: second.name });
    await panel.getByLabel('Crew member', { exact: true }).selectOption({ label: 'Rosa Quintero' });
    const note = 'The gate is chained; the key hangs in the shed.';
    await panel.getByLabel('Notes for the crew', { exact: true }).fill(note);
    await panel.getByRole('button', { name: 'Save' }).click();
    // One press: saved, no "Nothing changed".
    await expect.poll(async () => (await json<Task & { notes: string | null }>(await consultantApi.request.get(`${baseUrl}/api/tasks/${second.id}`))).notes, WAIT).toBe(note);
    expect(await panel.getByText(/Nothing changed/).count()).toBe(0);
    expect((await json<Task>(await consultantApi.request.get(`${baseUrl}/api/tasks/${second.id}`))).assigneeId).toBe(crewId);

    // A reload opens the same panel (the task is in the address); the picker and the note show what was saved.
    await page.reload();
    const again = page.getByRole('dialog', { name: second.name });
    await again.getByLabel('Notes for the crew', { exact: true }).waitFor(WAIT);
    await expect.poll(() => again.getByLabel('Crew member', { exact: true }).evaluate((el) => (el as HTMLSelectElement).selectedOptions[0]?.textContent), WAIT).toBe('Rosa Quintero');
    // The kept copy may paint first; the server's answer fills the form when it arrives: wait for it.
    await expect.poll(() => again.getByLabel('Notes for the crew', { exact: true }).inputValue(), WAIT).toBe(note);
    await screenshot(page, 'schedule-panel-after-reload');
    // Unassign it again so the later steps find the task as the seed left it.
    await again.getByLabel('Crew member', { exact: true }).selectOption({ label: 'Unassigned' });
    await again.getByRole('button', { name: 'Save' }).click();
    await expect.poll(async () => (await json<Task>(await consultantApi.request.get(`${baseUrl}/api/tasks/${second.id}`))).assigneeId, WAIT).toBe(null);
    watch.assertClean();
    await context.close();
  });

  it('shows a crew completion with its photo, and the plan map in work-status colours', async () => {
    // The crew member marks the task done from the field (multipart, with an idempotency key).
    const crew = await apiSession('crew@browseline.test');
    const doneOn = todayIn('America/Chicago', new Date()); // the demo firm's today
    const photo = withGpsExif(JPEG, 43.5494, -90.8785); // inside the journey's Club plot
    const res = await crew.request.post(`${baseUrl}/api/tasks/${task.id}/complete`, {
      headers: { 'X-CSRF-Token': crew.csrf, 'Idempotency-Key': `e2e-${crypto.randomUUID()}` },
      multipart: { doneOn, notes: 'Disked and seeded; soil was mellow.', hours: '3.5', photos: { name: 'club-plot.jpg', mimeType: 'image/jpeg', buffer: photo } },
    });
    expect(res.status()).toBe(201);
    await crew.context.close();

    const context = await browser.newContext({ viewport: { width: 1366, height: 900 } });
    const page = await context.newPage();
    const watch = watchPage(page);
    await signIn(page, baseUrl, 'consultant@browseline.test');
    await page.waitForURL(`${baseUrl}/desk`);
    await page.goto(`${baseUrl}/schedule?property=${propertyId}&view=timeline&by=crew&from=${task.earliest}&to=${addDays(task.earliest, 77)}`);
    const bar = page.getByRole('group', { name: 'Rosa Quintero' }).locator(`[data-task-id="${task.id}"]`);
    await bar.waitFor(WAIT);
    await expect.poll(() => bar.getAttribute('aria-label')).toMatch(/, done$/);
    await bar.click();
    const panel = page.getByRole('dialog', { name: task.name });
    await expect.poll(() => panel.getByRole('heading', { name: /^Done .* by Rosa Quintero$/ }).count(), WAIT).toBe(1);
    const thumb = panel.getByRole('img', { name: `Photo 1 of ${task.name} on Club plot` });
    await thumb.waitFor();
    await expect.poll(() => thumb.evaluate((img) => (img as HTMLImageElement).complete && (img as HTMLImageElement).naturalWidth > 0), WAIT).toBe(true);
    // The EXIF position read from the photo.
    expect(await panel.getByText(/at 43\.549\d\d, -90\.878\d\d/).count()).toBe(1);
    expect(await panel.getByRole('button', { name: 'Reopen task' }).count()).toBe(1);
    await screenshot(page, 'schedule-task-done-with-photo');
    await panel.getByRole('button', { name: 'Close the task panel' }).click();

    // The property page's progress card counts it.
    await page.goto(`${baseUrl}/properties/${propertyId}`);
    const progress = page.getByRole('region', { name: 'Progress' }).or(page.locator('section', { has: page.getByRole('heading', { name: 'Progress', exact: true }) }));
    await expect.poll(() => progress.locator('[data-unit-status]').first().getAttribute('data-unit-status'), WAIT).toBe('in-progress');
    await screenshot(page, 'property-progress');

    // Plan map, coloured by work status: the ledger's legend and the unit's row say "Under way".
    await page.goto(`${baseUrl}/properties/${propertyId}/map`);
    await page.locator('[data-testid=plan-map] canvas.maplibregl-canvas').waitFor(WAIT);
    const ledger = page.getByRole('complementary', { name: 'Plan ledger' });
    await ledger.getByRole('heading', { name: /^Units/ }).waitFor(WAIT);
    await ledger.getByRole('group', { name: 'Colour by' }).getByRole('button', { name: 'Work status' }).click();
    const legend = ledger.getByRole('list', { name: 'Work status legend' });
    await legend.waitFor();
    await expect.poll(() => legend.locator('[data-legend-status="in-progress"]').textContent(), WAIT).toMatch(/Under way\s*1 unit$/);
    const row = ledger.getByRole('button', { name: /Club plot/ });
    expect(await row.locator('[data-unit-status]').getAttribute('data-unit-status')).toBe('in-progress');
    expect(await row.textContent()).toContain('Under way');
    await screenshot(page, 'plan-map-work-status');
    watch.assertClean();
    await context.close();
  });

  it('stays usable at 360 px: the week list fits the screen and the task opens in a full-width panel', async () => {
    const context = await browser.newContext({ viewport: { width: 360, height: 740 }, isMobile: true, hasTouch: true });
    const page = await context.newPage();
    const watch = watchPage(page);
    await signIn(page, baseUrl, 'consultant@browseline.test');
    await page.waitForURL(`${baseUrl}/desk`);
    const saved = await json<Task>(await consultantApi.request.get(`${baseUrl}/api/tasks/${task.id}`));
    await page.goto(`${baseUrl}/schedule?property=${propertyId}&week=${saved.startDate}`);
    const row = page.locator(`[data-task-id="${task.id}"]`);
    await row.waitFor(WAIT);
    // Nothing wider than the phone's screen (the page does not scroll sideways).
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(360);
    await screenshot(page, 'schedule-week-list-360');
    await row.click();
    const panel = page.getByRole('dialog', { name: task.name });
    await panel.getByRole('button', { name: 'Reopen task' }).waitFor(WAIT);
    expect((await panel.boundingBox())!.width).toBeLessThanOrEqual(360);
    await screenshot(page, 'schedule-task-panel-360');
    watch.assertClean();
    await context.close();
  });
  it('timeline: labels readable over two years, the unit named by crew, a bar dragged inside its window, several tasks assigned at once', async () => {
    const days = (a: string, b: string) => (Date.parse(`${b}T00:00:00Z`) - Date.parse(`${a}T00:00:00Z`)) / 86_400_000;
    const rest = openTasks.filter((t) => t.id !== task.id && t.id !== second.id);
    const roomy = rest.find((t) => days(t.earliest, t.latest) >= 10);
    expect(roomy, 'a Club plot step with a window of ten days or more').toBeDefined();
    const [pickA, pickB] = rest.filter((t) => t.id !== roomy!.id);
    const { request, csrf } = consultantApi;
    const start = addDays(roomy!.earliest, 2);
    await json(await request.patch(`${baseUrl}/api/tasks/${roomy!.id}`, { headers: { 'X-CSRF-Token': csrf }, data: { startDate: start } }));

    // bypassCSP only lets the journey inject axe-core; the app's own CSP is unchanged.
    const context = await browser.newContext({ viewport: { width: 1366, height: 900 }, bypassCSP: true });
    const page = await context.newPage();
    const watch = watchPage(page);
    await signIn(page, baseUrl, 'consultant@browseline.test');
    await page.waitForURL(`${baseUrl}/desk`);

    // Two years of weeks: every label is whole (nothing cut to "B…") and none lies on its bar.
    await page.goto(`${baseUrl}/schedule?view=timeline&from=${addDays(roomy!.earliest, -360)}&to=${addDays(roomy!.earliest, 360)}`);
    await page.locator(`[data-task-id="${roomy!.id}"]`).waitFor(WAIT);
    await page.locator('[data-bar-label]').first().waitFor(WAIT);
    const labels = await page.locator('[data-bar-label]').evaluateAll((els) =>
      els.map((el) => {
        const bar = el.parentElement!.querySelector('button')!.getBoundingClientRect();
        const box = el.getBoundingClientRect();
        return { text: el.textContent, cut: el.scrollWidth > el.clientWidth + 1, overlaps: box.left < bar.right - 1 && box.right > bar.left + 1 };
      }),
    );
    expect(labels.length).toBeGreaterThan(3);
    expect(labels.filter((l) => l.cut || l.overlaps)).toEqual([]);
    const insideCut = await page.locator('[data-task-id]').evaluateAll((els) => els.filter((el) => el.scrollWidth > el.clientWidth + 1).map((el) => el.getAttribute('aria-label')));
    expect(insideCut).toEqual([]);
    await screenshot(page, 'schedule-timeline-two-years');
    await expectNoAxeViolations(page, 'the schedule timeline over two years');

    // Drag the bar three days to the right: it snaps to days and saves through the same route as the panel.
    await page.goto(`${baseUrl}/schedule?property=${propertyId}&view=timeline&from=${roomy!.earliest}&to=${addDays(roomy!.earliest, 7 * 7)}`);
    const bar = page.locator(`[data-task-id="${roomy!.id}"]`);
    await bar.waitFor(WAIT);
    const lane = (await bar.evaluate((el) => el.parentElement!.getBoundingClientRect().width)) as number;
    const totalDays = 7 * 8;
    const dayPx = lane / totalDays;
    const box = (await bar.boundingBox())!;
    await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2);
    await page.mouse.down();
    await page.mouse.move(box.x + box.width / 2 + dayPx * 1.5, box.y + box.height / 2, { steps: 4 });
    await page.mouse.move(box.x + box.width / 2 + dayPx * 3.2, box.y + box.height / 2, { steps: 4 });
    await screenshot(page, 'schedule-timeline-dragging');
    await page.mouse.up();
    await expect.poll(async () => (await json<Task>(await request.get(`${baseUrl}/api/tasks/${roomy!.id}`))).startDate, WAIT).toBe(addDays(start, 3));
    // No panel opened: a drag is not a click.
    expect(await page.getByRole('dialog').count()).toBe(0);
    // Far past the window's end: it stops on the window's last day.
    const moved = (await bar.boundingBox())!;
    await page.mouse.move(moved.x + moved.width / 2, moved.y + moved.height / 2);
    await page.mouse.down();
    await page.mouse.move(moved.x + moved.width / 2 + dayPx * 200, moved.y + moved.height / 2, { steps: 6 });
    await page.mouse.up();
    await expect.poll(async () => (await json<Task>(await request.get(`${baseUrl}/api/tasks/${roomy!.id}`))).startDate, WAIT).toBe(roomy!.latest);

    // Tick two unassigned tasks and give both to Rosa Quintero at once.
    await page.goto(`${baseUrl}/schedule?property=${propertyId}&view=timeline&by=crew&from=${addDays(pickA.earliest, -14)}&to=${addDays(pickB.latest > pickA.latest ? pickB.latest : pickA.latest, 7)}`);
    const unassigned = page.getByRole('group', { name: 'Unassigned' });
    await unassigned.locator(`[data-task-id="${pickA.id}"]`).waitFor(WAIT);
    // By crew member, each bar names its unit.
    expect(await unassigned.locator(`[data-task-id="${pickA.id}"]`).getAttribute('aria-label')).toContain(`${pickA.name} · Club plot`);
    await unassigned.getByRole('checkbox', { name: `Select ${pickA.name} · Club plot` }).check();
    await unassigned.getByRole('checkbox', { name: `Select ${pickB.name} · Club plot` }).check();
    const selection = page.getByRole('region', { name: 'Selected tasks' });
    await selection.getByText('2 tasks selected').waitFor();
    await selection.getByLabel('Assign to').selectOption({ label: 'Rosa Quintero' });
    await screenshot(page, 'schedule-timeline-selection');
    await expectNoAxeViolations(page, 'the timeline by crew member with two tasks selected');
    await selection.getByRole('button', { name: 'Assign selected' }).click();
    const rosa = page.getByRole('group', { name: 'Rosa Quintero' });
    await rosa.locator(`[data-task-id="${pickA.id}"]`).waitFor(WAIT);
    await rosa.locator(`[data-task-id="${pickB.id}"]`).waitFor(WAIT);
    for (const t of [pickA, pickB]) expect((await json<Task>(await request.get(`${baseUrl}/api/tasks/${t.id}`))).assigneeId).toBe(crewId);
    expect(await page.getByRole('region', { name: 'Selected tasks' }).count()).toBe(0);
    await screenshot(page, 'schedule-timeline-assigned');
    // The week list's rows, too (their names are their visible text).
    await page.goto(`${baseUrl}/schedule`);
    await page.locator('[data-task-id]').first().waitFor(WAIT);
    await expectNoAxeViolations(page, 'the schedule week list');
    watch.assertClean();
    await context.close();
  });
});
