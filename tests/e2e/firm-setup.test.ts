/**
 * A new firm sets itself up and its documents show it: sign-up, the e-mailed confirmation, the profile
 * (name, address, logo), a first client found again through the header search (a typo forgiven),
 * and the proposal PDF for that firm read back with pdftotext (name and address) and rendered with
 * pdftoppm (the logo's pixels on page 1).
 */
import { describe, expect, inject, it } from 'vitest';
import { execFileSync } from 'node:child_process';
import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { decode, encode } from 'fast-png';
import { journeyBrowser, screenshot, SCREENSHOTS, watchPage } from '../support/browser';
import { signUpAndSignIn } from '../support/signup';

const baseUrl = inject('baseUrl');
const mailUrl = inject('mailUrl');
const WAIT = { timeout: 20_000 };
const poll = <T>(fn: () => Promise<T> | T) => expect.poll(fn, { timeout: 20_000 });

const browser = journeyBrowser();

const box = (lon: number, lat: number, dLon: number, dLat: number) => ({ type: 'Polygon', coordinates: [[[lon, lat], [lon + dLon, lat], [lon + dLon, lat + dLat], [lon, lat + dLat], [lon, lat]]] });
/** A logo of one colour no other part of the document uses (pure magenta), so its pixels can be counted. */
const MAGENTA = [255, 0, 255] as const;
const logoPng = () => Buffer.from(encode({ width: 240, height: 80, data: new Uint8Array(240 * 80 * 3).map((_, i) => MAGENTA[i % 3]!), channels: 3, depth: 8 }));

describe('a new firm’s own name, address and logo', () => {
  it('signs up, fills its profile, finds its first client with the header search, and its proposal PDF shows the logo and address', async () => {
    const stamp = crypto.randomBytes(3).toString('hex');
    const email = `owner-${stamp}@kickapoo-valley.example`;
    const password = 'a long enough password';
    const firmName = `Kickapoo Valley Wildlife ${stamp}`;
    const clientName = `Thorsgaard Family Farm ${stamp}`;
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    const watch = watchPage(page);

    // Sign up and confirm from the captured e-mail.
    await signUpAndSignIn(page, { baseUrl, mailUrl }, { firmName: `Kickapoo ${stamp}`, yourName: 'Ingrid Thorsgaard', email, password });
    const steps = page.getByRole('list', { name: 'First steps' });
    await steps.waitFor(WAIT);
    expect(await steps.locator('li[data-done="false"]').count()).toBe(3);

    // The profile: name, address, phone, and the logo.
    await page.goto(`${baseUrl}/settings/team`);
    const profile = page.getByRole('form', { name: 'Firm profile' });
    await profile.waitFor(WAIT);
    await profile.getByLabel('Firm name').fill(firmName);
    await profile.getByLabel('Postal address').fill('417 Ocooch Road\nLa Farge, WI 54639');
    await profile.getByLabel('Phone').fill('608-555-0173');
    await profile.getByRole('button', { name: 'Save firm profile' }).click();
    await poll(() => page.getByRole('status').filter({ hasText: 'Firm profile saved' }).count()).toBe(1);
    await page.getByLabel('Logo (PNG or JPEG)').setInputFiles({ name: 'logo.png', mimeType: 'image/png', buffer: logoPng() });
    await poll(() => page.getByRole('img', { name: 'The firm’s logo' }).count()).toBe(1);

    // The first client, then the header search finds it with a typo.
    await page.goto(`${baseUrl}/clients`);
    await page.getByRole('button', { name: 'New client' }).click();
    const clientForm = page.getByRole('form', { name: 'New client' });
    await clientForm.getByLabel('Name').fill(clientName);
    await clientForm.getByRole('button', { name: 'Add client' }).click();
    await page.waitForURL(/\/clients\/\d+$/, WAIT);
    const clientUrl = page.url();
    await page.goto(`${baseUrl}/desk`);
    await page.locator('#global-search').fill(`thorsgard famly ${stamp}`);
    const option = page.getByRole('listbox', { name: 'Search results' }).getByRole('option').filter({ hasText: clientName });
    await option.waitFor(WAIT);
    await screenshot(page, 'firm-setup-header-search');
    await option.click();
    await page.waitForURL(clientUrl, WAIT);
    // The profile and first-client steps ticked themselves off.
    await page.goto(`${baseUrl}/desk`);
    await poll(() => page.getByRole('list', { name: 'First steps' }).locator('li[data-done="true"]').count()).toBe(2);

    // A property with a plot and a prescription, and its draft proposal (through the API, same session).
    const csrf = ((await (await page.request.get(`${baseUrl}/api/auth/csrf`)).json()) as { csrfToken: string }).csrfToken;
    const post = async <T>(url: string, data: unknown): Promise<T> => {
      const res = await page.request.post(`${baseUrl}${url}`, { headers: { 'X-CSRF-Token': csrf }, data: data as object });
      expect(res.status(), `${url}: ${await res.text()}`).toBe(201);
      return ((await res.json()) as { data: T }).data;
    };
    const clientId = Number(clientUrl.split('/').pop());
    const property = await post<{ id: number }>('/api/properties', { clientId, name: 'Ocooch Ridge Forty', county: 'Vernon', state: 'WI', region: 'midwest', boundary: box(-90.64, 43.57, 0.01, 0.006) });
    const plot = await post<{ id: number }>(`/api/properties/${property.id}/units`, { kind: 'food-plot', name: 'Ridge plot', geometry: box(-90.638, 43.571, 0.0015, 0.001) });
    const practices = ((await (await page.request.get(`${baseUrl}/api/practices`)).json()) as { data: { id: number; key: string }[] }).data;
    await post(`/api/units/${plot.id}/prescriptions`, { practiceId: practices.find((p) => p.key === 'fall-brassica-plot')!.id });
    const draft = await post<{ id: number }>(`/api/properties/${property.id}/proposals`, {});

    const res = await page.request.get(`${baseUrl}/api/proposals/${draft.id}/pdf`);
    expect(res.status()).toBe(200);
    fs.mkdirSync(SCREENSHOTS, { recursive: true });
    const file = path.join(SCREENSHOTS, 'firm-setup-proposal.pdf');
    fs.writeFileSync(file, await res.body());
    const text = execFileSync('pdftotext', ['-layout', file, '-']).toString();
    expect(text).toContain(firmName);
    expect(text).toContain('417 Ocooch Road');
    expect(text).toContain('La Farge, WI 54639');
    expect(text).toContain('608-555-0173');
    execFileSync('pdftoppm', ['-png', '-r', '60', '-f', '1', '-l', '1', '-singlefile', file, file.replace(/\.pdf$/, '')]);
    const png = decode(fs.readFileSync(file.replace(/\.pdf$/, '.png')));
    let magenta = 0;
    const channels = png.channels;
    for (let i = 0; i < png.data.length; i += channels) {
      if (png.data[i]! > 230 && png.data[i + 1]! < 40 && png.data[i + 2]! > 230) magenta++;
    }
    // The logo prints about 1.5 × 0.5 inches at most: at 60 dpi, hundreds of magenta pixels (common practice, no source).
    expect(magenta).toBeGreaterThan(300);
    watch.assertClean();
    await context.close();
  });
});
