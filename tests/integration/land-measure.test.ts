/**
 * Exact land measure through the API: acres on the ellipsoid (against PostGIS geography and
 * GeographicLib), positions with an altitude, confirmation of absurd sizes, and the re-measure of
 * numbers stored the old way.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import type { Polygon, Position } from 'geojson';
import { signedInAgent, type Agent } from '../support/test-app';
import { makeFirm, PASSWORD } from '../support/factories';
import { destination, ellipsoidAreaSqM, squareOfAcres } from '../support/geo-fixtures';
import { sequelize } from '../../server/db/sequelize';
import { remeasureStoredMeasures } from '../../server/commands/measure-refresher';
import { SQ_M_PER_ACRE } from '../../shared/units';

let consultant: Agent;
let owner: Agent;
let ctx: Awaited<ReturnType<typeof makeFirm>>;
const send = (agent: Agent, method: 'post' | 'patch', url: string, body: unknown) => agent[method](url).set('X-CSRF-Token', agent.csrf).send(body as object);

/** Metres per statute mile, 5,280 × 0.3048 (NIST Handbook 44, App. C). */
const METRES_PER_MILE = 1609.344;

/** A one-mile square (a nominal PLSS section, 640 acres) with its south-west corner at lat, lon. */
function section(lat: number, lon: number): Polygon {
  const ne = destination(lat, lon, 90, METRES_PER_MILE);
  const nw = destination(lat, lon, 0, METRES_PER_MILE);
  return { type: 'Polygon', coordinates: [[[lon, lat], [ne.lon, ne.lat], [ne.lon, nw.lat], [nw.lon, nw.lat], [lon, lat]]] };
}

const withAltitude = (p: Polygon, z = 312.5): Polygon => ({ type: 'Polygon', coordinates: p.coordinates.map((ring) => ring.map(([lon, lat]): Position => [lon, lat, z])) });

async function newProperty(boundary: Polygon | null, extra: Record<string, unknown> = {}) {
  return send(consultant, 'post', '/api/properties', { clientId: ctx.client.id, name: `Measure ${Math.random()}`, boundary, ...extra });
}

beforeAll(async () => {
  ctx = await makeFirm();
  consultant = await signedInAgent(ctx.users.consultant.email, PASSWORD);
  owner = await signedInAgent(ctx.users.owner.email, PASSWORD);
});

describe('acres on the WGS84 ellipsoid', () => {
  it('stores a section at 48°N and at 61.5°N as PostGIS geography and GeographicLib measure it, within 0.01 %', async () => {
    for (const lat of [48, 61.5]) {
      const boundary = section(lat, -100);
      const res = await newProperty(boundary);
      expect(res.status).toBe(201);
      const reference = ellipsoidAreaSqM(boundary) / SQ_M_PER_ACRE; // GeographicLib PolygonArea (Karney 2013)
      const [row] = await sequelize.query<{ sqm: number }>('SELECT ST_Area(boundary::geography) AS sqm FROM properties WHERE id = :id', { replacements: { id: res.body.data.id }, type: QueryTypes.SELECT });
      const postgis = Number(row.sqm) / SQ_M_PER_ACRE; // PostGIS geography: area on the WGS84 spheroid
      expect(Math.abs(res.body.data.acres / reference - 1), `${lat}°N`).toBeLessThan(1e-4);
      expect(Math.abs(res.body.data.acres / postgis - 1), `${lat}°N`).toBeLessThan(1e-4);
      // 1 mi² = 640 acres (BLM Manual of Surveying Instructions; NIST HB 44); the turf sphere read 638.0 at 48°N
      expect(res.body.data.acres).toBeGreaterThan(639.5);
    }
  });
});

