import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { DOMParser, type Element as XmlElement } from '@xmldom/xmldom';
import { area, booleanClockwise } from '@turf/turf';
import type { Geometry, MultiPolygon, Polygon, Position } from 'geojson';
import JSZip from 'jszip';
import { describe, expect, it } from 'vitest';
import { KIND_STYLES } from '../../../shared/domain/unit-kinds';
import {
  GPX_NAMESPACE,
  GeoFileError,
  KML_NAMESPACE,
  isGeoFileError,
  kmlColor,
  readGeoFile,
  writeGeoFile,
  type ExportUnit,
  type GeoFileReadResult,
  type ImportedFeature,
  type PlanExport,
} from '../../../server/services/geo-files';
import { generateLargeKml } from '../../support/geo-fixtures-large';
import { buildPolygonShapefile } from '../../support/shapefile-bytes';

const fixture = (name: string): Buffer => readFileSync(fileURLToPath(new URL(`../../fixtures/geo/${name}`, import.meta.url)));

// Tolerance of the round trips: the exporters keep 7 decimals, so a coordinate moves at most 5e-8°
// (the brief's 1e-7; 1e-7° of latitude is about 1.1 cm).
const TOLERANCE_DEG = 1e-7;

const closeTo = (a: Position, b: Position, tolerance = TOLERANCE_DEG): boolean =>
  Math.abs(a[0] - b[0]) <= tolerance && Math.abs(a[1] - b[1]) <= tolerance;

/** Same ring, allowing the exporter to have reversed it (rewinding keeps the start vertex). */
function sameRing(actual: Position[], expected: Position[]): boolean {
  if (actual.length !== expected.length) return false;
  const forward = actual.every((p, i) => closeTo(p, expected[i]));
  const reversed = [...actual].reverse().every((p, i) => closeTo(p, expected[i]));
  return forward || reversed;
}

function samePolygons(actual: Position[][][], expected: Position[][][]): boolean {
  return (
    actual.length === expected.length &&
    actual.every((rings, i) => rings.length === expected[i].length && rings.every((ring, j) => sameRing(ring, expected[i][j])))
  );
}

/** Geometry equality within the tolerance, ignoring ring direction. */
function sameGeometry(actual: Geometry, expected: Geometry): boolean {
  if (actual.type !== expected.type) return false;
  switch (expected.type) {
    case 'Point':
      return closeTo((actual as typeof expected).coordinates, expected.coordinates);
    case 'LineString': {
      const a = (actual as typeof expected).coordinates;
      return a.length === expected.coordinates.length && a.every((p, i) => closeTo(p, expected.coordinates[i]));
    }
    case 'MultiLineString': {
      const a = (actual as typeof expected).coordinates;
      return a.length === expected.coordinates.length && a.every((l, i) => l.length === expected.coordinates[i].length && l.every((p, j) => closeTo(p, expected.coordinates[i][j])));
    }
    case 'Polygon':
      return samePolygons([(actual as Polygon).coordinates], [expected.coordinates]);
    case 'MultiPolygon':
      return samePolygons((actual as MultiPolygon).coordinates, expected.coordinates);
    default:
      return false;
  }
}

async function expectGeoFileError(run: () => Promise<unknown> | unknown, status: number, pattern: RegExp): Promise<GeoFileError> {
  try {
    await run();
  } catch (error) {
    expect(isGeoFileError(error)).toBe(true);
    const e = error as GeoFileError;
    expect(e.status).toBe(status);
    expect(e.message).toMatch(pattern);
    return e;
  }
  throw new Error('expected a GeoFileError');
}

const byName = (result: GeoFileReadResult, name: string): ImportedFeature => {
  const found = result.features.filter((f) => f.name === name);
  expect(found, `feature named ${name}`).toHaveLength(1);
  return found[0];
};

