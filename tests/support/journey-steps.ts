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

/** A new firm's first client and property through the forms (Clients → New client → New property); ends after "Add property". */
export async function addClientAndProperty(page: Page, baseUrl: string, names: { client: string; property: string; county: string; state: string }): Promise<void> {
  const WAIT = { timeout: 20_000 };
  await page.goto(`${baseUrl}/clients`);
  await page.getByRole('button', { name: 'New client' }).click();
  const clientForm = page.getByRole('form', { name: 'New client' });
  await clientForm.getByLabel('Name').fill(names.client);
  await clientForm.getByRole('button', { name: 'Add client' }).click();
  await page.waitForURL(/\/clients\/\d+$/, WAIT);
  await page.getByRole('button', { name: 'New property' }).click();
  const propertyForm = page.getByRole('form', { name: 'New property' });
  await propertyForm.getByLabel('Property name').fill(names.property);
  await propertyForm.getByLabel('County').fill(names.county);
  await propertyForm.getByLabel('State').fill(names.state);
  await propertyForm.getByRole('button', { name: 'Add property' }).click();
}
