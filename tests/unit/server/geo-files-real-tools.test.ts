/**
 * Files as real GIS tools write them (GDAL and the desktop tools built on it), and uploads built
 * to exhaust the server. Every fixture is made in code.
 */
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import JSZip from 'jszip';
import type { LineString, Polygon, Position } from 'geojson';
import { describe, expect, it } from 'vitest';
import { isGeoFileError, readGeoFile, type GeoFileError } from '../../../server/services/geo-files';
import { prepareOverlay } from '../../../server/services/imagery/overlay-image';
import { buildPolygonShapefile } from '../../support/shapefile-bytes';
import { buildZip, shapefileBomb, storedEntry, deflatedZeros } from '../../support/zip-bytes';
import { tiffHeaderOnly } from '../../support/tiff-bytes';
import { destination } from '../../support/geo-fixtures';
import { GEOMETRY_LIMITS } from '../../../shared/limits';

const require = createRequire(import.meta.url);

async function refusal(run: () => Promise<unknown>): Promise<{ status: number; message: string; code?: string }> {
  try {
    await run();
  } catch (error) {
    if (isGeoFileError(error)) return { status: (error as GeoFileError).status, message: (error as Error).message, code: (error as GeoFileError).code };
    const e = error as { status?: number; message: string; code?: string };
    if (typeof e.status === 'number') return { status: e.status, message: e.message, code: e.code };
    throw error;
  }
  throw new Error('expected a refusal');
}

const square = (x: number, y: number, side: number): [number, number][] => [
  [x, y],
  [x, y + side],
  [x + side, y + side],
  [x + side, y],
  [x, y],
]; // clockwise, as the ESRI description wants outer rings

describe('KMZ written by GDAL’s LIBKML driver: doc.kml only links to the layers', () => {
  const layer = (name: string, lon: number) =>
    `<?xml version="1.0" encoding="UTF-8"?><kml xmlns="http://www.opengis.net/kml/2.2"><Document><Folder><name>${name}</name>` +
    `<Placemark><name>${name} County</name><Polygon><outerBoundaryIs><LinearRing><coordinates>${lon},41 ${lon + 0.5},41 ${lon + 0.5},41.5 ${lon},41.5 ${lon},41</coordinates></LinearRing></outerBoundaryIs></Polygon></Placemark>` +
    '</Folder></Document></kml>';
  // The root document as LIBKML writes it (one NetworkLink per layer file, relative hrefs).
  const doc =
    '<?xml version="1.0" encoding="UTF-8"?><kml xmlns="http://www.opengis.net/kml/2.2"><Document id="root_doc">' +
    '<NetworkLink><name>counties</name><Link><href>layers/counties.kml</href></Link></NetworkLink>' +
    '<NetworkLink><name>more</name><Link><href>layers/more.kml</href></Link></NetworkLink>' +
    '<NetworkLink><name>web</name><Link><href>https://example.test/remote.kml</href></Link></NetworkLink>' +
    '</Document></kml>';

  it('follows the links inside the archive and reads every layer, once', async () => {
    const zip = new JSZip();
    zip.file('doc.kml', doc);
    zip.file('layers/counties.kml', layer('Story', -93.7));
    // A layer that links back to the root and to its sibling: each file is read once.
    zip.file('layers/more.kml', layer('Boone', -94.1).replace('</Document>', '<NetworkLink><Link><href>../doc.kml</href></Link></NetworkLink><NetworkLink><Link><href>counties.kml</href></Link></NetworkLink></Document>'));
    const result = await readGeoFile({ filename: 'counties.kmz', buffer: await zip.generateAsync({ type: 'nodebuffer', compression: 'DEFLATE' }) });
    expect(result.format).toBe('kmz');
    expect(result.features.map((f) => f.name)).toEqual(['Story County', 'Boone County']);
    expect(result.features[0].notes.join(' ')).toMatch(/from "layers\/counties\.kml"/);
    expect(result.warnings.join(' ')).toMatch(/links to "https:\/\/example\.test\/remote\.kml", which is not inside this KMZ/);
  });
});

