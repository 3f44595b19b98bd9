/**
 * The sign-up steps browser journeys share: a new firm through /signup, its confirmation link read
 * from the captured mail, and the first sign-in. Each journey makes its own firm with a random stamp.
 */
import { expect } from 'vitest';
import type { Page } from 'playwright-core';
import { signIn } from './browser';

const WAIT = { timeout: 20_000 };
const poll = <T>(fn: () => Promise<T> | T) => expect.poll(fn, { timeout: 20_000 });

interface MailSummary {
  id: number;
  subject: string;
  to: string[];
}

/** The captured messages sent to one address (the mail-capture server's HTTP API). */
export async function mailTo(mailUrl: string, address: string): Promise<MailSummary[]> {
  const answer = (await (await fetch(`${mailUrl}/messages`)).json()) as { data: MailSummary[] };
  return answer.data.filter((m) => m.to.includes(address));
}

/** The plain text of one captured message. */
export async function mailText(mailUrl: string, id: number): Promise<string> {
  return ((await (await fetch(`${mailUrl}/messages/${id}`)).json()) as { data: { text: string } }).data.text;
}

/** The new firm a journey signs up. */
export interface NewFirm {
  firmName: string;
  yourName: string;
  email: string;
  password: string;
}

/** Fills the sign-up form (from wherever the page is) and waits for "Check your e-mail". */
export async function submitSignup(page: Page, baseUrl: string, firm: NewFirm, options: { openPage?: boolean } = {}): Promise<void> {
  if (options.openPage ?? true) await page.goto(`${baseUrl}/signup`);
  await page.getByLabel('Firm name').fill(firm.firmName);
  await page.getByLabel('Your name').fill(firm.yourName);
  await page.getByLabel('E-mail').fill(firm.email);
  await page.getByLabel('Password').fill(firm.password);
  await page.getByRole('button', { name: 'Create the firm' }).click();
  await poll(() => page.getByRole('status').filter({ hasText: 'Check your e-mail' }).count()).toBe(1);
}

/** Waits for the one confirmation mail to `email`, opens its verify-email link and waits for "Your e-mail is confirmed". */
export async function confirmEmail(page: Page, mailUrl: string, email: string): Promise<void> {
  await poll(async () => (await mailTo(mailUrl, email)).length).toBe(1);
  const text = await mailText(mailUrl, (await mailTo(mailUrl, email))[0]!.id);
  const link = /(http:\/\/\S+\/verify-email\/[A-Za-z0-9_-]+)/.exec(text)![1]!;
  await page.goto(link);
  await poll(() => page.getByRole('status').filter({ hasText: 'Your e-mail is confirmed' }).count()).toBe(1);
}

/** Signs up a new firm, confirms its e-mail and signs in: the page ends on the Desk. */
export async function signUpAndSignIn(page: Page, urls: { baseUrl: string; mailUrl: string }, firm: NewFirm): Promise<void> {
  await submitSignup(page, urls.baseUrl, firm);
  await confirmEmail(page, urls.mailUrl, firm.email);
  await signIn(page, urls.baseUrl, firm.email, firm.password);
  await page.waitForURL(`${urls.baseUrl}/desk`, WAIT);
}
