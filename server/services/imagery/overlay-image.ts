/**
 * Georeferenced images for the plan map: a GeoTIFF (its own georeference, reprojected to lon/lat
 * corners with proj4) becomes a PNG; a PNG or JPEG comes with its four corners. Content is checked
 * by magic bytes, never by the file name or the claimed type.
 */
import { fromArrayBuffer } from 'geotiff';
import { encode } from 'fast-png';
import proj4 from 'proj4';
import { AppError, unprocessable, unsupportedMedia } from '../../errors';
import type { Corners } from '../../models';
import { GEOMETRY_LIMITS } from '../../../shared/limits';
import { parseWorldFile, worldFileCorners } from '../../../shared/domain/world-file';
import { epsgEntry } from '../geo-files/crs';

export type ImageKind = 'png' | 'jpeg' | 'tiff';

/** The image type from the first bytes, or null. */
export function sniffImage(bytes: Buffer): ImageKind | null {
  if (bytes.length >= 8 && bytes.subarray(0, 8).equals(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]))) return 'png';
  if (bytes.length >= 3 && bytes[0] === 0xff && bytes[1] === 0xd8 && bytes[2] === 0xff) return 'jpeg';
  const littleEndianTiff = bytes[0] === 0x49 && bytes[1] === 0x49 && (bytes[2] === 0x2a || bytes[2] === 0x2b) && bytes[3] === 0;
  const bigEndianTiff = bytes[0] === 0x4d && bytes[1] === 0x4d && bytes[2] === 0 && (bytes[3] === 0x2a || bytes[3] === 0x2b);
  if (bytes.length >= 4 && (littleEndianTiff || bigEndianTiff)) return 'tiff';
  return null;
}

const MAX_PIXELS = GEOMETRY_LIMITS.overlayMaxPixels;
const MAX_DECODED_BYTES = GEOMETRY_LIMITS.overlayMaxDecodedBytes;

const megapixels = (n: number): string => `${(n / 1e6).toFixed(n < 1e7 ? 1 : 0)} megapixels`;

/** 413 naming the limit, for an image whose header says it is too large to decode. */
function imageTooLarge(width: number, height: number, why: string): AppError {
  return new AppError(
    413,
    'payload_too_large',
    `The image is ${width.toLocaleString('en-US')} × ${height.toLocaleString('en-US')} pixels (${megapixels(width * height)})${why}; ` +
      `an overlay may have at most ${megapixels(MAX_PIXELS)} and ${Math.round(MAX_DECODED_BYTES / 1024 / 1024)} MB of pixel data. Export it at a coarser resolution or crop it to the property.`,
    { maxPixels: MAX_PIXELS, maxDecodedBytes: MAX_DECODED_BYTES },
  );
}

/** Width × height, samples and bits from a TIFF's first image header, checked against the limits before any pixel is decoded. */
export function checkTiffSize(width: number, height: number, samplesPerPixel: number, bitsPerSample: number): void {
  if (!(width > 0 && height > 0)) throw unprocessable('The TIFF header gives no image size. Export the image again as a GeoTIFF.');
  if (width * height > MAX_PIXELS) throw imageTooLarge(width, height, '');
  const decoded = width * height * Math.max(1, samplesPerPixel) * Math.max(1, Math.ceil(bitsPerSample / 8));
  if (decoded > MAX_DECODED_BYTES) throw imageTooLarge(width, height, ` with ${samplesPerPixel} bands of ${bitsPerSample} bits, ${Math.round(decoded / 1024 / 1024)} MB once decoded`);
}