// ---------------------------------------------------------------------------------------------
// A sample plan (invented demo data). Polygons are given CLOCKWISE on purpose, with more than 7
// decimals, so that the exporters' rewinding and rounding are exercised.
// ---------------------------------------------------------------------------------------------
const PLOT: Polygon = {
  type: 'Polygon',
  coordinates: [
    // exterior, clockwise: up the west side first
    [[-93.450000012, 41.050000049], [-93.450000012, 41.054000049], [-93.445000012, 41.054000049], [-93.445000012, 41.050000049], [-93.450000012, 41.050000049]],
    // hole centred in the exterior, counter-clockwise
    [[-93.448000012, 41.051500049], [-93.447000012, 41.051500049], [-93.447000012, 41.052500049], [-93.448000012, 41.052500049], [-93.448000012, 41.051500049]],
  ],
};
const TIMBER: MultiPolygon = {
  type: 'MultiPolygon',
  coordinates: [
    [[[-93.4400001, 41.0500001], [-93.4400001, 41.0520001], [-93.4380001, 41.0520001], [-93.4400001, 41.0500001]]],
    [[[-93.4360001, 41.0500001], [-93.4360001, 41.0520001], [-93.4340001, 41.0520001], [-93.4360001, 41.0500001]]],
  ],
};
const BOUNDARY: Polygon = {
  type: 'Polygon',
  coordinates: [[[-93.46, 41.045], [-93.46, 41.065], [-93.43, 41.065], [-93.43, 41.045], [-93.46, 41.045]]],
};
const UNITS: ExportUnit[] = [
  { id: 'u-plot', name: 'Creek bottom clover', kind: 'food-plot', geometry: PLOT, acres: 3.14159 },
  { id: 'u-timber', name: 'South hardwoods', kind: 'timber', geometry: TIMBER, acres: 11.5 },
  {
    id: 'u-route',
    name: 'Ridge walk-in',
    kind: 'access-route',
    geometry: { type: 'LineString', coordinates: [[-93.452123456, 41.058123456], [-93.449, 41.057], [-93.4465, 41.0562]] },
    lengthFt: 1234.56,
  },
  {
    id: 'u-fence',
    name: 'North fence',
    kind: 'fence',
    geometry: { type: 'MultiLineString', coordinates: [[[-93.455, 41.06], [-93.445, 41.06]], [[-93.445, 41.0605], [-93.44, 41.0605]]] },
    lengthFt: 3000,
  },
  { id: 'u-stand', name: 'Big oak stand', kind: 'stand-site', geometry: { type: 'Point', coordinates: [-93.446, 41.056] }, notes: 'Ladder, 18 ft; "east" wind' },
  { id: 'u-cam', name: 'Cam <north> & "east"', kind: 'camera-site', geometry: { type: 'Point', coordinates: [-93.4421234567, 41.0531234567] } },
];
const PLAN: PlanExport = { propertyName: 'Walnut Ridge & Creek — Tract 2', boundary: BOUNDARY, units: UNITS };

/** Round-trip checks shared by every format the importer reads back. */
function expectRoundTrip(result: GeoFileReadResult): void {
  expect(result.features).toHaveLength(UNITS.length + 1); // every unit plus the boundary
  expect(result.skipped).toEqual([]);
  for (const unit of UNITS) {
    const imported = byName(result, unit.name);
    expect(imported.kind).toBe(unit.kind);
    expect(imported.family).toBe(KIND_STYLES[unit.kind].family);
    expect(sameGeometry(imported.geometry, unit.geometry), `${unit.name} geometry`).toBe(true);
  }
  const boundary = byName(result, PLAN.propertyName);
  expect(boundary.family).toBe('area');
  expect(sameGeometry(boundary.geometry, BOUNDARY)).toBe(true);
}

async function kmzOf(kml: string, path = 'doc.kml', extra: Record<string, string> = {}): Promise<Buffer> {
  const zip = new JSZip();
  zip.file(path, kml);
  for (const [name, content] of Object.entries(extra)) zip.file(name, content);
  return zip.generateAsync({ type: 'nodebuffer', compression: 'DEFLATE' });
}

describe('writeGeoFile and readGeoFile round trips', () => {
  it('GeoJSON comes back with the same features, kinds and coordinates', async () => {
    const out = writeGeoFile('geojson', PLAN);
    const result = await readGeoFile({ filename: out.filename, buffer: Buffer.from(out.body) });
    expect(result.format).toBe('geojson');
    expectRoundTrip(result);
  });

  it('KML comes back with the same features, kinds and coordinates', async () => {
    const out = writeGeoFile('kml', PLAN);
    const result = await readGeoFile({ filename: out.filename, buffer: Buffer.from(out.body) });
    expect(result.format).toBe('kml');
    expectRoundTrip(result);
  });

  it('KMZ zipped in the test from the KML export comes back the same', async () => {
    const out = writeGeoFile('kml', PLAN);
    const result = await readGeoFile({ filename: 'tract-2.kmz', buffer: await kmzOf(String(out.body)) });
    expect(result.format).toBe('kmz');
    expectRoundTrip(result);
  });

  it('GPX comes back with the same features; closed area tracks become areas again', async () => {
    const out = writeGeoFile('gpx', PLAN);
    const result = await readGeoFile({ filename: out.filename, buffer: Buffer.from(out.body) });
    expect(result.format).toBe('gpx');
    expectRoundTrip(result);
    expect(byName(result, 'Creek bottom clover').geometry.type).toBe('Polygon');
    expect(byName(result, 'South hardwoods').geometry.type).toBe('MultiPolygon');
  });

  it('CSV parses back (RFC 4180) to one row per unit with kinds and centroids', () => {
    const out = writeGeoFile('csv', PLAN);
    const rows = parseCsv(String(out.body).replace(/^\uFEFF/, ''));
    expect(rows[0]).toEqual(['id', 'name', 'kind', 'family', 'acres', 'lengthFt', 'centroidLat', 'centroidLon', 'notes', 'observedAt']);
    expect(rows).toHaveLength(UNITS.length + 1);
    const row = (id: string) => {
      const r = rows.find((x) => x[0] === id);
      expect(r, id).toBeDefined();
      return Object.fromEntries(rows[0].map((h, i) => [h, r![i]]));
    };
    UNITS.forEach((u) => expect(row(String(u.id)).kind).toBe(u.kind));
    // Centroid of a point unit is the point itself (definition).
    expect(Number(row('u-cam').centroidLat)).toBeCloseTo(41.0531234567, 7);
    expect(Number(row('u-cam').centroidLon)).toBeCloseTo(-93.4421234567, 7);
    // The plot is a rectangle with a hole centred in it: by symmetry its centroid is the
    // rectangle's centre (elementary geometry, no source needed beyond symmetry).
    expect(Math.abs(Number(row('u-plot').centroidLat) - 41.052000049)).toBeLessThanOrEqual(TOLERANCE_DEG);
    expect(Math.abs(Number(row('u-plot').centroidLon) - -93.447500012)).toBeLessThanOrEqual(TOLERANCE_DEG);
    // The timber is two equal right triangles 0.004° apart: each centroid is the mean of its three
    // corners, and the whole is their midpoint (elementary geometry).
    expect(Math.abs(Number(row('u-timber').centroidLon) - (-93.4373334333333))).toBeLessThanOrEqual(TOLERANCE_DEG);
    expect(Math.abs(Number(row('u-timber').centroidLat) - 41.0513334333333)).toBeLessThanOrEqual(TOLERANCE_DEG);
    // Acres to 2 decimals, feet to 0 decimals (the export's stated rounding).
    expect(row('u-plot').acres).toBe('3.14');
    expect(row('u-route').lengthFt).toBe('1235');
    expect(row('u-route').acres).toBe('');
    expect(row('u-stand').notes).toBe('Ladder, 18 ft; "east" wind');
    expect(row('u-stand').family).toBe('point');
  });
});

