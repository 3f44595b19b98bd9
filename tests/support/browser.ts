/** Headless Chromium (Debian's) through playwright-core, and helpers for journeys. */
import fs from 'node:fs';
import path from 'node:path';
import { chromium, request, type APIRequestContext, type Browser, type Page } from 'playwright-core';
import { afterAll, beforeAll, expect } from 'vitest';

const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
export const SCREENSHOTS = path.resolve(import.meta.dirname, '../.artifacts/screenshots');

/** Launches headless Chromium with a fresh profile and no background networking. */
export async function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: CHROMIUM,
    headless: true,
    args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  });
}

/** The one thing a journey asks of its file's browser: a fresh context (cookies, viewport, offline state). */
export type JourneyBrowser = Pick<Browser, 'newContext'>;

/**
 * One headless Chromium for a journey file: launched in the file's `beforeAll` and closed in its
 * `afterAll`, registered where this is called. Call it once at the top level of the file.
 */
export function journeyBrowser(): JourneyBrowser {
  let browser: Browser | undefined;
  beforeAll(async () => {
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await browser?.close();
  });
  return {
    newContext: (options) => {
      if (!browser) throw new Error('journeyBrowser: the browser starts in beforeAll; open contexts inside hooks or tests');
      return browser.newContext(options);
    },
  };
}

export const DEMO_PASSWORD = 'demo-browseline';

/** Signs in through the form, as a person would. */
export async function signIn(page: Page, baseUrl: string, email: string, password = DEMO_PASSWORD): Promise<void> {
  await page.goto(`${baseUrl}/login`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

/** Saves a screenshot under tests/.artifacts/screenshots for a person to look at. */
export async function screenshot(page: Page, name: string): Promise<void> {
  fs.mkdirSync(SCREENSHOTS, { recursive: true });
  await page.screenshot({ path: path.join(SCREENSHOTS, `${name}.png`), fullPage: true });
}

/** Fails the test on any uncaught page error or failed same-origin request. */
export function watchPage(page: Page): { errors: string[]; assertClean: () => void } {
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(`pageerror: ${e.message}`));
  page.on('console', (m) => {
    if (m.type() === 'error' && !/Failed to load resource: the server responded with a status of 4\d\d/.test(m.text())) errors.push(`console: ${m.text()}`);
  });
  return { errors, assertClean: () => expect(errors).toEqual([]) };
}

/** A signed-in API session (cookie + CSRF token) of a demo account, for setting up and checking through the same routes the app uses. */
export async function apiSignIn(baseUrl: string, email: string, password = DEMO_PASSWORD): Promise<{ request: APIRequestContext; csrf: string }> {
  const api = await request.newContext({ baseURL: baseUrl });
  const res = await api.post('/api/auth/login', { data: { email, password } });
  expect(res.status(), `sign-in of ${email}`).toBe(200);
  return { request: api, csrf: ((await res.json()) as { csrfToken: string }).csrfToken };
}