describe('a shapefile without a .cpg honours the .dbf language-driver byte', () => {
  // Language-driver ids: ArcPad 10 help, "Setting the code page for shapefiles" (0x03 = code page
  // 1252, Windows ANSI); 0x57 (87) is GDAL's default (Shapefile driver, ENCODING option default
  // "LDID/87"), read by GDAL as ISO-8859-1. "ñ" is byte 0xF1 in both ISO-8859-1 and windows-1252.
  const WGS84_WKT = 'GEOGCS["GCS_WGS_1984",DATUM["D_WGS_1984",SPHEROID["WGS_1984",6378137,298.257223563]],PRIMEM["Greenwich",0],UNIT["Degree",0.017453292519943295]]';
  async function zipped(ldid: number, name: string): Promise<Buffer> {
    const members = buildPolygonShapefile({ rings: [square(-105.9, 35.6, 0.01)], name, ldid });
    const zip = new JSZip();
    zip.file('parcels.shp', members.shp);
    zip.file('parcels.shx', members.shx);
    zip.file('parcels.dbf', members.dbf);
    zip.file('parcels.prj', WGS84_WKT);
    return zip.generateAsync({ type: 'nodebuffer' });
  }

  it.each([
    ['0x57', 0x57, 'LDID 87, GDAL’s default'],
    ['0x03', 0x03, 'LDID 3, Windows ANSI'],
  ])('reads "Cañon Creek" from a .dbf marked %s (%s)', async (_hex, ldid) => {
    const result = await readGeoFile({ filename: 'parcels.zip', buffer: await zipped(ldid, 'Cañon Creek') });
    expect(result.features[0].name).toBe('Cañon Creek');
  });

  it('warns, naming the byte, when it names a DOS code page it cannot decode', async () => {
    const result = await readGeoFile({ filename: 'parcels.zip', buffer: await zipped(0x01, 'Plain name') }); // 0x01 = code page 437 (ArcPad table)
    expect(result.features[0].name).toBe('Plain name');
    expect(result.warnings.join(' ')).toMatch(/language-driver byte \(0x01\) names an old DOS code page/);
  });
});

describe('a GeoJSON whose crs names a projected system in feet is reprojected like the same shapefile', () => {
  // EPSG:2236, NAD83 / Florida East (ftUS), from the EPSG dataset (epsg-index 2.0.0): Transverse
  // Mercator, latitude of origin 24°20′ N, central meridian 81° W, false easting 656,166.667 US
  // survey feet (200,000.0001016 m), false northing 0. By the projection's definition the natural
  // origin maps to (false easting, false northing).
  const entry = JSON.parse(readFileSync(require.resolve('epsg-index/s/2236.json'), 'utf8')) as { wkt: string };
  const FE_FT = 656166.667;
  const ring = square(FE_FT + 10_000, 200_000, 2_000); // 2,000 ft squares, some 38 miles north of the origin

  it('lands the natural origin on 24°20′ N 81° W and agrees with the shapefile reader', async () => {
    const geojson = {
      type: 'FeatureCollection',
      crs: { type: 'name', properties: { name: 'urn:ogc:def:crs:EPSG::2236' } },
      features: [
        { type: 'Feature', properties: { name: 'Origin' }, geometry: { type: 'Point', coordinates: [FE_FT, 0] } },
        { type: 'Feature', properties: { name: 'Grove' }, geometry: { type: 'Polygon', coordinates: [ring] } },
      ],
    };
    const fromJson = await readGeoFile({ filename: 'grove.geojson', buffer: Buffer.from(JSON.stringify(geojson)) });
    expect(fromJson.skipped).toEqual([]);
    const origin = fromJson.features.find((f) => f.name === 'Origin')!.geometry.coordinates as Position;
    expect(origin[0]).toBeCloseTo(-81, 7);
    expect(origin[1]).toBeCloseTo(24 + 20 / 60, 7);
    expect(fromJson.warnings.join(' ')).toMatch(/NAD83 \/ Florida East \(ftUS\) \(EPSG:2236, US survey foot\); they were converted/);

    const members = buildPolygonShapefile({ rings: [ring], name: 'Grove' });
    const zip = new JSZip();
    zip.file('grove.shp', members.shp);
    zip.file('grove.shx', members.shx);
    zip.file('grove.dbf', members.dbf);
    zip.file('grove.prj', entry.wkt);
    const fromShp = await readGeoFile({ filename: 'grove.zip', buffer: await zip.generateAsync({ type: 'nodebuffer' }) });
    const a = (fromJson.features.find((f) => f.name === 'Grove')!.geometry as Polygon).coordinates[0];
    const b = (fromShp.features[0].geometry as Polygon).coordinates[0];
    expect(a).toHaveLength(b.length);
    // 1e-7° is about 1 cm: the two readers agree.
    a.forEach((p, i) => {
      expect(Math.abs(p[0] - b[i][0])).toBeLessThan(1e-7);
      expect(Math.abs(p[1] - b[i][1])).toBeLessThan(1e-7);
    });
  });

  it('imports NAD83 longitude/latitude with a warning that says what it did', async () => {
    const geojson = {
      type: 'FeatureCollection',
      crs: { type: 'name', properties: { name: 'urn:ogc:def:crs:EPSG::4269' } }, // EPSG:4269 = NAD83 geographic
      features: [{ type: 'Feature', properties: { name: 'Story County' }, geometry: { type: 'Polygon', coordinates: [[[-93.7, 41.9], [-93.2, 41.9], [-93.2, 42.2], [-93.7, 42.2], [-93.7, 41.9]]] } }],
    };
    const result = await readGeoFile({ filename: 'county.geojson', buffer: Buffer.from(JSON.stringify(geojson)) });
    expect(result.features).toHaveLength(1);
    expect(result.warnings).toHaveLength(1);
    expect(result.warnings[0]).toMatch(/NAD83 .*It was imported as WGS84 longitude\/latitude/);
    expect(result.warnings[0]).not.toMatch(/only such coordinates can be imported/);
  });
});

