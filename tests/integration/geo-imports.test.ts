/**
 * Imports through HTTP: the file is read in a worker thread, the answer is a compact preview, the
 * full geometries are fetched for the features saved, and uploads built to exhaust the server are
 * refused with the limit named.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Polygon } from 'geojson';
import { signedInAgent, type Agent } from '../support/test-app';
import { makeFirm, PASSWORD } from '../support/factories';
import { rectangle } from '../support/geodesy';
import { generateLargeKml } from '../support/geo-fixtures-large';
import { shapefileBomb } from '../support/zip-bytes';
import { tiffHeaderOnly } from '../support/tiff-bytes';
import { closeGeoWorkers, runGeoImport } from '../../server/services/geo-work/geo-pool';
import type { ImportPreviewDto } from '../../shared/schemas/geo-import';

let consultant: Agent;
let ctx: Awaited<ReturnType<typeof makeFirm>>;

async function newProperty(): Promise<number> {
  const res = await consultant.post('/api/properties').set('X-CSRF-Token', consultant.csrf).send({ clientId: ctx.client.id, name: `Import test ${Math.random()}`, boundary: rectangle(-90.94, 43.26, 1200, 900) });
  expect(res.status).toBe(201);
  return res.body.data.id as number;
}

const upload = (propertyId: number, bytes: Buffer, name: string) =>
  consultant.post(`/api/properties/${propertyId}/imports`).set('X-CSRF-Token', consultant.csrf).attach('file', bytes, name);

beforeAll(async () => {
  ctx = await makeFirm();
  consultant = await signedInAgent(ctx.users.consultant.email, PASSWORD);
});

afterAll(async () => {
  await closeGeoWorkers();
});

const plot: Polygon = {
  type: 'Polygon',
  coordinates: [[[-90.9381234, 43.2612345], [-90.9371234, 43.2612345], [-90.9371234, 43.2622345], [-90.9381234, 43.2622345], [-90.9381234, 43.2612345]]],
};
const kml = `<?xml version="1.0" encoding="UTF-8"?><kml xmlns="http://www.opengis.net/kml/2.2"><Document>
<Placemark><name>North plot</name><ExtendedData><Data name="owner-note"><value>keep</value></Data></ExtendedData><Polygon><outerBoundaryIs><LinearRing><coordinates>${plot.coordinates[0].map((p) => p.join(',')).join(' ')}</coordinates></LinearRing></outerBoundaryIs></Polygon></Placemark>
<Placemark><name>Gate</name><Point><coordinates>-90.935,43.265</coordinates></Point></Placemark>
</Document></kml>`;

describe('the import preview and the full geometries', () => {
  it('reads the file in a worker thread, not on the request thread, and answers JSON text', async () => {
    const big = generateLargeKml({ targetBytes: 512 * 1024 });
    const answer = await runGeoImport({ filename: 'plan.kml', bytes: big.buffer });
    expect(answer.threadId).toBeGreaterThan(0); // the main thread's id is 0 (node:worker_threads)
    expect(typeof answer.previewJson).toBe('string');
    expect((JSON.parse(answer.previewJson) as ImportPreviewDto).counts.features).toBe(big.placemarkCount);
  });

  it('answers counts, names, measures and outlines, and the full geometry of the features asked for', async () => {
    const propertyId = await newProperty();
    const res = await upload(propertyId, Buffer.from(kml), 'plan.kml');
    expect(res.status).toBe(200);
    const preview = res.body.data as ImportPreviewDto;
    expect(preview.importId).toMatch(/^[0-9a-f-]{36}$/);
    expect(preview.counts).toEqual({ features: 2, skipped: 0, area: 1, line: 0, point: 1, vertices: 6 });
    expect(preview.features.map((f) => [f.item, f.name, f.family, f.vertexCount])).toEqual([
      [0, 'North plot', 'area', 5],
      [1, 'Gate', 'point', 1],
    ]);
    expect(preview.features[0].acres).toBeGreaterThan(0);
    expect(preview.features[0]).not.toHaveProperty('properties'); // the file's attributes stay on the server
    // The outline is rounded to 6 decimals; the stored geometry keeps every digit.
    expect((preview.features[0].geometry as Polygon).coordinates[0][0]).toEqual([-90.938123, 43.261235]);
    const full = await consultant.get(`/api/properties/${propertyId}/imports/${preview.importId}/features?items=0,1,7`).expect(200);
    expect(full.body.data).toEqual([
      { item: 0, geometry: plot },
      { item: 1, geometry: { type: 'Point', coordinates: [-90.935, 43.265] } },
    ]);
  });

  it('keeps another firm, another property and a malformed id out', async () => {
    const propertyId = await newProperty();
    const preview = (await upload(propertyId, Buffer.from(kml), 'plan.kml')).body.data as ImportPreviewDto;
    const other = await makeFirm();
    const outsider = await signedInAgent(other.users.owner.email, PASSWORD);
    await outsider.get(`/api/properties/${propertyId}/imports/${preview.importId}/features?items=0`).expect(404);
    const second = await newProperty();
    await consultant.get(`/api/properties/${second}/imports/${preview.importId}/features?items=0`).expect(404);
    const bad = await consultant.get(`/api/properties/${propertyId}/imports/not-a-uuid/features?items=0`);
    expect(bad.status).toBe(422);
    const badItems = await consultant.get(`/api/properties/${propertyId}/imports/${preview.importId}/features?items=zero`);
    expect(badItems.status).toBe(422);
  });

  it('keeps the preview of a large KML compact: every feature counted, outlines thinned, a quarter of the file or less', async () => {
    const propertyId = await newProperty();
    const big = generateLargeKml({ targetBytes: 3 * 1024 * 1024 });
    const res = await upload(propertyId, big.buffer, 'large.kml');
    expect(res.status).toBe(200);
    const preview = res.body.data as ImportPreviewDto;
    expect(preview.counts.features).toBe(big.placemarkCount);
    expect({ area: preview.counts.area, line: preview.counts.line, point: preview.counts.point }).toEqual(big.counts);
    expect(preview.features).toHaveLength(2_000); // GEOMETRY_LIMITS.unitsPerProperty
    expect(preview.warnings.join(' ')).toMatch(/lists the first 2,000/);
    expect(res.text.length).toBeLessThan(big.buffer.length / 4);
  });
});

describe('uploads built to exhaust the server answer with the limit named', () => {
  it('a shapefile zip expanding four 200 MB entries: 413', async () => {
    const propertyId = await newProperty();
    const res = await upload(propertyId, await shapefileBomb(), 'parcels.zip');
    expect(res.status).toBe(413);
    expect(res.body.error).toMatch(/expands to more than 100 MB/);
  });

  it('a file over the upload size: 413 naming 25 MB', async () => {
    const propertyId = await newProperty();
    const res = await upload(propertyId, Buffer.alloc(26 * 1024 * 1024, 32), 'huge.geojson');
    expect(res.status).toBe(413);
    expect(res.body.error).toMatch(/larger than 25 MB/);
  });

  it('a GeoTIFF declaring 8192 × 8192 pixels: 413 naming the pixel limit, and no overlay kept', async () => {
    const propertyId = await newProperty();
    const res = await consultant.post(`/api/properties/${propertyId}/overlays`).set('X-CSRF-Token', consultant.csrf).attach('file', tiffHeaderOnly(8192, 8192), 'ortho.tif');
    expect(res.status).toBe(413);
    expect(res.body.error).toMatch(/at most 40 megapixels/);
    const list = await consultant.get(`/api/properties/${propertyId}/overlays`).expect(200);
    expect(list.body.data).toEqual([]);
  });
});