/** Minimal RFC 4180 parser: quoted fields, doubled quotes, CRLF records. */
function parseCsv(text: string): string[][] {
  const rows: string[][] = [];
  let row: string[] = [];
  let field = '';
  let quoted = false;
  for (let i = 0; i < text.length; i += 1) {
    const c = text[i];
    if (quoted) {
      if (c === '"' && text[i + 1] === '"') {
        field += '"';
        i += 1;
      } else if (c === '"') quoted = false;
      else field += c;
    } else if (c === '"') quoted = true;
    else if (c === ',') {
      row.push(field);
      field = '';
    } else if (c === '\r' && text[i + 1] === '\n') {
      row.push(field);
      rows.push(row);
      row = [];
      field = '';
      i += 1;
    } else field += c;
  }
  if (field !== '' || row.length > 0) rows.push([...row, field]);
  return rows;
}

describe('export formats follow their standards', () => {
  it('GeoJSON: a FeatureCollection without crs, right-hand-rule rings, 2-D positions, ≤ 7 decimals (RFC 7946)', () => {
    const out = writeGeoFile('geojson', PLAN);
    expect(out.contentType).toBe('application/geo+json'); // RFC 7946 §12
    expect(out.filename).toBe('walnut-ridge-and-creek-tract-2.geojson');
    const body = String(out.body);
    const data = JSON.parse(body);
    expect(data.type).toBe('FeatureCollection');
    expect('crs' in data).toBe(false); // RFC 7946 §4: the crs member is gone; WGS84 lon/lat only
    expect(body).not.toMatch(/\d\.\d{8,}/); // our 7-decimal precision (RFC 7946 §11.2 suggests 6 is enough)
    let polygonsChecked = 0;
    for (const feature of data.features) {
      expect(feature.type).toBe('Feature');
      const g = feature.geometry as Geometry;
      const polygons = g.type === 'Polygon' ? [g.coordinates] : g.type === 'MultiPolygon' ? g.coordinates : [];
      for (const [exterior, ...holes] of polygons) {
        // RFC 7946 §3.1.6: exterior rings counter-clockwise, holes clockwise.
        expect(booleanClockwise(exterior)).toBe(false);
        holes.forEach((hole) => expect(booleanClockwise(hole)).toBe(true));
        polygonsChecked += 1;
      }
      const positions = JSON.stringify((g as Exclude<Geometry, { type: 'GeometryCollection' }>).coordinates).match(/\[[^[\]]+\]/g) ?? [];
      positions.forEach((p) => expect(JSON.parse(p)).toHaveLength(2));
    }
    expect(polygonsChecked).toBe(4); // plot, two timber parts, boundary
    const plot = data.features.find((f: { id: string }) => f.id === 'u-plot');
    expect(plot.properties).toMatchObject({ kind: 'food-plot', name: 'Creek bottom clover', acres: 3.14, lengthFt: null });
  });

  it('KML: parses with the KML 2.2 namespace, a style per kind in aabbggrr, a folder per kind, escaped text', () => {
    const out = writeGeoFile('kml', PLAN);
    expect(out.contentType).toBe('application/vnd.google-earth.kml+xml'); // IANA media type registration
    const doc = new DOMParser().parseFromString(String(out.body), 'text/xml');
    const root = doc.documentElement!;
    expect(root.localName).toBe('kml');
    expect(root.namespaceURI).toBe('http://www.opengis.net/kml/2.2'); // OGC KML 2.2 (OGC 07-147r2)
    const all = (name: string) => Array.from(doc.getElementsByTagNameNS(KML_NAMESPACE, name)) as XmlElement[];
    const styleIds = all('Style').map((s) => s.getAttribute('id'));
    for (const unit of UNITS) expect(styleIds).toContain(`kind-${unit.kind}`);
    // KML colours are aabbggrr (KML 2.2 reference, <color>): food-plot fill #8DB255 at 0.55
    // opacity → alpha round(0.55 × 255) = 140 = 0x8c, then bb=55 gg=b2 rr=8d (worked by hand).
    expect(kmlColor('#8DB255', 0.55)).toBe('8c55b28d');
    const foodPlotStyle = all('Style').find((s) => s.getAttribute('id') === 'kind-food-plot')!;
    expect(foodPlotStyle.getElementsByTagNameNS(KML_NAMESPACE, 'PolyStyle')[0].textContent).toBe('8c55b28d');
    const folderNames = all('Folder').map((f) => f.getElementsByTagNameNS(KML_NAMESPACE, 'name')[0].textContent);
    expect(folderNames).toEqual(['Property boundary', 'Food plot', 'Timber', 'Access route', 'Fence or edge', 'Stand site', 'Camera site']);
    expect(all('Placemark')).toHaveLength(UNITS.length + 1);
    const names = all('Placemark').map((p) => p.getElementsByTagNameNS(KML_NAMESPACE, 'name')[0].textContent);
    expect(names).toContain('Cam <north> & "east"'); // survived XML escaping
    const kinds = all('Data').filter((d) => d.getAttribute('name') === 'kind').map((d) => d.textContent);
    expect(kinds.sort()).toEqual([...UNITS.map((u) => u.kind), 'boundary'].sort());
  });

  it('GPX: parses with the GPX 1.1 namespace; points are waypoints, lines and areas are tracks', () => {
    const out = writeGeoFile('gpx', PLAN);
    const doc = new DOMParser().parseFromString(String(out.body), 'text/xml');
    const root = doc.documentElement!;
    expect(root.localName).toBe('gpx');
    expect(root.namespaceURI).toBe('http://www.topografix.com/GPX/1/1'); // GPX 1.1 schema
    expect(root.getAttribute('version')).toBe('1.1');
    expect(root.getAttribute('creator')).toBe('Browseline');
    const all = (name: string) => Array.from(doc.getElementsByTagNameNS(GPX_NAMESPACE, name)) as XmlElement[];
    const waypoints = all('wpt');
    expect(waypoints).toHaveLength(2);
    for (const wpt of waypoints) {
      expect(Math.abs(Number(wpt.getAttribute('lat')))).toBeLessThanOrEqual(90);
      expect(Math.abs(Number(wpt.getAttribute('lon')))).toBeLessThanOrEqual(180);
      // GPX 1.1 wptType is a sequence: … name, cmt, desc, src, link, sym, type …
      const order = Array.from(wpt.childNodes as unknown as ArrayLike<XmlElement>)
        .filter((n) => n.nodeType === 1)
        .map((n) => n.localName);
      expect(order.indexOf('name')).toBeLessThan(order.indexOf('sym'));
      expect(order.indexOf('sym')).toBeLessThan(order.indexOf('type'));
    }
    expect(waypoints.map((w) => w.getElementsByTagNameNS(GPX_NAMESPACE, 'type')[0].textContent).sort()).toEqual(['camera-site', 'stand-site']);
    const tracks = all('trk');
    expect(tracks).toHaveLength(5); // route, fence, plot, timber, boundary
    // In the GPX 1.1 schema all wpt elements come before any trk.
    expect(String(out.body).lastIndexOf('<wpt')).toBeLessThan(String(out.body).indexOf('<trk>'));
    const plotTrack = tracks.find((t) => t.getElementsByTagNameNS(GPX_NAMESPACE, 'name')[0].textContent === 'Creek bottom clover')!;
    const segments = Array.from(plotTrack.getElementsByTagNameNS(GPX_NAMESPACE, 'trkseg')) as XmlElement[];
    expect(segments).toHaveLength(2); // outer ring and hole
    for (const seg of segments) {
      const pts = Array.from(seg.getElementsByTagNameNS(GPX_NAMESPACE, 'trkpt')) as XmlElement[];
      expect(pts[0].getAttribute('lat')).toBe(pts[pts.length - 1].getAttribute('lat'));
      expect(pts[0].getAttribute('lon')).toBe(pts[pts.length - 1].getAttribute('lon'));
    }
  });

  it('CSV: RFC 4180 quoting, CRLF records and formula-injection guard on text cells only', () => {
    const plan: PlanExport = {
      propertyName: 'Guard test',
      units: [
        { id: '=1+1', name: '=HYPERLINK("http://example.invalid")', kind: 'gate', geometry: { type: 'Point', coordinates: [-93.4, 41.05] }, notes: '+call' },
        { id: 'n2', name: '-2 trees', kind: 'camera-site', geometry: { type: 'Point', coordinates: [-93.41, 41.06] }, notes: '@SUM(A1)' },
        { id: 'n3', name: 'Line\nbreak, comma', kind: 'mock-scrape', geometry: { type: 'Point', coordinates: [-93.42, 41.07] }, notes: '\tTabbed' },
      ],
    };
    const out = writeGeoFile('csv', plan);
    const body = String(out.body);
    expect(out.contentType).toBe('text/csv; charset=utf-8');
    expect(body.startsWith('\uFEFF')).toBe(true); // BOM so spreadsheets read UTF-8: common practice, no source
    expect(body.replace(/\r\n/g, '').includes('\r')).toBe(false); // RFC 4180 §2: records end in CRLF
    const rows = parseCsv(body.slice(1));
    // OWASP "CSV Injection": cells starting with = + - @ tab or CR get a leading single quote.
    expect(rows[1][0]).toBe("'=1+1");
    expect(rows[1][1]).toBe('\'=HYPERLINK("http://example.invalid")');
    expect(rows[1][8]).toBe("'+call");
    expect(rows[2][1]).toBe("'-2 trees");
    expect(rows[2][8]).toBe("'@SUM(A1)");
    expect(rows[3][8]).toBe("'\tTabbed");
    expect(rows[3][1]).toBe('Line\nbreak, comma'); // quoted field with a line break and a comma (RFC 4180 §2.6)
    // Numeric cells are not prefixed, even negative longitudes.
    expect(rows[1][7]).toBe('-93.4');
  });

  it('file names are the slugified property name plus the extension', () => {
    expect(writeGeoFile('kml', { ...PLAN, propertyName: 'Côte Brûlée / Lot #7' }).filename).toBe('cote-brulee-lot-7.kml');
    expect(writeGeoFile('gpx', { ...PLAN, propertyName: '../../etc' }).filename).toBe('etc.gpx');
    expect(writeGeoFile('csv', { ...PLAN, propertyName: '***' }).filename).toBe('plan.csv');
  });

  it('refuses an unknown format (400) and a unit whose geometry does not fit its kind (422)', async () => {
    await expectGeoFileError(() => writeGeoFile('shp', PLAN), 400, /choose geojson, kml, gpx or csv/);
    const wrong: PlanExport = { propertyName: 'x', units: [{ id: 1, name: 'Plot', kind: 'food-plot', geometry: { type: 'Point', coordinates: [-93, 41] } }] };
    await expectGeoFileError(() => writeGeoFile('geojson', wrong), 422, /food-plot but its geometry is a Point; expected Polygon or MultiPolygon/);
    const unknownKind = { propertyName: 'x', units: [{ id: 1, name: 'P', kind: 'deer-stand', geometry: { type: 'Point', coordinates: [-93, 41] } }] };
    await expectGeoFileError(() => writeGeoFile('kml', unknownKind as unknown as PlanExport), 422, /unknown kind "deer-stand"/);
    const projected: PlanExport = { propertyName: 'x', units: [{ id: 1, name: 'P', kind: 'gate', geometry: { type: 'Point', coordinates: [462000, 4544300] } }] };
    await expectGeoFileError(() => writeGeoFile('gpx', projected), 422, /outside longitude/);
  });
});

