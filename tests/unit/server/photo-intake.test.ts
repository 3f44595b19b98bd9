import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { discardStoredPhoto, inspectPhoto, intakePhoto } from '../../../server/services/photos';
import { createDiskStorage } from '../../../server/services/storage/disk-storage';
import { readFile, useStorage, type Storage } from '../../../server/services/storage/storage';
import { AppError } from '../../../server/errors';
import { makeHeicHeader, makeJpeg, makePng } from '../../support/photo-fixtures';

let dir: string;
let previous: Storage | null;
const folders = { photos: 'test-photos', thumbnails: 'test-thumbs' };

beforeAll(() => {
  dir = mkdtempSync(path.join(os.tmpdir(), 'photo-intake-'));
  previous = useStorage(createDiskStorage(dir));
});
afterAll(() => {
  useStorage(previous);
  rmSync(dir, { recursive: true, force: true });
});

async function refusal(work: Promise<unknown>): Promise<AppError> {
  const err = await work.then(() => null, (e: unknown) => e);
  expect(err).toBeInstanceOf(AppError);
  return err as AppError;
}

describe('photo intake', () => {
  it('keeps a JPEG with its EXIF time and GPS, its SHA-256, and a thumbnail at most 480 px', async () => {
    const bytes = await makeJpeg({ width: 1200, height: 800, takenAt: '2026:10:14 07:31:05', latitude: 43.05, longitude: -90.31 });
    const photo = await intakePhoto({ bytes, originalName: 'scrape.jpg' }, folders);
    expect(photo.contentType).toBe('image/jpeg');
    expect(photo.exif.takenAtLocal).toBe('2026-10-14T07:31:05');
    expect(photo.exif.position?.[0]).toBeCloseTo(-90.31, 6);
    expect(photo.exif.position?.[1]).toBeCloseTo(43.05, 6);
    expect(photo.sha256).toMatch(/^[0-9a-f]{64}$/);
    expect(photo.storageKey).toMatch(/^test-photos\/[0-9a-f]{32}\.jpg$/);
    expect(Buffer.compare(await readFile(photo.storageKey), bytes)).toBe(0);
    const thumb = await sharp(await readFile(photo.thumbnailKey!)).metadata();
    expect([thumb.width, thumb.height, thumb.format]).toEqual([480, 320, 'jpeg']);
    await discardStoredPhoto(photo);
    await expect(readFile(photo.storageKey)).rejects.toMatchObject({ status: 404 });
  });

  it('gives the same hash to the same bytes and a different one to a different picture', async () => {
    const a = await inspectPhoto({ bytes: await makeJpeg({ rgb: [1, 2, 3] }) });
    const b = await inspectPhoto({ bytes: await makeJpeg({ rgb: [1, 2, 3] }) });
    const c = await inspectPhoto({ bytes: await makeJpeg({ rgb: [200, 2, 3] }) });
    expect(a.sha256).toBe(b.sha256);
    expect(a.sha256).not.toBe(c.sha256);
  });

  it('keeps a PNG, and a HEIC without a thumbnail (sharp carries no HEVC decoder)', async () => {
    expect((await inspectPhoto({ bytes: await makePng() })).contentType).toBe('image/png');
    const heic = await intakePhoto({ bytes: makeHeicHeader(4032, 3024), originalName: 'IMG_0001.HEIC' }, folders);
    expect([heic.contentType, heic.width, heic.height, heic.thumbnailKey]).toEqual(['image/heic', 4032, 3024, null]);
  });

  it('refuses a file that is not a photo by content, whatever its name (415)', async () => {
    const err = await refusal(inspectPhoto({ bytes: Buffer.from('%PDF-1.7\n1 0 obj\n<<>>\nendobj\n'), originalName: 'scrape.jpg' }));
    expect(err.status).toBe(415);
    expect(err.message).toContain('"scrape.jpg" is not a photo');
  });

  it('refuses a file over the size limit from its size on disk, before reading it (413)', async () => {
    const file = path.join(dir, 'big.jpg');
    writeFileSync(file, Buffer.alloc(2048, 0xff));
    const err = await refusal(inspectPhoto({ path: file, originalName: 'big.jpg' }, { maxBytes: 1024 }));
    expect(err.status).toBe(413);
  });

  it('refuses a photo over the pixel limit from its header, before decoding (422)', async () => {
    // A HEIC header claiming 20000 × 20000 pixels: refused without any picture data to decode.
    const err = await refusal(inspectPhoto({ bytes: makeHeicHeader(20000, 20000), originalName: 'huge.heic' }));
    expect(err.status).toBe(422);
    expect(err.message).toContain('20000 × 20000');
    const small = await refusal(inspectPhoto({ bytes: await makeJpeg({ width: 300, height: 200 }) }, { maxPixels: 50_000 }));
    expect(small.status).toBe(422);
  });

  it('flags absurd EXIF (a date in 2099, GPS at 0, 0) with sentences and uses neither', async () => {
    const photo = await inspectPhoto({ bytes: await makeJpeg({ takenAt: '2099:06:01 12:00:00', latitude: 0, longitude: 0 }) });
    expect(photo.exif.takenAtLocal).toBeNull();
    expect(photo.exif.position).toBeNull();
    expect(photo.exif.problems.map((p) => p.tag)).toEqual(['DateTimeOriginal', 'GPS']);
  });

  it('refuses a JPEG cut short so that it cannot be decoded (422), and stores nothing', async () => {
    const bytes = await makeJpeg({ width: 400, height: 300 });
    const err = await refusal(intakePhoto({ bytes: bytes.subarray(0, Math.floor(bytes.length / 2)), originalName: 'cut.jpg' }, folders));
    expect(err.status).toBe(422);
  });
});
