import { beforeAll, describe, expect, it } from 'vitest';
import { writeArrayBuffer } from 'geotiff';
import { encode } from 'fast-png';
import { DOMParser } from '@xmldom/xmldom';
import type { LineString, Polygon } from 'geojson';
import { signedInAgent, testApp, type Agent } from '../support/test-app';
import { makeFirm, PASSWORD } from '../support/factories';
import { ellipsoidalAreaSqM, ellipsoidalLengthM, rectangle } from '../support/geodesy';
import { PropertySchema } from '../../shared/schemas/property';
import { UnitSchema } from '../../shared/schemas/unit';
import { SQ_M_PER_ACRE } from '../../shared/units';
import { sequelize } from '../../server/db/sequelize';
import { QueryTypes } from 'sequelize';
import request from 'supertest';

let consultant: Agent;
let ctx: Awaited<ReturnType<typeof makeFirm>>;
const post = (url: string, body: unknown) => consultant.post(url).set('X-CSRF-Token', consultant.csrf).send(body as object);
const patch = (url: string, body: unknown) => consultant.patch(url).set('X-CSRF-Token', consultant.csrf).send(body as object);

// Acres are measured on the WGS84 ellipsoid: within 0.01 % of GeographicLib and PostGIS geography
// (tests/unit/domain/ellipsoid.test.ts checks random shapes).
const AREA_TOLERANCE = 0.0001;

const boundary = rectangle(-90.94, 43.26, 1200, 900); // about 267 acres near 43.26°N

async function newProperty(b: Polygon = boundary) {
  const res = await post('/api/properties', { clientId: ctx.client.id, name: `Plan test ${Math.random()}`, county: 'Crawford', state: 'WI', region: 'midwest', boundary: b });
  expect(res.status).toBe(201);
  return PropertySchema.parse(res.body.data);
}

beforeAll(async () => {
  ctx = await makeFirm();
  consultant = await signedInAgent(ctx.users.consultant.email, PASSWORD);
});

describe('properties and boundaries', () => {
  it('computes the boundary acres on the server, within the stated tolerance of the ellipsoid and of PostGIS geography', async () => {
    const property = await newProperty();
    const reference = ellipsoidalAreaSqM(boundary) / SQ_M_PER_ACRE; // GeographicLib on WGS84
    expect(Math.abs(property.acres! - reference) / reference).toBeLessThan(AREA_TOLERANCE);
    const [row] = await sequelize.query<{ sqm: number }>('SELECT ST_Area(boundary::geography) AS sqm FROM properties WHERE id = :id', { replacements: { id: property.id }, type: QueryTypes.SELECT });
    const postgis = Number(row.sqm) / SQ_M_PER_ACRE; // PostGIS geography: area on the WGS84 spheroid
    expect(Math.abs(property.acres! - postgis) / postgis).toBeLessThan(AREA_TOLERANCE);
    expect(Math.abs(postgis - reference) / reference).toBeLessThan(1e-6);
    expect(property.boundary!.type).toBe('MultiPolygon');
    expect(property.hectares).toBeCloseTo(property.acres! / 2.4710538, 2); // 1 ha = 2.4710538 acres (NIST-derived)
  });

  it('refuses a self-crossing boundary with 422 saying where, and saves nothing', async () => {
    const bowTie: Polygon = { type: 'Polygon', coordinates: [[[-90.94, 43.26], [-90.93, 43.27], [-90.93, 43.26], [-90.94, 43.27], [-90.94, 43.26]]] };
    const name = `Bow tie ${Date.now()}`;
    const res = await post('/api/properties', { clientId: ctx.client.id, name, boundary: bowTie });
    expect(res.status).toBe(422);
    expect(res.body.error).toMatch(/crosses itself near 43\.26\d* N, 90\.93\d* W/);
    const list = await consultant.get('/api/properties').expect(200);
    expect(list.body.data.map((p: { name: string }) => p.name)).not.toContain(name);
  });

  it('refuses an unclosed ring and out-of-range coordinates with messages naming the problem', async () => {
    const open = await post('/api/properties', { clientId: ctx.client.id, name: 'Open', boundary: { type: 'Polygon', coordinates: [[[-90.94, 43.26], [-90.93, 43.26], [-90.93, 43.27], [-90.94, 43.27]]] } });
    expect(open.status).toBe(422);
    expect(open.body.error).toMatch(/not closed/);
    const wild = await post('/api/properties', { clientId: ctx.client.id, name: 'Wild', boundary: { type: 'Polygon', coordinates: [[[-190, 43.26], [-90.93, 43.26], [-90.93, 43.27], [-190, 43.26]]] } });
    expect(wild.status).toBe(422);
    expect(wild.body.error).toMatch(/longitude/i);
  });

  it('refuses a property for another firm’s client', async () => {
    const other = await makeFirm();
    const res = await post('/api/properties', { clientId: other.client.id, name: 'Not ours', boundary });
    expect(res.status).toBe(422);
  });
});