/** Width and height from a PNG's IHDR chunk (PNG specification, 11.2.2) or a JPEG's SOF marker (ITU T.81, B.2.2); null if not found. */
export function imageDimensions(bytes: Buffer, kind: 'png' | 'jpeg'): { width: number; height: number } | null {
  if (kind === 'png') {
    if (bytes.length < 24 || bytes.toString('latin1', 12, 16) !== 'IHDR') return null;
    return { width: bytes.readUInt32BE(16), height: bytes.readUInt32BE(20) };
  }
  let offset = 2;
  while (offset + 9 < bytes.length) {
    if (bytes[offset] !== 0xff) return null;
    const marker = bytes[offset + 1];
    if (marker === 0xd8 || (marker >= 0xd0 && marker <= 0xd7) || marker === 0x01 || marker === 0xff) {
      offset += marker === 0xff ? 1 : 2;
      continue;
    }
    const length = bytes.readUInt16BE(offset + 2);
    // Start-of-frame markers C0–CF, except DHT (C4), JPG (C8) and DAC (CC).
    if (marker >= 0xc0 && marker <= 0xcf && marker !== 0xc4 && marker !== 0xc8 && marker !== 0xcc) {
      return { height: bytes.readUInt16BE(offset + 5), width: bytes.readUInt16BE(offset + 7) };
    }
    offset += 2 + length;
  }
  return null;
}

/** A proj4 definition for the EPSG codes imagery usually comes in, or null. */
export function projectionFor(epsg: number): string | null {
  if (epsg === 4326 || epsg === 4269 || epsg === 4258) return 'EPSG:4326';
  if (epsg === 3857 || epsg === 900913) return 'EPSG:3857';
  if (epsg >= 32601 && epsg <= 32660) return `+proj=utm +zone=${epsg - 32600} +datum=WGS84 +units=m +no_defs`;
  if (epsg >= 32701 && epsg <= 32760) return `+proj=utm +zone=${epsg - 32700} +south +datum=WGS84 +units=m +no_defs`;
  if (epsg >= 26901 && epsg <= 26923) return `+proj=utm +zone=${epsg - 26900} +ellps=GRS80 +towgs84=0,0,0 +units=m +no_defs`;
  // Anything else the EPSG registry (epsg-index) defines: state plane, national grids, other datums.
  const entry = Number.isInteger(epsg) && epsg > 0 ? epsgEntry(epsg) : null;
  if (entry?.proj4) return entry.kind === 'CRS-GEOGCRS' ? 'EPSG:4326' : entry.proj4;
  return null;
}

/** The unknown-projection sentence (422). */
function unknownProjection(epsg: number, what: string): AppError {
  return unprocessable(`The ${what} is in EPSG:${epsg}, a coordinate system Browseline does not know. Reproject it to WGS84 (EPSG:4326), Web Mercator (EPSG:3857) or UTM and upload it again.`);
}

/** Projected corners to lon/lat, each checked to fall on the map. */
function cornersToLonLat(def: string, projected: [number, number][], what: string): Corners {
  let converter: ((p: [number, number]) => [number, number]) | null = null;
  if (def !== 'EPSG:4326') {
    try {
      const c = proj4(def, 'EPSG:4326');
      converter = (p) => c.forward(p) as [number, number];
    } catch {
      throw unprocessable(`The ${what}’s coordinate system could not be set up for conversion. Reproject it to WGS84 (EPSG:4326) or UTM and upload it again.`);
    }
  }
  const corners = projected.map((p) => {
    const [lon, lat] = converter ? converter(p) : p;
    return [Math.round(lon * 1e7) / 1e7, Math.round(lat * 1e7) / 1e7] as [number, number];
  }) as Corners;
  for (const [lon, lat] of corners) {
    if (!(Math.abs(lon) <= 180 && Math.abs(lat) <= 85)) throw unprocessable(`The ${what}’s corners fall outside the map. Check the coordinate system (EPSG code) it was exported in.`);
  }
  return corners;
}

export interface PreparedOverlay {
  bytes: Buffer;
  contentType: 'image/png' | 'image/jpeg';
  extension: 'png' | 'jpg';
  corners: Corners;
}