describe('readGeoFile on hand-made fixtures', () => {
  it('KML: polygon with a hole, line, point, and a broken placemark skipped with a reason', async () => {
    const result = await readGeoFile({ filename: 'hand-made-plan.kml', buffer: fixture('hand-made-plan.kml') });
    expect(result.format).toBe('kml');
    expect(result.features.map((f) => [f.name, f.family])).toEqual([
      ['Creek bottom plot', 'area'],
      ['Ridge walk-in route', 'line'],
      ['Big oak stand', 'point'],
    ]);
    const plot = byName(result, 'Creek bottom plot');
    expect(plot.kind).toBe('food-plot'); // from ExtendedData
    expect(plot.geometry.type).toBe('Polygon');
    expect((plot.geometry as Polygon).coordinates).toHaveLength(2); // exterior and hole
    expect((plot.geometry as Polygon).coordinates[1][0]).toEqual([-93.448, 41.0515]); // Z dropped, from the fixture
    const stand = byName(result, 'Big oak stand');
    expect(stand.geometry).toEqual({ type: 'Point', coordinates: [-93.446, 41.056] });
    expect(stand.notes.join(' ')).toMatch(/elevation \(Z\) values dropped/);
    expect(result.skipped).toEqual([{ index: 3, name: 'Broken placemark', reason: expect.stringMatching(/coordinates could not be read/) }]);
  });

  it('GPX: waypoints, a route and a two-segment track', async () => {
    const result = await readGeoFile({ filename: 'waypoints-route-track.gpx', buffer: fixture('waypoints-route-track.gpx') });
    expect(result.format).toBe('gpx');
    expect(result.skipped).toEqual([]);
    expect(result.features).toHaveLength(4);
    expect(byName(result, 'Ladder stand').geometry).toEqual({ type: 'Point', coordinates: [-93.4462, 41.0561] }); // ele dropped
    expect(byName(result, 'Camera 2').kind).toBe('camera-site'); // from <type>
    expect(byName(result, 'Ladder stand').kind).toBeUndefined();
    const route = byName(result, 'Truck path');
    expect(route.geometry).toEqual({ type: 'LineString', coordinates: [[-93.455, 41.05], [-93.453, 41.051], [-93.4505, 41.0515]] });
    const fence = byName(result, 'Fence walk');
    expect(fence.family).toBe('line');
    expect(fence.geometry.type).toBe('MultiLineString');
    expect((fence.geometry as { coordinates: Position[][] }).coordinates.map((l) => l.length)).toEqual([3, 2]);
  });

  it('GeoJSON: collections exploded or joined, Z dropped, rings closed, bad features skipped with reasons', async () => {
    const result = await readGeoFile({ filename: 'mixed-problems.geojson', buffer: fixture('mixed-problems.geojson') });
    expect(result.format).toBe('geojson');
    // Mixed GeometryCollection → one feature per part.
    const gate = result.features.filter((f) => f.index === 0);
    expect(gate.map((f) => [f.part, f.geometry.type])).toEqual([[0, 'Point'], [1, 'LineString']]);
    // Z values dropped; name from "Name".
    const surveyed = byName(result, 'Surveyed plot with heights');
    expect((surveyed.geometry as Polygon).coordinates[0][0]).toEqual([-93.45, 41.05]);
    expect(surveyed.notes.join(' ')).toMatch(/elevation/);
    // An open ring is closed by repeating its first position, with a note.
    const open = byName(result, 'Hand-drawn open ring');
    const ring = (open.geometry as Polygon).coordinates[0];
    expect(ring).toHaveLength(5);
    expect(ring[4]).toEqual(ring[0]);
    expect(open.notes.join(' ')).toMatch(/unclosed ring was closed/);
    // A collection of polygons only → one MultiPolygon feature.
    const fields = byName(result, 'Two fields');
    expect(fields.geometry.type).toBe('MultiPolygon');
    expect(fields.family).toBe('area');
    // A MultiPoint → one point each.
    expect(result.features.filter((f) => f.name === 'Scrape line').map((f) => f.geometry.type)).toEqual(['Point', 'Point']);
    expect(result.features).toHaveLength(7);

    const reasons = Object.fromEntries(result.skipped.map((s) => [s.name ?? `#${s.index}`, s.reason]));
    expect(reasons['UTM parcel']).toBe('coordinates look projected (metres?) — export as WGS84 longitude/latitude'); // name from "title"
    expect(reasons['Latitude too far north']).toMatch(/latitude 141\.056 is outside −90\.\.90/); // name from "label"
    expect(reasons['Latitude too far north']).not.toMatch(/swapped/);
    expect(reasons['Swapped axes']).toMatch(/swapped/);
    expect(reasons['No shape']).toMatch(/null geometry/);
    expect(reasons['Circle']).toMatch(/unsupported geometry type "Circle"/);
    expect(reasons['Sliver']).toMatch(/fewer than 4 positions/);
    expect(reasons['#11']).toMatch(/not a GeoJSON Feature/);
    expect(result.skipped).toHaveLength(7);
  });

  it('KMZ made with jszip: reads doc.kml, or the first .kml when there is no doc.kml', async () => {
    const kml = fixture('hand-made-plan.kml').toString('utf8');
    const standard = await readGeoFile({ filename: 'plan.kmz', buffer: await kmzOf(kml) });
    expect(standard.format).toBe('kmz');
    expect(standard.features).toHaveLength(3);
    expect(standard.skipped).toHaveLength(1);
    const nested = await readGeoFile({ filename: 'plan.kmz', buffer: await kmzOf(kml, 'layers/plan.kml', { 'files/readme.txt': 'not geometry' }) });
    expect(nested.features.map((f) => f.name)).toEqual(['Creek bottom plot', 'Ridge walk-in route', 'Big oak stand']);
  });
});