describe('positions with an altitude', () => {
  it('accepts [lon, lat, z] in a boundary, a unit, a bulk import and an edit, and stores them flat', async () => {
    const boundary = squareOfAcres(44.2, -90.6, 80);
    const created = await newProperty(withAltitude(boundary));
    expect(created.status).toBe(201);
    expect(created.body.data.boundary.coordinates[0][0][0]).toHaveLength(2);
    const id = created.body.data.id as number;

    const plot = withAltitude(squareOfAcres(44.2, -90.6, 2), 280);
    const one = await send(consultant, 'post', `/api/properties/${id}/units`, { kind: 'food-plot', name: 'High plot', geometry: plot });
    expect(one.status).toBe(201);
    expect(one.body.data.geometry.coordinates[0][0]).toHaveLength(2);
    expect(one.body.data.acres).toBeCloseTo(2, 3); // 2 acres by construction (GeographicLib square, NIST acre)

    const trail = { type: 'LineString', coordinates: [[-90.601, 44.199, 270], [-90.599, 44.201, 275.5]] };
    const bulk = await send(consultant, 'post', `/api/properties/${id}/units/bulk`, { units: [{ kind: 'access-route', name: 'Ridge trail', geometry: trail }, { kind: 'stand-site', name: 'Oak stand', geometry: { type: 'Point', coordinates: [-90.6, 44.2, 290] } }] });
    expect(bulk.status).toBe(201);
    expect(bulk.body.data[1].geometry.coordinates).toEqual([-90.6, 44.2]);

    const edited = await send(consultant, 'patch', `/api/units/${one.body.data.id}`, { geometry: withAltitude(squareOfAcres(44.2, -90.6, 3)) });
    expect(edited.status).toBe(200);
    expect(edited.body.data.acres).toBeCloseTo(3, 3);

    const moved = await send(consultant, 'patch', `/api/properties/${id}`, { boundary: withAltitude(squareOfAcres(44.2, -90.6, 90)) });
    expect(moved.status).toBe(200);
  });

  it('still refuses a position with more than an altitude, saying what a position is', async () => {
    const res = await newProperty({ type: 'Polygon', coordinates: [[[-90, 44, 1, 2], [-89.99, 44, 1, 2], [-89.99, 44.01, 1, 2], [-90, 44, 1, 2]]] } as unknown as Polygon);
    expect(res.status).toBe(422);
    expect(res.body.error).toMatch(/at most an altitude/);
  });
});