/** Reads a GeoTIFF into a PNG and its lon/lat corners (top-left, top-right, bottom-right, bottom-left). */
export async function prepareGeoTiff(bytes: Buffer): Promise<PreparedOverlay> {
  let image;
  try {
    const tiff = await fromArrayBuffer(bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength) as ArrayBuffer);
    image = await tiff.getImage();
  } catch (err) {
    throw unprocessable(`The GeoTIFF could not be read (${(err as Error).message}). Export it again as an uncompressed or LZW GeoTIFF.`);
  }
  const width = image.getWidth();
  const height = image.getHeight();
  const bits = image.getBitsPerSample();
  checkTiffSize(width, height, image.getSamplesPerPixel(), typeof bits === 'number' ? bits : 8);
  let bbox: number[];
  const noGeoreference = () =>
    unprocessable('The TIFF has no georeference (no tie points or transform). Export it as a GeoTIFF, or upload a PNG/JPEG with its world file (.jgw) or corner coordinates.');
  // Without tie points or a transform, geotiff answers a box in pixels: refuse before using it.
  const directory = image.getFileDirectory() as { hasTag?: (tag: string) => boolean };
  if (directory.hasTag && !directory.hasTag('ModelTiepoint') && !directory.hasTag('ModelTransformation')) throw noGeoreference();
  try {
    bbox = image.getBoundingBox();
  } catch {
    throw noGeoreference();
  }
  const keys = (image.getGeoKeys() ?? {}) as Record<string, number | undefined>;
  const epsg = keys.ProjectedCSTypeGeoKey ?? keys.GeographicTypeGeoKey ?? 4326;
  const def = projectionFor(epsg);
  if (!def) throw unknownProjection(epsg, 'GeoTIFF');
  const [minX, minY, maxX, maxY] = bbox as [number, number, number, number];
  const corners = cornersToLonLat(def, [[minX, maxY], [maxX, maxY], [maxX, minY], [minX, minY]], 'GeoTIFF');
  const rgb = (await image.readRGB({ interleave: true, enableAlpha: true })) as unknown as ArrayLike<number> & { width: number; height: number };
  const channels = rgb.length / (width * height);
  let max = 0;
  for (let i = 0; i < rgb.length; i += 97) max = Math.max(max, rgb[i]);
  const scale = max > 255 ? 255 / max : 1;
  const data = new Uint8Array(rgb.length);
  for (let i = 0; i < rgb.length; i++) data[i] = Math.min(255, Math.round(rgb[i] * scale));
  const png = encode({ width, height, data, channels: channels === 4 ? 4 : 3 });
  return { bytes: Buffer.from(png), contentType: 'image/png', extension: 'png', corners };
}

/** A JPEG or PNG's world file with the EPSG code its coordinates are in. */
export interface WorldFileInput {
  text: string;
  epsg: number;
}

/**
 * A GeoTIFF (its own georeference), or a PNG or JPEG with its world file and EPSG code or with
 * corners given by the consultant; anything else is refused with 415.
 */
export async function prepareOverlay(bytes: Buffer, corners: Corners | null, worldFile: WorldFileInput | null = null): Promise<PreparedOverlay> {
  const kind = sniffImage(bytes);
  if (!kind) throw unsupportedMedia('That file is not a GeoTIFF, PNG or JPEG image. Export the orthophoto as one of those.');
  if (kind === 'tiff') return prepareGeoTiff(bytes);
  const size = imageDimensions(bytes, kind);
  if (size && size.width * size.height > MAX_PIXELS) throw imageTooLarge(size.width, size.height, '');
  if (worldFile) {
    if (!size) throw unprocessable(`The ${kind.toUpperCase()} header gives no image size, so its world file cannot place it. Export the image again.`);
    const wf = parseWorldFile(worldFile.text);
    if ('error' in wf) throw unprocessable(`worldFile: ${wf.error}`, [{ path: 'worldFile', message: wf.error }]);
    const def = projectionFor(worldFile.epsg);
    if (!def) throw unknownProjection(worldFile.epsg, 'world file');
    corners = cornersToLonLat(def, worldFileCorners(wf, size.width, size.height), 'image');
  }
  if (!corners) throw unprocessable('corners: a PNG or JPEG carries no location. Give the longitude and latitude of its four corners (top-left, top-right, bottom-right, bottom-left).', [{ path: 'corners', message: 'required for PNG and JPEG' }]);
  return kind === 'png' ? { bytes, contentType: 'image/png', extension: 'png', corners } : { bytes, contentType: 'image/jpeg', extension: 'jpg', corners };
}