describe('a walked GPS track can become an area', () => {
  /** An open track around a square walked from its south-west corner, ending `gapM` metres east of the start. */
  function walk(gapM: number, withType = false): Buffer {
    const lat = 42.0;
    const lon = -93.6;
    const north = destination(lat, lon, 0, 200);
    const ne = destination(north.lat, north.lon, 90, 200);
    const se = destination(ne.lat, ne.lon, 180, 200);
    const end = destination(lat, lon, 90, gapM);
    const pts = [{ lat, lon }, north, ne, se, end].map((p) => `<trkpt lat="${p.lat}" lon="${p.lon}"/>`).join('');
    return Buffer.from(`<?xml version="1.0"?><gpx version="1.1" creator="test" xmlns="http://www.topografix.com/GPX/1/1"><trk><name>Field walk</name>${withType ? '<type>fence</type>' : ''}<trkseg>${pts}</trkseg></trk></gpx>`);
  }

  it(`marks an open track whose ends lie within ${GEOMETRY_LIMITS.trackCloseMaxGapM} m as closable, saying so`, async () => {
    const result = await readGeoFile({ filename: 'walk.gpx', buffer: walk(12) });
    const track = result.features[0];
    expect(track.family).toBe('line');
    expect(track.geometry.type).toBe('LineString');
    // GeographicLib put the end 12 m east of the start; the shared line measure is within 0.5 %.
    expect(track.closableGapM).toBeGreaterThan(11.9);
    expect(track.closableGapM).toBeLessThan(12.1);
    expect(track.notes.join(' ')).toMatch(/ends are 12 m apart \(at most 30 m\): it can be the property boundary or an area/);
  });

  it('leaves a track whose ends are farther apart as a line only', async () => {
    const result = await readGeoFile({ filename: 'walk.gpx', buffer: walk(80) });
    expect(result.features[0].closableGapM).toBeUndefined();
    expect((result.features[0].geometry as LineString).coordinates).toHaveLength(5);
  });
});

