/**
 * The map a consultant starts from: the firm's home area (settings and sign-up), imagery in one
 * choice (the CSP follows the firm's choice only), and aerial photos with a world file, their
 * visibility and printing flags, deletion with audit records, and the bad-input sentences.
 */
import { beforeAll, beforeEach, describe, expect, it } from 'vitest';
import crypto from 'node:crypto';
import { QueryTypes } from 'sequelize';
import { encode } from 'fast-png';
import request from 'supertest';
import { anonymousAgent, signedInAgent, testApp, type Agent } from '../support/test-app';
import { makeFirm, PASSWORD } from '../support/factories';
import { signedInFirm, type FirmContext } from '../support/firm-settings';
import { rectangle } from '../support/geodesy';
import { FirmSchema, OverlaySchema } from '../../shared/schemas/firm';
import { PlaceSchema } from '../../shared/schemas/places';
import { PUBLIC_IMAGERY } from '../../shared/domain/imagery';
import { AuditEvent, Firm, Overlay, User } from '../../server/models';
import { sequelize } from '../../server/db/sequelize';
import { DEMO_HOME_AREA, seedDemoMap } from '../../server/db/seeds/demo-map';

let ctx: FirmContext;
let owner: Agent;
let consultant: Agent;

beforeAll(async () => {
  ({ ctx, owner, consultant } = await signedInFirm('owner', 'consultant'));
});

async function newPropertyId(): Promise<number> {
  const res = await consultant
    .post('/api/properties')
    .set('X-CSRF-Token', consultant.csrf)
    .send({ clientId: ctx.client.id, name: `Map test ${Math.random()}`, county: 'Crawford', state: 'WI', region: 'midwest', boundary: rectangle(-90.94, 43.26, 600, 400) });
  expect(res.status).toBe(201);
  return res.body.data.id as number;
}

/**
 * A baseline grey TIFF with no GeoTIFF tags (TIFF 6.0, section 2 and 4: header, one IFD of nine
 * entries, one strip). geotiff's writer always adds tie points, so this one is made by hand.
 */
function plainTiff(width: number, height: number): Buffer {
  const entries: [number, number, number][] = [
    [256, 3, width], // ImageWidth
    [257, 3, height], // ImageLength
    [258, 3, 8], // BitsPerSample
    [259, 3, 1], // Compression: none
    [262, 3, 1], // PhotometricInterpretation: black is zero
    [273, 4, 0], // StripOffsets (filled below)
    [277, 3, 1], // SamplesPerPixel
    [278, 3, height], // RowsPerStrip
    [279, 4, width * height], // StripByteCounts
  ];
  const ifdSize = 2 + entries.length * 12 + 4;
  const pixels = 8 + ifdSize;
  const buf = Buffer.alloc(pixels + width * height, 0x80);
  buf.write('II', 0, 'latin1');
  buf.writeUInt16LE(42, 2);
  buf.writeUInt32LE(8, 4);
  buf.writeUInt16LE(entries.length, 8);
  entries.forEach(([tag, type, value], i) => {
    const at = 10 + i * 12;
    buf.writeUInt16LE(tag, at);
    buf.writeUInt16LE(type, at + 2);
    buf.writeUInt32LE(1, at + 4);
    if (type === 3) buf.writeUInt16LE(value, at + 8);
    else buf.writeUInt32LE(tag === 273 ? pixels : value, at + 8);
  });
  buf.writeUInt32LE(0, 10 + entries.length * 12);
  return buf;
}

const png = (width: number, height: number) => Buffer.from(encode({ width, height, data: new Uint8Array(width * height * 3).fill(180), channels: 3 }));

