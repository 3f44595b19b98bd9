/**
 * The crew's field sheet records an establishment check with no signal: it waits on the phone and
 * lands once when the phone is back online (offline queue with an Idempotency-Key).
 */
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { apiSignIn, launchBrowser, screenshot, signIn, watchPage } from '../support/browser';
import { offersChecks } from '../../src/features/field/lib/check-offer';

const baseUrl = inject('baseUrl');
const poll = <T>(fn: () => Promise<T> | T, timeout = 20_000) => expect.poll(fn, { timeout, interval: 150 });

interface CrewTask {
  id: number;
  name: string;
  unitId: number | null;
  unitKind: string | null;
  kind: string;
}

let browser: Browser;
let crew: Awaited<ReturnType<typeof apiSignIn>>;
let task: CrewTask;

beforeAll(async () => {
  browser = await launchBrowser();
  crew = await apiSignIn(baseUrl, 'crew@browseline.test');
  const list = (await (await crew.request.get('/api/tasks?limit=500')).json()) as { data: { tasks: CrewTask[] } };
  task = list.data.tasks.find((t) => offersChecks(t))!;
  expect(task, 'the demo crew member has a task on a seeded unit').toBeTruthy();
});

afterAll(async () => {
  await crew?.request.dispose();
  await browser?.close();
});

describe('checks on the field sheet', () => {
  it('an establishment check made offline waits on the phone and lands once back online', async () => {
    const checksOf = async () => ((await (await crew.request.get(`/api/units/${task.unitId}/checks`)).json()) as { data: unknown[] }).data.length;
    const before = await checksOf();
    const context = await browser.newContext({ viewport: { width: 360, height: 740 }, isMobile: true, hasTouch: true, timezoneId: 'America/Chicago' });
    const page = await context.newPage();
    watchPage(page);
    await signIn(page, baseUrl, 'crew@browseline.test');
    await page.waitForURL(`${baseUrl}/field`);
    await page.goto(`${baseUrl}/field/tasks/${task.id}`);
    await page.getByRole('button', { name: 'Record an establishment or browse check' }).click();
    const form = page.getByRole('form', { name: 'Record a check' });
    await form.getByLabel('Species 1').waitFor();
    await context.setOffline(true);
    await form.getByLabel('Species 1').fill('rape');
    await form.getByLabel('Plants in the frame').fill('3');
    await form.getByLabel('Ground cover, %').fill('40');
    await screenshot(page, 'field-check-form-360');
    await form.getByRole('button', { name: 'Save check' }).click();
    await poll(() => page.getByText(/saved on this phone/i).first().isVisible()).toBe(true);
    expect(await checksOf()).toBe(before);

    await context.setOffline(false);
    // The queue sends when the form opens again (or the phone comes online with it open).
    await page.getByRole('button', { name: 'Record an establishment or browse check' }).click();
    await poll(checksOf).toBe(before + 1);
    await page.evaluate(() => window.dispatchEvent(new Event('online')));
    await poll(checksOf).toBe(before + 1);
    await screenshot(page, 'field-check-sent-360');
    await context.close();
  });
});