// ---------------------------------------------------------------------------------------------
// Zipped shapefiles. No package in node_modules ships a sample shapefile (searched node_modules
// for *.shp and *.zip), so the test writes one byte by byte (tests/support/shapefile-bytes.ts,
// after the ESRI Shapefile Technical Description, 1998).
//
// Reprojection reference: Snyder, "Map Projections — A Working Manual", USGS Professional Paper
// 1395 (1987), worked example of the ellipsoidal Transverse Mercator: Clarke 1866 ellipsoid
// (a = 6,378,206.4 m), central meridian 75° W, k0 = 0.9996, φ = 40°30' N, λ = 73°30' W gives
// x = 127,106.5 m, y = 4,484,124.4 m, k = 0.9997989 (values recalled from memory and confirmed
// with proj4's forward projection before use). With the UTM false easting of 500,000 m the
// point is E 627,106.5, N 4,484,124.4.
// ---------------------------------------------------------------------------------------------
const SNYDER_E = 627106.5;
const SNYDER_N = 4484124.4;
const SNYDER_LON = -73.5;
const SNYDER_LAT = 40.5;
const SNYDER_K = 0.9997989;
const CLARKE_UTM_18N_WKT =
  'PROJCS["Clarke 1866 / Transverse Mercator 75W (UTM zone 18 parameters)",' +
  'GEOGCS["Clarke 1866",DATUM["Clarke_1866_based",SPHEROID["Clarke 1866",6378206.4,294.9786982]],' +
  'PRIMEM["Greenwich",0],UNIT["degree",0.0174532925199433]],PROJECTION["Transverse_Mercator"],' +
  'PARAMETER["latitude_of_origin",0],PARAMETER["central_meridian",-75],PARAMETER["scale_factor",0.9996],' +
  'PARAMETER["false_easting",500000],PARAMETER["false_northing",0],UNIT["metre",1]]';
