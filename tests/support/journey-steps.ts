/** Steps browser journeys share on the demo data: the consultant signs in and opens a property from the Properties list. */
import type { Page } from 'playwright-core';
import { signIn } from './browser';

/** Signs the demo consultant in and waits for the Desk. */
export async function signInAsConsultant(page: Page, baseUrl: string): Promise<void> {
  await signIn(page, baseUrl, 'consultant@browseline.test');
  await page.waitForURL(`${baseUrl}/desk`);
}

/** Opens a property by its name from the Properties list; answers its id. */
export async function openProperty(page: Page, name: string): Promise<number> {
  await page.getByRole('navigation', { name: 'Places' }).getByRole('link', { name: 'Properties' }).click();
  await page.getByRole('link', { name, exact: true }).click();
  await page.waitForURL(/\/properties\/\d+$/);
  return Number(new URL(page.url()).pathname.split('/').pop());
}