describe('units', () => {
  it('answers a drawn food plot with server-computed acres and ignores numbers sent by the client', async () => {
    const property = await newProperty();
    const plot = rectangle(-90.938, 43.262, 120, 80);
    const res = await post(`/api/properties/${property.id}/units`, { kind: 'food-plot', name: 'North clover', geometry: plot, acres: 999 });
    expect(res.status).toBe(201);
    const unit = UnitSchema.parse(res.body.data);
    const reference = ellipsoidalAreaSqM(plot) / SQ_M_PER_ACRE;
    expect(unit.acres).not.toBe(999);
    expect(Math.abs(unit.acres! - reference) / reference).toBeLessThan(AREA_TOLERANCE);
    expect(unit.family).toBe('area');
    expect(unit.lengthFt).toBeNull();
  });

  it('measures an access route in feet against GeographicLib’s inverse', async () => {
    const property = await newProperty();
    const route: LineString = { type: 'LineString', coordinates: [[-90.939, 43.261], [-90.934, 43.263], [-90.93, 43.2665]] };
    const res = await post(`/api/properties/${property.id}/units`, { kind: 'access-route', name: 'Ridge walk-in', geometry: route });
    expect(res.status).toBe(201);
    const referenceFt = ellipsoidalLengthM(route.coordinates) / 0.3048; // GeographicLib Inverse s12; 1 ft = 0.3048 m (NIST)
    // Measured on the ellipsoid: within 0.01 % (stored to 0.1 ft).
    expect(Math.abs(res.body.data.lengthFt - referenceFt) / referenceFt).toBeLessThan(0.0001);
    expect(res.body.data.acres).toBeNull();
  });

  it('refuses a self-crossing unit and a kind drawn with the wrong shape with 422', async () => {
    const property = await newProperty();
    const crossing = await post(`/api/properties/${property.id}/units`, {
      kind: 'timber',
      name: 'Bow tie',
      geometry: { type: 'Polygon', coordinates: [[[-90.938, 43.261], [-90.934, 43.264], [-90.934, 43.261], [-90.938, 43.264], [-90.938, 43.261]]] },
    });
    expect(crossing.status).toBe(422);
    expect(crossing.body.error).toMatch(/crosses itself/);
    const wrongShape = await post(`/api/properties/${property.id}/units`, { kind: 'food-plot', name: 'Line plot', geometry: { type: 'LineString', coordinates: [[-90.938, 43.261], [-90.934, 43.264]] } });
    expect(wrongShape.status).toBe(422);
    expect(wrongShape.body.error).toMatch(/must be drawn as an area/);
    const units = await consultant.get(`/api/properties/${property.id}/units`).expect(200);
    expect(units.body.data).toHaveLength(0);
  });

  it('re-measures on PATCH, bumps the plan’s ETag, and answers 304 to an unchanged plan', async () => {
    const property = await newProperty();
    const created = await post(`/api/properties/${property.id}/units`, { kind: 'food-plot', name: 'Plot', geometry: rectangle(-90.938, 43.262, 100, 100) });
    const first = await consultant.get(`/api/properties/${property.id}/units`).expect(200);
    const etag = first.headers.etag;
    expect(etag).toMatch(/^W\/"plan-/);
    await consultant.get(`/api/properties/${property.id}/units`).set('If-None-Match', etag).expect(304);
    const bigger = await patch(`/api/units/${created.body.data.id}`, { geometry: rectangle(-90.938, 43.262, 200, 100) });
    expect(bigger.status).toBe(200);
    expect(bigger.body.data.acres).toBeCloseTo(created.body.data.acres * 2, 2);
    const after = await consultant.get(`/api/properties/${property.id}/units`).set('If-None-Match', etag).expect(200);
    expect(after.headers.etag).not.toBe(etag);
    expect(after.body.data[0].acres).toBeCloseTo(bigger.body.data.acres, 4);
  });

  it('creates many units in one transaction: one bad unit saves none', async () => {
    const property = await newProperty();
    const good = { kind: 'stand-site', name: 'Stand 1', geometry: { type: 'Point', coordinates: [-90.936, 43.263] } };
    const bad = { kind: 'timber', name: 'Bad', geometry: { type: 'Polygon', coordinates: [[[-90.938, 43.261], [-90.934, 43.264], [-90.934, 43.261], [-90.938, 43.264], [-90.938, 43.261]]] } };
    const res = await post(`/api/properties/${property.id}/units/bulk`, { units: [good, bad] });
    expect(res.status).toBe(422);
    expect((await consultant.get(`/api/properties/${property.id}/units`)).body.data).toHaveLength(0);
    const ok = await post(`/api/properties/${property.id}/units/bulk`, { units: [good, { ...good, name: 'Stand 2' }] });
    expect(ok.status).toBe(201);
    expect(ok.body.data).toHaveLength(2);
  });

  it('summarises the plan: share by kind and the warnings a consultant wants', async () => {
    const property = await newProperty();
    await post(`/api/properties/${property.id}/units`, { kind: 'food-plot', name: 'Tiny plot', geometry: rectangle(-90.938, 43.262, 30, 30) }); // ~0.22 ac
    await post(`/api/properties/${property.id}/units`, { kind: 'timber', name: 'Oaks', geometry: rectangle(-90.936, 43.262, 300, 300) });
    const res = await consultant.get(`/api/properties/${property.id}/plan`).expect(200);
    const codes = res.body.data.warnings.map((w: { code: string }) => w.code);
    expect(codes).toContain('food-plot-small'); // under 0.25 acre: NRCS CP12 job sheet
    const timber = res.body.data.shareByKind.find((s: { kind: string }) => s.kind === 'timber');
    expect(timber.acres).toBeGreaterThan(20);
    expect(res.body.data.shareByKind.some((s: { kind: string }) => s.kind === 'unassigned')).toBe(true);
  });

  it('keeps units of one firm away from another firm and from crew', async () => {
    const property = await newProperty();
    const unit = await post(`/api/properties/${property.id}/units`, { kind: 'sanctuary', name: 'No-go', geometry: rectangle(-90.938, 43.262, 200, 200) });
    const other = await makeFirm();
    const outsider = await signedInAgent(other.users.owner.email, PASSWORD);
    await outsider.get(`/api/properties/${property.id}/units`).expect(404);
    const stolen = await outsider.patch(`/api/units/${unit.body.data.id}`).set('X-CSRF-Token', outsider.csrf).send({ name: 'Mine now' });
    expect(stolen.status).toBe(404);
    await outsider.delete(`/api/units/${unit.body.data.id}`).set('X-CSRF-Token', outsider.csrf).expect(404);
    const crew = await signedInAgent(ctx.users.crew.email, PASSWORD);
    await crew.get(`/api/properties/${property.id}/units`).expect(403);
    const still = await consultant.get(`/api/units/${unit.body.data.id}`).expect(200);
    expect(still.body.data.name).toBe('No-go');
  });
});

describe('imports and exports', () => {
  const kml = `<?xml version="1.0" encoding="UTF-8"?>
<kml xmlns="http://www.opengis.net/kml/2.2"><Document>
<Placemark><name>Boundary</name><Polygon><outerBoundaryIs><LinearRing><coordinates>-90.94,43.26 -90.93,43.26 -90.93,43.27 -90.94,43.27 -90.94,43.26</coordinates></LinearRing></outerBoundaryIs></Polygon></Placemark>
<Placemark><name>Creek crossing</name><Point><coordinates>-90.935,43.265</coordinates></Point></Placemark>
</Document></kml>`;

  it('previews the features of a KML upload', async () => {
    const property = await newProperty();
    const res = await consultant.post(`/api/properties/${property.id}/imports`).set('X-CSRF-Token', consultant.csrf).attach('file', Buffer.from(kml), 'walk.kml');
    expect(res.status).toBe(200);
    expect(res.body.data.format).toBe('kml');
    expect(res.body.data.features.map((f: { name: string; family: string }) => [f.name, f.family])).toEqual([
      ['Boundary', 'area'],
      ['Creek crossing', 'point'],
    ]);
  });

  it('answers 415 to a file that is not geometry, 422 to a damaged one, 413 to an over-size one', async () => {
    const property = await newProperty();
    const url = `/api/properties/${property.id}/imports`;
    const exe = await consultant.post(url).set('X-CSRF-Token', consultant.csrf).attach('file', Buffer.concat([Buffer.from('MZ'), Buffer.alloc(200)]), 'plan.kml');
    expect(exe.status).toBe(415);
    const broken = await consultant.post(url).set('X-CSRF-Token', consultant.csrf).attach('file', Buffer.from('<kml xmlns="http://www.opengis.net/kml/2.2"><Document><Placemark>'), 'broken.kml');
    expect(broken.status).toBe(422);
    expect(broken.body.error.length).toBeGreaterThan(20);
    const huge = await consultant.post(url).set('X-CSRF-Token', consultant.csrf).attach('file', Buffer.alloc(26 * 1024 * 1024, 32), 'huge.geojson');
    expect(huge.status).toBe(413);
  });

  it('exports every format, and each one opens', async () => {
    const property = await newProperty();
    await post(`/api/properties/${property.id}/units/bulk`, {
      units: [
        { kind: 'food-plot', name: 'Clover & chicory', geometry: rectangle(-90.938, 43.262, 120, 80) },
        { kind: 'access-route', name: 'Walk-in', geometry: { type: 'LineString', coordinates: [[-90.939, 43.261], [-90.934, 43.263]] } },
        { kind: 'stand-site', name: 'Ridge stand', geometry: { type: 'Point', coordinates: [-90.936, 43.263] } },
      ],
    });
    const geojson = await consultant.get(`/api/properties/${property.id}/export?format=geojson`).buffer(true).expect(200);
    const fc = JSON.parse(geojson.text || geojson.body.toString());
    expect(fc.type).toBe('FeatureCollection');
    expect(fc.features.length).toBeGreaterThanOrEqual(3);
    const kmlOut = await consultant.get(`/api/properties/${property.id}/export?format=kml`).buffer(true).parse((res, cb) => { let d = ''; res.on('data', (c: Buffer) => (d += c)); res.on('end', () => cb(null, d)); });
    const kmlDoc = new DOMParser().parseFromString(kmlOut.body as string, 'text/xml');
    expect(kmlDoc.documentElement!.namespaceURI).toBe('http://www.opengis.net/kml/2.2');
    expect(kmlOut.body).toContain('Clover &amp; chicory');
    const gpx = await consultant.get(`/api/properties/${property.id}/export?format=gpx`).buffer(true).parse((res, cb) => { let d = ''; res.on('data', (c: Buffer) => (d += c)); res.on('end', () => cb(null, d)); });
    const gpxDoc = new DOMParser().parseFromString(gpx.body as string, 'text/xml');
    expect(gpxDoc.documentElement!.namespaceURI).toBe('http://www.topografix.com/GPX/1/1');
    expect(gpxDoc.getElementsByTagName('wpt').length).toBe(1);
    const csv = await consultant.get(`/api/properties/${property.id}/export?format=csv`).buffer(true).parse((res, cb) => { let d = ''; res.on('data', (c: Buffer) => (d += c)); res.on('end', () => cb(null, d)); });
    expect(csv.headers['content-disposition']).toMatch(/attachment; filename=".*\.csv"/);
    expect((csv.body as string).trim().split('\r\n')).toHaveLength(4);
    const bad = await consultant.get(`/api/properties/${property.id}/export?format=shp`);
    expect(bad.status).toBe(422);
  });
});

describe('imagery', () => {
  it('takes a GeoTIFF and answers its corners in longitude/latitude', async () => {
    const property = await newProperty();
    const width = 4;
    const height = 3;
    const values = new Uint8Array(width * height * 3).fill(120);
    const tiff = writeArrayBuffer(values, {
      width,
      height,
      SamplesPerPixel: 3,
      PhotometricInterpretation: 2,
      ModelPixelScale: [0.001, 0.001, 0],
      ModelTiepoint: [0, 0, 0, -90.94, 43.27, 0],
      GeographicTypeGeoKey: 4326,
      GTModelTypeGeoKey: 2,
    } as never);
    const res = await consultant.post(`/api/properties/${property.id}/overlays`).set('X-CSRF-Token', consultant.csrf).attach('file', Buffer.from(tiff), 'drone.tif');
    expect(res.status).toBe(201);
    const [tl, tr, br, bl] = res.body.data.corners;
    expect(tl[0]).toBeCloseTo(-90.94, 6);
    expect(tl[1]).toBeCloseTo(43.27, 6);
    expect(tr[0]).toBeCloseTo(-90.936, 6);
    expect(br[1]).toBeCloseTo(43.267, 6);
    expect(bl[0]).toBeCloseTo(-90.94, 6);
    const image = await consultant.get(res.body.data.imageUrl).expect(200);
    expect(image.headers['content-type']).toBe('image/png');
  });

  it('needs corners for a PNG, refuses a non-image with 415, and keeps other firms out', async () => {
    const property = await newProperty();
    const png = Buffer.from(encode({ width: 2, height: 2, data: new Uint8Array(12).fill(200), channels: 3 }));
    const url = `/api/properties/${property.id}/overlays`;
    const noCorners = await consultant.post(url).set('X-CSRF-Token', consultant.csrf).attach('file', png, 'ortho.png');
    expect(noCorners.status).toBe(422);
    expect(noCorners.body.error).toMatch(/corners/);
    const withCorners = await consultant.post(url).set('X-CSRF-Token', consultant.csrf).field('corners', JSON.stringify([[-90.94, 43.27], [-90.93, 43.27], [-90.93, 43.26], [-90.94, 43.26]])).attach('file', png, 'ortho.png');
    expect(withCorners.status).toBe(201);
    const text = await consultant.post(url).set('X-CSRF-Token', consultant.csrf).attach('file', Buffer.from('just words, not pixels'), 'ortho.png');
    expect(text.status).toBe(415);
    const other = await makeFirm();
    const outsider = await signedInAgent(other.users.owner.email, PASSWORD);
    await outsider.get(withCorners.body.data.imageUrl).expect(404);
  });

  it('lets the owner set a tile service, whose origin the content security policy then allows', async () => {
    const owner = await signedInAgent(ctx.users.owner.email, PASSWORD);
    const bad = await owner.patch('/api/firm/settings').set('X-CSRF-Token', owner.csrf).send({ tileUrlTemplate: 'https://tiles.example.test/tiles.png' });
    expect(bad.status).toBe(422);
    expect(bad.body.error).toMatch(/\{z\}/);
    const notOwner = await consultant.patch('/api/firm/settings').set('X-CSRF-Token', consultant.csrf).send({ tileUrlTemplate: null });
    expect(notOwner.status).toBe(403);
    const ok = await owner.patch('/api/firm/settings').set('X-CSRF-Token', owner.csrf).send({ tileUrlTemplate: 'https://imagery.fernhill.test/{z}/{x}/{y}.jpg' });
    expect(ok.status).toBe(200);
    expect(ok.body.data.settings.tileUrlTemplate).toBe('https://imagery.fernhill.test/{z}/{x}/{y}.jpg');
    // The firm's own requests allow its tile service; nobody else's policy is widened by it.
    const csp = (await owner.get('/api/firm')).headers['content-security-policy'];
    expect(csp).toMatch(/connect-src 'self' https:\/\/imagery\.fernhill\.test/);
    expect((await request(testApp()).get('/api/health')).headers['content-security-policy']).not.toMatch(/imagery\.fernhill\.test/);
  });
});

describe('the plan summary PDF', () => {
  it('renders the property, its acres and its units, with page numbers', async () => {
    const { execFileSync } = await import('node:child_process');
    const property = await newProperty();
    await post(`/api/properties/${property.id}/units`, { kind: 'food-plot', name: 'Ridge clover', geometry: rectangle(-90.938, 43.262, 120, 80) });
    const res = await consultant.get(`/api/properties/${property.id}/plan.pdf`).buffer(true).parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => cb(null, Buffer.concat(chunks)));
    });
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    const pdf = res.body as Buffer;
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
    const text = execFileSync('pdftotext', ['-layout', '-', '-'], { input: pdf }).toString();
    expect(text).toContain(property.name);
    expect(text).toContain('Ridge clover');
    expect(text).toContain(`${property.acres!.toFixed(1)} acres`);
    expect(text).toMatch(/Page 1 of \d/);
  });
});