describe('the firm’s home area', () => {
  it('is set by the owner from a found county and answered in GET /api/firm', async () => {
    const [crawford] = (await consultant.get('/api/places').query({ q: 'Crawford County, WI' }).expect(200)).body.data.map((p: unknown) => PlaceSchema.parse(p));
    const res = await owner.patch('/api/firm/settings').set('X-CSRF-Token', owner.csrf).send({ homeArea: { name: crawford.name, bbox: crawford.bbox } });
    expect(res.status).toBe(200);
    const firm = FirmSchema.parse((await consultant.get('/api/firm').expect(200)).body.data);
    expect(firm.settings.homeArea).toEqual({ name: 'Crawford County, WI', bbox: crawford.bbox });
    // Cleared with null.
    const cleared = await owner.patch('/api/firm/settings').set('X-CSRF-Token', owner.csrf).send({ homeArea: null });
    expect(FirmSchema.parse(cleared.body.data).settings.homeArea).toBeNull();
  });

  it('refuses a box turned inside out, with a sentence, and a consultant may not set it', async () => {
    const bad = await owner.patch('/api/firm/settings').set('X-CSRF-Token', owner.csrf).send({ homeArea: { name: 'Backwards', bbox: [-90, 43, -91, 44] } });
    expect(bad.status).toBe(422);
    expect(bad.body.error).toMatch(/west edge must lie west/);
    const notOwner = await consultant.patch('/api/firm/settings').set('X-CSRF-Token', consultant.csrf).send({ homeArea: { name: 'X', bbox: [-91, 43, -90, 44] } });
    expect(notOwner.status).toBe(403);
  });

  it('the demo seed sets Crawford County, WI, whose box holds the county’s own (us-atlas via /api/places)', async () => {
    const [crawford] = (await consultant.get('/api/places').query({ q: 'Crawford County, WI' }).expect(200)).body.data;
    const [w, s, e, n] = DEMO_HOME_AREA.bbox;
    expect(w).toBeLessThanOrEqual(crawford.bbox[0]);
    expect(s).toBeLessThanOrEqual(crawford.bbox[1]);
    expect(e).toBeGreaterThanOrEqual(crawford.bbox[2]);
    expect(n).toBeGreaterThanOrEqual(crawford.bbox[3]);
    const other = await makeFirm();
    const firm = (await Firm.findByPk(other.firm.id))!;
    await sequelize.transaction((transaction) => seedDemoMap(firm, transaction));
    expect((await Firm.findByPk(other.firm.id))!.settings).toMatchObject({ homeArea: DEMO_HOME_AREA });
  });

  it('can be given at sign-up', async () => {
    await sequelize.query(`DELETE FROM rate_limit_hits WHERE key LIKE 'signup:%'`, { type: QueryTypes.DELETE });
    const email = `home-${crypto.randomBytes(5).toString('hex')}@example.test`;
    const agent = await anonymousAgent();
    const res = await agent
      .post('/api/signup')
      .set('X-CSRF-Token', agent.csrf)
      .send({ firmName: 'Kickapoo Habitat', name: 'Rae Lund', email, password: 'a long enough password', homeArea: { name: 'Vernon County, WI', bbox: [-91.28, 43.42, -90.31, 43.73] } });
    expect(res.status).toBe(202);
    const user = (await User.findOne({ where: { email } }))!;
    const firm = (await Firm.findByPk(user.firmId))!;
    expect(firm.settings).toMatchObject({ homeArea: { name: 'Vernon County, WI', bbox: [-91.28, 43.42, -90.31, 43.73] } });
  });
});

describe('imagery in one choice', () => {
  beforeEach(async () => {
    await owner.patch('/api/firm/settings').set('X-CSRF-Token', owner.csrf).send({ tileUrlTemplate: null, tileAttribution: null }).expect(200);
  });

  it('the public-domain national imagery: its template and credit are stored, and only this firm’s policy allows its origin', async () => {
    const res = await owner.patch('/api/firm/settings').set('X-CSRF-Token', owner.csrf).send({ tileUrlTemplate: PUBLIC_IMAGERY.tileUrlTemplate, tileAttribution: PUBLIC_IMAGERY.attribution });
    expect(res.status).toBe(200);
    expect(FirmSchema.parse(res.body.data).settings).toMatchObject({ tileUrlTemplate: PUBLIC_IMAGERY.tileUrlTemplate, tileAttribution: PUBLIC_IMAGERY.attribution });
    const csp = (await consultant.get('/api/firm')).headers['content-security-policy'] as string;
    expect(csp).toMatch(/img-src 'self' data: blob: https:\/\/basemap\.nationalmap\.gov/);
    const other = await makeFirm();
    const outsider = await signedInAgent(other.users.consultant.email, PASSWORD);
    expect((await outsider.get('/api/firm')).headers['content-security-policy']).not.toMatch(/nationalmap/);
    expect((await request(testApp()).get('/api/health')).headers['content-security-policy']).not.toMatch(/nationalmap/);
  });

  it('a WMTS RESTful address ({TileMatrix}/{TileRow}/{TileCol}, OGC 07-057r7) is stored as XYZ', async () => {
    const res = await owner
      .patch('/api/firm/settings')
      .set('X-CSRF-Token', owner.csrf)
      .send({ tileUrlTemplate: 'https://wmts.fernhill.test/ortho/default/GoogleMapsCompatible/{TileMatrix}/{TileRow}/{TileCol}.jpg' });
    expect(res.status).toBe(200);
    expect(res.body.data.settings.tileUrlTemplate).toBe('https://wmts.fernhill.test/ortho/default/GoogleMapsCompatible/{z}/{y}/{x}.jpg');
  });
});

