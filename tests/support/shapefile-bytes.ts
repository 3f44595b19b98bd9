/**
 * A minimal polygon shapefile written byte by byte, for import tests.
 * Layout of .shp and .shx: ESRI Shapefile Technical Description, July 1998 (main file header,
 * record headers, Polygon record contents, index records). Layout of .dbf: dBASE III table file
 * header, field descriptors and records, from memory (the ESRI description defers to dBASE).
 */

export interface PolygonShapefileInput {
  /** Rings in file coordinates; the ESRI description wants the outer ring clockwise and closed. */
  rings: [number, number][][];
  /** Text of the NAME attribute (at most 20 characters, each written as one byte: Latin-1). */
  name: string;
  /** dBASE language-driver id written at byte 29 of the .dbf header (0 when not given). */
  ldid?: number;
}

export interface ShapefileMembers {
  shp: Uint8Array;
  shx: Uint8Array;
  dbf: Uint8Array;
}

const SHAPE_POLYGON = 5;
const FILE_CODE = 9994;
const VERSION = 1000;

function header(view: DataView, fileLengthBytes: number, box: [number, number, number, number]): void {
  view.setInt32(0, FILE_CODE, false); // big-endian
  view.setInt32(24, fileLengthBytes / 2, false); // length in 16-bit words, big-endian
  view.setInt32(28, VERSION, true); // little-endian from here on
  view.setInt32(32, SHAPE_POLYGON, true);
  view.setFloat64(36, box[0], true);
  view.setFloat64(44, box[1], true);
  view.setFloat64(52, box[2], true);
  view.setFloat64(60, box[3], true);
  // Zmin, Zmax, Mmin, Mmax (68..99) stay 0 for a 2-D shape type.
}

/** Write .shp, .shx and .dbf bytes for a shapefile holding one Polygon record. */
export function buildPolygonShapefile(input: PolygonShapefileInput): ShapefileMembers {
  const points = input.rings.flat();
  const xs = points.map((p) => p[0]);
  const ys = points.map((p) => p[1]);
  const box: [number, number, number, number] = [Math.min(...xs), Math.min(...ys), Math.max(...xs), Math.max(...ys)];

  // Polygon record contents: type, box, NumParts, NumPoints, Parts[], Points[].
  const contentBytes = 4 + 32 + 4 + 4 + 4 * input.rings.length + 16 * points.length;
  const shpBytes = 100 + 8 + contentBytes;
  const shp = new DataView(new ArrayBuffer(shpBytes));
  header(shp, shpBytes, box);
  shp.setInt32(100, 1, false); // record number, 1-based, big-endian
  shp.setInt32(104, contentBytes / 2, false); // content length in 16-bit words
  let o = 108;
  shp.setInt32(o, SHAPE_POLYGON, true);
  box.forEach((v, i) => shp.setFloat64(o + 4 + 8 * i, v, true));
  shp.setInt32(o + 36, input.rings.length, true);
  shp.setInt32(o + 40, points.length, true);
  o += 44;
  let start = 0;
  for (const ring of input.rings) {
    shp.setInt32(o, start, true);
    o += 4;
    start += ring.length;
  }
  for (const [x, y] of points) {
    shp.setFloat64(o, x, true);
    shp.setFloat64(o + 8, y, true);
    o += 16;
  }

  // Index file: same header, then offset and content length of each record, in 16-bit words.
  const shx = new DataView(new ArrayBuffer(108));
  header(shx, 108, box);
  shx.setInt32(100, 50, false); // the record starts at byte 100 = word 50
  shx.setInt32(104, contentBytes / 2, false);

  // dBASE III table with one character field NAME (C, 20).
  const fieldLength = 20;
  const headerLength = 32 + 32 + 1;
  const recordLength = 1 + fieldLength;
  const dbf = new Uint8Array(headerLength + recordLength + 1);
  const dv = new DataView(dbf.buffer);
  dbf[0] = 0x03; // dBASE III without memo
  dbf[1] = 124; // last update: 2024 (years since 1900) …
  dbf[2] = 6; // … June …
  dbf[3] = 1; // … 1st
  dv.setUint32(4, 1, true); // number of records
  dv.setUint16(8, headerLength, true);
  dv.setUint16(10, recordLength, true);
  dbf[29] = input.ldid ?? 0; // language driver id (dBASE IV header)
  const field = 32;
  'NAME'.split('').forEach((c, i) => (dbf[field + i] = c.charCodeAt(0)));
  dbf[field + 11] = 'C'.charCodeAt(0);
  dbf[field + 16] = fieldLength;
  dbf[field + 17] = 0; // decimal count
  dbf[headerLength - 1] = 0x0d; // header terminator
  const record = headerLength;
  dbf[record] = 0x20; // not deleted
  const text = input.name.slice(0, fieldLength).padEnd(fieldLength, ' ');
  for (let i = 0; i < fieldLength; i += 1) dbf[record + 1 + i] = text.charCodeAt(i);
  dbf[dbf.length - 1] = 0x1a; // end of file

  return { shp: new Uint8Array(shp.buffer), shx: new Uint8Array(shx.buffer), dbf };
}