const WGS84_WKT =
  'GEOGCS["GCS_WGS_1984",DATUM["D_WGS_1984",SPHEROID["WGS_1984",6378137,298.257223563]],PRIMEM["Greenwich",0],UNIT["Degree",0.017453292519943295]]';

/** A 100 m × 100 m grid square with Snyder's point at its south-west corner, clockwise as the ESRI description asks. */
const SNYDER_SQUARE: [number, number][] = [
  [SNYDER_E, SNYDER_N],
  [SNYDER_E, SNYDER_N + 100],
  [SNYDER_E + 100, SNYDER_N + 100],
  [SNYDER_E + 100, SNYDER_N],
  [SNYDER_E, SNYDER_N],
];

async function zippedShapefile(rings: [number, number][][], prj: string | null, cutShpTo?: number): Promise<Buffer> {
  const members = buildPolygonShapefile({ rings, name: 'Snyder square' });
  const zip = new JSZip();
  zip.file('snyder-square.shp', cutShpTo ? members.shp.subarray(0, cutShpTo) : members.shp);
  zip.file('snyder-square.shx', members.shx);
  zip.file('snyder-square.dbf', members.dbf);
  if (prj) zip.file('snyder-square.prj', prj);
  return zip.generateAsync({ type: 'nodebuffer', compression: 'DEFLATE' });
}