describe('aerial photos', () => {
  const url = (id: number) => `/api/properties/${id}/overlays`;

  it('places a JPEG/PNG by its world file in UTM: 500,000 m E on zone 15’s central meridian is 93°W, northing 0 the equator (UTM definition)', async () => {
    const propertyId = await newPropertyId();
    // 100 × 100 pixels of 1 m; centre of the top-left pixel at (500000.5, 99.5): edges 500000–500100 E, 0–100 N.
    const res = await consultant.post(url(propertyId)).set('X-CSRF-Token', consultant.csrf).field('worldFile', '1\n0\n0\n-1\n500000.5\n99.5\n').field('epsg', '26915').attach('file', png(100, 100), 'drone.png');
    expect(res.status).toBe(201);
    const overlay = OverlaySchema.parse(res.body.data);
    const [tl, , , bl] = overlay.corners;
    expect(bl[0]).toBeCloseTo(-93, 7);
    expect(bl[1]).toBeCloseTo(0, 7);
    expect(tl[0]).toBeCloseTo(-93, 7);
    expect(tl[1]).toBeGreaterThan(0.0009); // 100 m north ≈ 0.000904° (1° of latitude at the equator ≈ 110,574 m, common practice)
    expect(tl[1]).toBeLessThan(0.00091);
    expect(overlay).toMatchObject({ visible: true, inDocuments: false });
    expect(await AuditEvent.count({ where: { action: 'overlay.added', firmId: ctx.firm.id, subjectId: propertyId } })).toBe(1);
  });

  it('answers each bad upload with a sentence: unknown projection, a world file without its EPSG, a broken world file, no georeferencing, too many pixels, not an image', async () => {
    const propertyId = await newPropertyId();
    const post = () => consultant.post(url(propertyId)).set('X-CSRF-Token', consultant.csrf);
    const unknown = await post().field('worldFile', '1\n0\n0\n-1\n500000\n100\n').field('epsg', '99999').attach('file', png(4, 4), 'a.png');
    expect(unknown.status).toBe(422);
    expect(unknown.body.error).toMatch(/EPSG:99999, a coordinate system Browseline does not know/);
    const noEpsg = await post().field('worldFile', '1\n0\n0\n-1\n500000\n100\n').attach('file', png(4, 4), 'a.png');
    expect(noEpsg.status).toBe(422);
    expect(noEpsg.body.error).toMatch(/EPSG code/);
    const broken = await post().field('worldFile', 'hello').field('epsg', '26915').attach('file', png(4, 4), 'a.png');
    expect(broken.status).toBe(422);
    expect(broken.body.error).toMatch(/six lines/);
    const noGeo = await post().attach('file', plainTiff(4, 3), 'plain.tif');
    expect(noGeo.status).toBe(422);
    expect(noGeo.body.error).toMatch(/no georeference/);
    const big = await post().field('corners', JSON.stringify([[-90.94, 43.27], [-90.93, 43.27], [-90.93, 43.26], [-90.94, 43.26]])).attach('file', png(8000, 6000), 'huge.png');
    expect(big.status).toBe(413);
    expect(big.body.error).toMatch(/at most 40 megapixels/);
    const text = await post().attach('file', Buffer.from('not a picture at all'), 'x.tif');
    expect(text.status).toBe(415);
    expect(text.body.error).toMatch(/not a GeoTIFF, PNG or JPEG/);
    expect((await consultant.get(url(propertyId)).expect(200)).body.data).toEqual([]);
  });

  it('hides, chooses for documents and deletes through commands with audit records', async () => {
    const propertyId = await newPropertyId();
    const created = await consultant.post(url(propertyId)).set('X-CSRF-Token', consultant.csrf).field('corners', JSON.stringify([[-90.94, 43.27], [-90.93, 43.27], [-90.93, 43.26], [-90.94, 43.26]])).attach('file', png(8, 8), 'ortho.png');
    expect(created.status).toBe(201);
    const id = created.body.data.id as number;
    const changed = await consultant.patch(`/api/overlays/${id}`).set('X-CSRF-Token', consultant.csrf).send({ visible: false, inDocuments: true, opacity: 0.6 });
    expect(changed.status).toBe(200);
    expect(OverlaySchema.parse(changed.body.data)).toMatchObject({ visible: false, inDocuments: true, opacity: 0.6 });
    expect(await AuditEvent.count({ where: { action: 'overlay.changed', firmId: ctx.firm.id, subjectId: propertyId } })).toBe(1);
    const badPatch = await consultant.patch(`/api/overlays/${id}`).set('X-CSRF-Token', consultant.csrf).send({ visible: 'yes' });
    expect(badPatch.status).toBe(422);
    const other = await makeFirm();
    const outsider = await signedInAgent(other.users.consultant.email, PASSWORD);
    expect((await outsider.delete(`/api/overlays/${id}`).set('X-CSRF-Token', outsider.csrf)).status).toBe(404);
    expect((await consultant.delete(`/api/overlays/${id}`).set('X-CSRF-Token', consultant.csrf)).status).toBe(204);
    expect(await Overlay.findByPk(id)).toBeNull();
    expect(await AuditEvent.count({ where: { action: 'overlay.deleted', firmId: ctx.firm.id, subjectId: propertyId } })).toBe(1);
  });
});