describe('absurd sizes need a confirmation', () => {
  // A boundary drawn at the map's opening zoom: about 2° × 2° around 40°N, millions of acres.
  const continental: Polygon = { type: 'Polygon', coordinates: [[[-99, 39], [-97, 39], [-97, 41], [-99, 41], [-99, 39]]] };

  it('answers 422 naming confirmLargeArea for a boundary over 20,000 acres, saves nothing, and keeps it when confirmed', async () => {
    const name = `Continental ${Date.now()}`;
    const refused = await send(consultant, 'post', '/api/properties', { clientId: ctx.client.id, name, boundary: continental });
    expect(refused.status).toBe(422);
    expect(refused.body.details).toEqual([expect.objectContaining({ path: 'confirmLargeArea' })]);
    expect(refused.body.error).toMatch(/^The boundary measures [\d,]+ acres, more than the 20,000 acres/);
    const list = await consultant.get('/api/properties').expect(200);
    expect(list.body.data.map((p: { name: string }) => p.name)).not.toContain(name);

    const kept = await send(consultant, 'post', '/api/properties', { clientId: ctx.client.id, name, boundary: continental, confirmLargeArea: true });
    expect(kept.status).toBe(201);
    expect(kept.body.data.acres).toBeGreaterThan(1_000_000);

    const small = await newProperty(squareOfAcres(44, -90, 300));
    const grown = await send(consultant, 'patch', `/api/properties/${small.body.data.id}`, { boundary: continental });
    expect(grown.status).toBe(422);
    expect(grown.body.details[0].path).toBe('confirmLargeArea');
    const after = await consultant.get(`/api/properties/${small.body.data.id}`).expect(200);
    expect(after.body.data.acres).toBeCloseTo(300, 2); // unchanged
  });

  it('uses the firm’s own threshold when the owner sets one', async () => {
    const set = await send(owner, 'patch', '/api/firm/settings', { largeAreaAcres: 500 });
    expect(set.status).toBe(200);
    expect(set.body.data.settings.largeAreaAcres).toBe(500);
    try {
      const refused = await newProperty(squareOfAcres(44, -90, 640));
      expect(refused.status).toBe(422);
      expect(refused.body.error).toMatch(/more than the 500\.0 acres this firm checks/);
      expect((await newProperty(squareOfAcres(44, -90, 400))).status).toBe(201);
    } finally {
      await send(owner, 'patch', '/api/firm/settings', { largeAreaAcres: 20000 }).expect(200);
    }
  });

  it('answers 422 for a unit larger than its property, naming the field (per unit in a bulk import)', async () => {
    const property = await newProperty(squareOfAcres(44.5, -91, 40));
    const id = property.body.data.id as number;
    const huge = squareOfAcres(44.5, -91, 60);
    const refused = await send(consultant, 'post', `/api/properties/${id}/units`, { kind: 'timber', name: 'Whole hillside', geometry: huge });
    expect(refused.status).toBe(422);
    expect(refused.body.details[0].path).toBe('confirmLargeArea');
    expect(refused.body.error).toMatch(/“Whole hillside” measures 60\.0 acres, more than the whole property \(40\.0 acres\)/);

    const bulk = await send(consultant, 'post', `/api/properties/${id}/units/bulk`, { units: [{ kind: 'food-plot', name: 'Fine', geometry: squareOfAcres(44.5, -91, 1) }, { kind: 'timber', name: 'Too big', geometry: huge }] });
    expect(bulk.status).toBe(422);
    expect(bulk.body.details[0].path).toBe('units.1.confirmLargeArea');
    const units = await consultant.get(`/api/properties/${id}/units`).expect(200);
    expect(units.body.data).toEqual([]); // one transaction: nothing saved

    expect((await send(consultant, 'post', `/api/properties/${id}/units`, { kind: 'timber', name: 'Whole hillside', geometry: huge, confirmLargeArea: true })).status).toBe(201);
    expect((await send(consultant, 'post', `/api/properties/${id}/units/bulk`, { units: [{ kind: 'timber', name: 'Too big', geometry: huge }], confirmLargeArea: true })).status).toBe(201);

    const plot = await send(consultant, 'post', `/api/properties/${id}/units`, { kind: 'food-plot', name: 'Plot', geometry: squareOfAcres(44.5, -91, 1) });
    const stretched = await send(consultant, 'patch', `/api/units/${plot.body.data.id}`, { geometry: huge });
    expect(stretched.status).toBe(422);
    expect(stretched.body.details[0].path).toBe('confirmLargeArea');
  });

  it('applies the firm’s threshold to a unit of a property without a boundary', async () => {
    const property = await newProperty(null);
    const res = await send(consultant, 'post', `/api/properties/${property.body.data.id}/units`, { kind: 'timber', name: 'Zoomed out', geometry: continental });
    expect(res.status).toBe(422);
    expect(res.body.details[0].path).toBe('confirmLargeArea');
  });
});

describe('numbers stored the old way', () => {
  it('are re-measured on the ellipsoid and the plan’s revision moves', async () => {
    const property = await newProperty(section(48, -101));
    const id = property.body.data.id as number;
    const unit = await send(consultant, 'post', `/api/properties/${id}/units`, { kind: 'food-plot', name: 'Plot', geometry: squareOfAcres(48.005, -100.99, 5) });
    // What turf's sphere stored before: 638.0 acres for the section, −0.29 % on the plot
    await sequelize.query('UPDATE properties SET acres = 638.0 WHERE id = :id', { replacements: { id } });
    await sequelize.query('UPDATE units SET acres = 4.9855 WHERE id = :id', { replacements: { id: unit.body.data.id } });
    const before = (await consultant.get(`/api/properties/${id}`).expect(200)).body.data;

    const changed = await sequelize.transaction((transaction) => remeasureStoredMeasures(sequelize, transaction));
    expect(changed.properties).toBeGreaterThanOrEqual(1);
    expect(changed.units).toBeGreaterThanOrEqual(1);

    const after = (await consultant.get(`/api/properties/${id}`).expect(200)).body.data;
    expect(after.acres).toBeCloseTo(property.body.data.acres, 3);
    expect(after.revision).toBe(before.revision + 1);
    const [u] = (await consultant.get(`/api/properties/${id}/units`).expect(200)).body.data;
    expect(u.acres).toBeCloseTo(5, 3); // 5 acres by construction (GeographicLib square, NIST acre)

    const again = await sequelize.transaction((transaction) => remeasureStoredMeasures(sequelize, transaction));
    expect(again).toEqual({ properties: 0, units: 0 }); // nothing left to change
  });
});