describe('uploads built to exhaust the server are refused before the work, naming the limit', () => {
  it('a zipped "shapefile" of four entries expanding to 200 MB each: 413 from the central directory', async () => {
    const bomb = await shapefileBomb();
    expect(bomb.length).toBeLessThan(2 * 1024 * 1024);
    const r = await refusal(() => readGeoFile({ filename: 'parcels.zip', buffer: bomb }));
    expect(r.status).toBe(413);
    expect(r.message).toMatch(/expands to more than 100 MB/);
  });

  it('an entry whose header understates its size stops as soon as it inflates past what it declared', async () => {
    const zeros = await deflatedZeros(30 * 1024 * 1024);
    const liar = buildZip([{ name: 'doc.kml', data: zeros.data, method: 8, crc: zeros.crc, size: 1024 }]);
    const r = await refusal(() => readGeoFile({ filename: 'liar.kmz', buffer: liar }));
    expect([413, 422]).toContain(r.status);
    expect(r.message).toMatch(/doc\.kml/);
  });

  it('a running byte count stops inflating at the budget, whatever the headers say', async () => {
    const zeros = await deflatedZeros(8 * 1024 * 1024);
    const zip = buildZip([{ name: 'doc.kml', data: zeros.data, method: 8, crc: zeros.crc, size: 8 * 1024 * 1024 }]);
    const r = await refusal(() => readGeoFile({ filename: 'big.kmz', buffer: zip }, { maxUnzippedBytes: 4 * 1024 * 1024 }));
    expect(r.status).toBe(413);
    expect(r.message).toMatch(/more than 4 MB/);
  });

  it(`a zip listing more than ${GEOMETRY_LIMITS.importMaxZipEntries.toLocaleString('en-US')} entries: 413`, async () => {
    const entries = Array.from({ length: GEOMETRY_LIMITS.importMaxZipEntries + 1 }, (_, i) => storedEntry(`icons/${i}.png`, 'x'));
    const r = await refusal(() => readGeoFile({ filename: 'many.kmz', buffer: buildZip([storedEntry('doc.kml', '<kml/>'), ...entries]) }));
    expect(r.status).toBe(413);
    expect(r.message).toMatch(/at most 1,000/);
  });

  it('a 1,000,000-vertex GeoJSON: 413 before it is parsed', async () => {
    const ring: string[] = [];
    for (let i = 0; i < 1_000_000; i += 1) ring.push(`[${(-93 + i * 1e-7).toFixed(7)},41.5]`);
    const text = `{"type":"FeatureCollection","features":[{"type":"Feature","properties":{},"geometry":{"type":"LineString","coordinates":[${ring.join(',')}]}}]}`;
    const r = await refusal(() => readGeoFile({ filename: 'huge.geojson', buffer: Buffer.from(text) }));
    expect(r.status).toBe(413);
    expect(r.code).toBe('too-many-vertices');
    expect(r.message).toMatch(/more than 500,000 vertices/);
  });

  it('a KML over the vertex guard stops while streaming', async () => {
    const coords = Array.from({ length: 2_000 }, (_, i) => `${-93 + i * 1e-5},41.5`).join(' ');
    const kml = `<kml xmlns="http://www.opengis.net/kml/2.2"><Document><Placemark><LineString><coordinates>${coords}</coordinates></LineString></Placemark></Document></kml>`;
    const r = await refusal(() => readGeoFile({ filename: 'long.kml', buffer: Buffer.from(kml) }, { maxVertices: 1_000 }));
    expect(r.status).toBe(413);
    expect(r.message).toMatch(/more than 1,000 vertices/);
  });

  it('a shapefile over the vertex guard is refused from its record headers', async () => {
    const members = buildPolygonShapefile({ rings: [square(-93, 41, 0.01)], name: 'x' });
    const zip = new JSZip();
    zip.file('x.shp', members.shp);
    zip.file('x.dbf', members.dbf);
    const r = await refusal(async () => readGeoFile({ filename: 'x.zip', buffer: await zip.generateAsync({ type: 'nodebuffer' }) }, { maxVertices: 4 }));
    expect(r.status).toBe(413);
  });

  it('a 196-byte GeoTIFF declaring 8192 × 8192 pixels: 413 from its header, nothing decoded', async () => {
    const tiff = tiffHeaderOnly(8192, 8192);
    expect(tiff.length).toBeLessThan(400);
    const r = await refusal(() => prepareOverlay(tiff, null));
    expect(r.status).toBe(413);
    expect(r.message).toMatch(/8,192 × 8,192 pixels \(67 megapixels\); an overlay may have at most 40 megapixels/);
  });

  it('a GeoTIFF within the pixels but whose 16-bit bands would decode past the byte limit: 413', async () => {
    // 6000 × 6000 × 4 bands × 2 bytes = 288,000,000 bytes > 256 MB (268,435,456).
    const header = tiffHeaderOnly(6000, 6000, 4);
    // BitsPerSample: 4 SHORTs stored after the IFD; make them 16 (the first extra value block).
    const patched = Buffer.from(header);
    const count = patched.readUInt16LE(8);
    for (let i = 0; i < count; i += 1) {
      const at = 10 + i * 12;
      if (patched.readUInt16LE(at) === 258) {
        const offset = patched.readUInt32LE(at + 8);
        for (let k = 0; k < 4; k += 1) patched.writeUInt16LE(16, offset + 2 * k);
      }
    }
    const r = await refusal(() => prepareOverlay(patched, null));
    expect(r.status).toBe(413);
    expect(r.message).toMatch(/4 bands of 16 bits/);
  });
});
