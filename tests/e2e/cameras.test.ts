import { describe, expect, inject, it } from 'vitest';
import { journeyBrowser, screenshot, signIn, watchPage } from '../support/browser';
import { openProperty } from '../support/journey-steps';
import { makeJpeg } from '../support/photo-fixtures';
import { todayIn } from '../../shared/domain/clock';

const baseUrl = inject('baseUrl');

const poll = <T>(fn: () => Promise<T> | T) => expect.poll(fn, { timeout: 20_000, interval: 100 });
const addDays = (date: string, days: number) => new Date(Date.parse(`${date}T00:00:00Z`) + days * 86_400_000).toISOString().slice(0, 10);
const exifDay = (date: string) => date.replaceAll('-', ':');

const browser = journeyBrowser();

describe('a camera card from the field to a survey', () => {
  it('the consultant sets a camera, brings its card in, tags it with the keyboard and makes a survey whose estimates match the tallies', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    const watch = watchPage(page);
    await signIn(page, baseUrl, 'consultant@browseline.test');
    await page.waitForURL(`${baseUrl}/desk`);
    // The demo's Cam 1 was last pulled 26 days ago: on the Desk with its walk-in route.
    await poll(() => page.getByRole('list', { name: 'Cards to pull' }).getByText('Cam 1 at Camera 2 — hollow').count()).toBe(1);

    await openProperty(page, 'Kettle Hollow Farm');
    await page.getByRole('link', { name: 'Cameras', exact: true }).click();
    await page.waitForURL(/\/properties\/\d+\/cameras$/);

    // A new camera set 20 days ago (the firm is on Central time) at the ridge site.
    const today = todayIn('America/Chicago', new Date());
    const setOn = addDays(today, -20);
    await page.getByLabel('Camera', { exact: true }).selectOption('new');
    await page.getByLabel('New camera’s label').fill('Cam E2E');
    await page.getByLabel('Camera site', { exact: true }).selectOption({ label: 'Camera 1 — ridge' });
    await page.getByLabel('Set on').fill(setOn);
    await page.getByRole('button', { name: 'Deploy' }).click();
    await poll(() => page.getByRole('button', { name: 'Cam E2E at Camera 1 — ridge' }).count()).toBe(1);
    await page.getByRole('button', { name: 'Cam E2E at Camera 1 — ridge' }).click();

    // The card: six photos the test draws, EXIF times on the camera's clock at midday.
    const card = [
      ['IMG_0001.JPG', 2, '06:40:00'],
      ['IMG_0002.JPG', 3, '18:10:00'],
      ['IMG_0003.JPG', 4, '07:20:00'],
      ['IMG_0004.JPG', 5, '12:00:00'],
      ['IMG_0005.JPG', 6, '20:30:00'],
      ['IMG_0006.JPG', 6, '20:40:00'],
    ] as const;
    const files = await Promise.all(card.map(async ([name, day, time], i) => ({ name, mimeType: 'image/jpeg', buffer: await makeJpeg({ rgb: [30 + i * 30, 90, 200 - i * 20], takenAt: `${exifDay(addDays(setOn, day))} ${time}` }) })));
    await page.getByLabel('Photos from the card').setInputFiles(files);
    await page.getByRole('button', { name: 'Send 6 photos' }).click();
    await poll(() => page.getByRole('status').filter({ hasText: 'photos handled' }).textContent()).toContain('6 of 6 photos handled: 6 added, 0 skipped');
    // Sending the same card again skips every photo by its content hash.
    await page.getByRole('button', { name: 'Send 6 photos' }).click();
    await poll(() => page.getByRole('status').filter({ hasText: 'photos handled' }).textContent()).toContain('6 added'.replace('6', '0'));

    // Review with the keyboard: roster keys 1 = Split brow, 2 = Wide eight (sorted by name).
    const grid = page.getByRole('grid', { name: 'Card photos to review' });
    await poll(() => grid.getByRole('gridcell').count()).toBe(6);
    await grid.focus();
    for (const key of ['1', '2', '1', 'd', 'd', 'f']) await page.keyboard.press(key);
    const tags = () => grid.getByRole('gridcell').evaluateAll((cells) => cells.map((c) => c.getAttribute('data-tag')));
    await poll(tags).toEqual(['buck', 'buck', 'buck', 'doe', 'doe', 'fawn']);
    await poll(() => grid.getByRole('gridcell').first().textContent()).toContain('Split brow');
    // S on the first photo shows it to the landowner among the roster's best.
    for (let i = 0; i < 5; i++) await page.keyboard.press('ArrowLeft');
    await page.keyboard.press('s');
    await poll(() => grid.getByRole('gridcell').first().textContent()).toContain('shown to the landowner');
    await poll(() => page.getByTestId('event-count').textContent()).toBe('5'); // the two photos 10 minutes apart are one event
    await screenshot(page, 'cameras-review');

    // A survey from this camera's tagged photos only.
    const survey = page.getByRole('group', { name: 'Deployments' });
    for (const box of await survey.getByRole('checkbox').all()) await box.setChecked(false);
    await survey.getByLabel('Cam E2E at Camera 1 — ridge').setChecked(true);
    await page.getByLabel('From', { exact: true }).fill(setOn);
    await page.getByLabel('To', { exact: true }).fill(today);
    await page.getByRole('button', { name: 'Make the survey from tagged photos' }).click();
    const made = page.getByTestId('photo-survey');
    await poll(() => made.textContent()).toContain('Buck photos 3 · unique bucks 2 · doe photos 2 · fawn photos 1');
    // Hand-worked from the tallies: 3 ÷ 2 = 1.5 photos per buck; does 2 ÷ 1.5 = 1.33; fawns 1 ÷ 1.5 = 0.67;
    // 2 + 1.33 + 0.67 = 4 deer on one camera's 100 acres (Jacobson et al. 1997, from memory) → 4 ÷ (100/640) = 25.6 per mi².
    await poll(() => made.getByTestId('survey-total').textContent()).toBe('4');
    await poll(() => made.getByTestId('survey-density').textContent()).toBe('25.6');
    await screenshot(page, 'cameras-survey');
    watch.assertClean();
    await context.close();
  });
});