describe('readGeoFile on zipped shapefiles', () => {
  it('reprojects from the .prj: Snyder’s Transverse Mercator example lands on 40°30′N 73°30′W', async () => {
    const result = await readGeoFile({ filename: 'snyder-square.zip', buffer: await zippedShapefile([SNYDER_SQUARE], CLARKE_UTM_18N_WKT) });
    expect(result.format).toBe('shapefile');
    expect(result.skipped).toEqual([]);
    expect(result.features).toHaveLength(1);
    const square = result.features[0];
    expect(square.name).toBe('Snyder square'); // from the NAME attribute of the .dbf
    expect(square.properties.NAME).toBe('Snyder square');
    expect(square.family).toBe('area');
    const ring = (square.geometry as Polygon).coordinates[0];
    expect(ring).toHaveLength(5);
    // Snyder gives x, y to 0.1 m; 0.1 m is about 1e-6° here, hence the tolerance.
    const nearest = Math.min(...ring.map((p) => Math.hypot(p[0] - SNYDER_LON, p[1] - SNYDER_LAT)));
    expect(nearest).toBeLessThan(1e-6);
    // The grid square is 10,000 m² on the map; on the ground that is 10,000 / k² = 10,004.0 m²
    // (Snyder's k). turf measures on a sphere, within about 0.2 % of the ellipsoid at these
    // latitudes (STACK.md measurements), so allow 0.5 %.
    const groundSqM = 10000 / SNYDER_K ** 2;
    expect(Math.abs(area(square.geometry) - groundSqM) / groundSqM).toBeLessThan(0.005);
  });

  it('keeps lon/lat as they are when the .prj is geographic WGS84', async () => {
    const lonLat: [number, number][] = [[-93.45, 41.05], [-93.45, 41.054], [-93.445, 41.054], [-93.445, 41.05], [-93.45, 41.05]];
    const result = await readGeoFile({ filename: 'square.zip', buffer: await zippedShapefile([lonLat], WGS84_WKT) });
    expect(result.features).toHaveLength(1);
    expect(sameGeometry(result.features[0].geometry, { type: 'Polygon', coordinates: [lonLat] })).toBe(true);
  });

  it('skips projected coordinates when the zip has no .prj, and says to include it', async () => {
    const result = await readGeoFile({ filename: 'no-prj.zip', buffer: await zippedShapefile([SNYDER_SQUARE], null) });
    expect(result.features).toEqual([]);
    expect(result.skipped).toHaveLength(1);
    expect(result.skipped[0].name).toBe('Snyder square');
    expect(result.skipped[0].reason).toMatch(/look projected \(metres\?\).*no \.prj/);
  });

  it('a damaged .shp inside a sound zip gives 422 naming the shapefile', async () => {
    // The whole .shp is 236 bytes: 100-byte header + 8-byte record header + 128-byte Polygon
    // record of 1 part and 5 points (4 + 32 + 4 + 4 + 4 + 5 × 16; ESRI 1998 layout). Cut it at 150.
    const buffer = await zippedShapefile([SNYDER_SQUARE], CLARKE_UTM_18N_WKT, 150);
    await expectGeoFileError(() => readGeoFile({ filename: 'cut.zip', buffer }), 422, /"snyder-square\.shp".*could not be read: it is cut short \(its header says 236 bytes, the file has 150\)/);
  });
});

describe('readGeoFile refuses what it cannot read, with a status and an actionable message', () => {
  it('truncated zip → 422', async () => {
    const whole = await kmzOf(fixture('hand-made-plan.kml').toString('utf8'));
    const cut = whole.subarray(0, Math.floor(whole.length / 2));
    await expectGeoFileError(() => readGeoFile({ filename: 'plan.kmz', buffer: cut }), 422, /zip archive.*could not be opened.*cut short or damaged/);
  });

  it('bad XML → 422 naming the format, the problem and the line', async () => {
    const e = await expectGeoFileError(
      () => readGeoFile({ filename: 'unclosed-tag.kml', buffer: fixture('unclosed-tag.kml') }),
      422,
      /^This file is a KML but its XML could not be read: unexpected close tag near line 12\b/,
    );
    // The streaming parser stops at </Document> on line 12 of the fixture, while the Placemark
    // opened on line 9 is still open.
    expect(e.details?.line).toBe(12);
  });

  it('JSON syntax error → 422 with the line', async () => {
    const text = '{\n  "type": "FeatureCollection",\n  "features": [\n    { "type": "Feature", }\n  ]\n}';
    await expectGeoFileError(() => readGeoFile({ filename: 'plan.geojson', buffer: Buffer.from(text) }), 422, /GeoJSON but its JSON could not be read: .*line 4/);
  });

  it('a Windows program renamed .kml → 415 saying what it looks like', async () => {
    const exe = Buffer.concat([Buffer.from([0x4d, 0x5a, 0x90, 0x00, 0x03, 0x00]), Buffer.from('This program cannot be run in DOS mode.')]);
    await expectGeoFileError(() => readGeoFile({ filename: 'setup.kml', buffer: exe }), 415, /"setup\.kml" is named like a KML but is not one; its content looks like a Windows program/);
  });

  it('other unsupported content → 415 (zip without geometry, foreign XML, bare .shp, plain text)', async () => {
    const zip = new JSZip();
    zip.file('readme.txt', 'hello');
    await expectGeoFileError(async () => readGeoFile({ filename: 'data.zip', buffer: await zip.generateAsync({ type: 'nodebuffer' }) }), 415, /neither a shapefile .* nor a KML .*readme\.txt/);
    await expectGeoFileError(() => readGeoFile({ filename: 'map.svg', buffer: Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"/>') }), 415, /root element is <svg>/);
    const shp = buildPolygonShapefile({ rings: [SNYDER_SQUARE], name: 'x' }).shp;
    await expectGeoFileError(() => readGeoFile({ filename: 'parcel.shp', buffer: shp }), 415, /\.shx, \.dbf and \.prj files in one \.zip/);
    await expectGeoFileError(() => readGeoFile({ filename: 'notes.txt', buffer: Buffer.from('just words') }), 415, /cannot be imported.*plain text/);
  });

  it('JSON that is not GeoJSON and an empty file → 422', async () => {
    await expectGeoFileError(() => readGeoFile({ filename: 'x.json', buffer: Buffer.from('{"hello": "world"}') }), 422, /JSON but not GeoJSON/);
    await expectGeoFileError(() => readGeoFile({ filename: 'x.json', buffer: Buffer.from('{"type": "Topology", "objects": {}}') }), 422, /TopoJSON/);
    await expectGeoFileError(() => readGeoFile({ filename: 'empty.kml', buffer: Buffer.alloc(0) }), 422, /is empty \(0 bytes\)/);
  });

  it('more features than the guard allows → 413', async () => {
    await expectGeoFileError(
      () => readGeoFile({ filename: 'mixed-problems.geojson', buffer: fixture('mixed-problems.geojson') }, { maxFeatures: 5 }),
      413,
      /at most 5\b.*Split the file/,
    );
    const kml = generateLargeKml({ targetBytes: 20_000 });
    await expectGeoFileError(() => readGeoFile({ filename: 'big.kml', buffer: kml.buffer }, { maxFeatures: 10 }), 413, /at most 10\b/);
  });

  it('content wins over a wrong extension, with a warning', async () => {
    const result = await readGeoFile({ filename: 'plan.kml', buffer: Buffer.from(writeGeoFile('geojson', PLAN).body) });
    expect(result.format).toBe('geojson');
    expect(result.warnings).toEqual(['The file is named ".kml" but holds a GeoJSON file; it was read as GeoJSON.']);
  });
});

describe('large files', () => {
  it('reads a ~10 MB KML and finds every placemark', { timeout: 120_000 }, async () => {
    const big = generateLargeKml();
    expect(big.buffer.length).toBeGreaterThan(10 * 1024 * 1024 - 4096);
    const result = await readGeoFile({ filename: 'large.kml', buffer: big.buffer });
    expect(result.skipped).toEqual([]);
    expect(result.features).toHaveLength(big.placemarkCount);
    const families = { area: 0, line: 0, point: 0 };
    for (const f of result.features) families[f.family] += 1;
    expect(families).toEqual(big.counts);
  });
});
