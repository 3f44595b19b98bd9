/** Zip archives: KMZ (a zipped KML) and zipped shapefiles (read with shpjs, which reprojects from the .prj). */
import JSZip from 'jszip';
import shp from 'shpjs';
import { GeoFileError, unreadableFile, unsupportedFile, tooManyFeatures } from './geo-file-error';
import { decodeText } from './detect-format';
import type { SourceFeature } from './normalize-features';
import { parseXml, readKmlDocument, rootName } from './read-xml';

export interface ZipEntry {
  path: string;
  file: JSZip.JSZipObject;
}

export interface OpenedZip {
  zip: JSZip;
  entries: ZipEntry[];
}

/** Open a zip archive; a damaged or truncated one gives a 422 GeoFileError. */
export async function openZip(buffer: Uint8Array, claimedLabel: string): Promise<OpenedZip> {
  let zip: JSZip;
  try {
    zip = await JSZip.loadAsync(buffer, { checkCRC32: true });
  } catch (error) {
    throw unreadableFile(
      `This file is a zip archive${claimedLabel ? ` (${claimedLabel})` : ''} but it could not be opened: ${(error as Error).message.replace(/\s*\?$/, '')}. ` +
        'It may be cut short or damaged; download or export it again.',
    );
  }
  const entries: ZipEntry[] = [];
  zip.forEach((path, file) => {
    const base = path.split('/').pop() ?? '';
    if (file.dir || path.includes('__MACOSX/') || base.startsWith('._')) return;
    entries.push({ path, file });
  });
  return { zip, entries };
}

// jszip keeps the central directory's sizes on a private `_data` member (see its index.d.ts).
function declaredSize(file: JSZip.JSZipObject): number | undefined {
  const data = (file as unknown as { _data?: { uncompressedSize?: unknown } })._data;
  return typeof data?.uncompressedSize === 'number' ? data.uncompressedSize : undefined;
}

async function readEntry(entry: ZipEntry, maxBytes: number): Promise<Uint8Array> {
  const declared = declaredSize(entry.file);
  const tooLarge = () =>
    new GeoFileError(
      413,
      'too-large',
      `"${entry.path}" inside the zip expands to more than ${Math.round(maxBytes / 1e6)} MB, more than one import can take. ` +
        'Split the data into smaller files.',
    );
  if (declared !== undefined && declared > maxBytes) throw tooLarge();
  let bytes: Uint8Array;
  try {
    bytes = await entry.file.async('uint8array');
  } catch (error) {
    throw unreadableFile(`"${entry.path}" inside the zip could not be unpacked: ${(error as Error).message}. Download or export the zip again.`);
  }
  if (bytes.length > maxBytes) throw tooLarge();
  return bytes;
}

const extensionOf = (path: string): string => (path.includes('.') ? path.slice(path.lastIndexOf('.') + 1).toLowerCase() : '');
const stem = (path: string): string => (path.includes('.') ? path.slice(0, path.lastIndexOf('.')) : path).toLowerCase();

/** What the zip holds: a shapefile, a KML (KMZ) or neither. */
export function zipContentKind(entries: ZipEntry[]): 'shapefile' | 'kmz' | null {
  if (entries.some((e) => extensionOf(e.path) === 'shp')) return 'shapefile';
  if (entries.some((e) => extensionOf(e.path) === 'kml')) return 'kmz';
  return null;
}

/** A message for a zip holding no geometry file, listing a few of its entries and guessing what it is. */
export function describeForeignZip(entries: ZipEntry[]): string {
  const names = entries.map((e) => e.path);
  let looksLike = '';
  if (names.includes('[Content_Types].xml')) {
    if (names.some((n) => n.startsWith('word/'))) looksLike = ' It looks like a Word document.';
    else if (names.some((n) => n.startsWith('xl/'))) looksLike = ' It looks like an Excel workbook.';
    else looksLike = ' It looks like an Office document.';
  }
  const listed = names.length === 0 ? 'it is empty' : `found: ${names.slice(0, 5).join(', ')}${names.length > 5 ? `, and ${names.length - 5} more` : ''}`;
  return (
    `This zip archive holds neither a shapefile (.shp with its .dbf and .prj) nor a KML (.kml) — ${listed}.${looksLike} ` +
    'Upload a zipped shapefile, a KMZ, a KML, a GPX or a GeoJSON file.'
  );
}

/** The KML inside a KMZ (doc.kml at the root, else the first .kml) as source features. */
export async function readKmz(opened: OpenedZip, maxFeatures: number, maxUnzippedBytes: number): Promise<SourceFeature[]> {
  const kmls = opened.entries.filter((e) => extensionOf(e.path) === 'kml');
  const entry = kmls.find((e) => e.path.toLowerCase() === 'doc.kml') ?? kmls[0];
  if (!entry) throw unsupportedFile(describeForeignZip(opened.entries));
  const text = decodeText(await readEntry(entry, maxUnzippedBytes));
  const doc = parseXml(text, `KMZ (its ${entry.path})`);
  if (rootName(doc) !== 'kml') {
    throw unreadableFile(`This KMZ's ${entry.path} is not KML: its root element is <${rootName(doc)}>. Export the KMZ again.`);
  }
  return readKmlDocument(doc, maxFeatures, 'KMZ');
}

/**
 * Check a .shp main file header (ESRI Shapefile Technical Description, 1998: file code 9994 and
 * the file length in 16-bit words, both big-endian); shpjs silently drops records of a cut file.
 */
export function checkShpHeader(bytes: Uint8Array, path: string): void {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  if (bytes.length < 100 || view.getInt32(0, false) !== 9994) {
    throw unreadableFile(`"${path}" inside the zip is not a valid shapefile main file (its 100-byte header is missing or wrong). Export the shapefile again.`);
  }
  const declaredBytes = view.getInt32(24, false) * 2;
  if (declaredBytes > bytes.length) {
    throw unreadableFile(
      `The shapefile "${path}" inside the zip could not be read: it is cut short (its header says ${declaredBytes} bytes, the file has ${bytes.length}). ` +
        'Export it again with its .shp, .shx, .dbf and .prj files.',
    );
  }
}

export interface ShapefileSources {
  sources: SourceFeature[];
  /** True when some layer came without a .prj, so projected coordinates cannot be converted. */
  missingPrj: boolean;
  /** True when a .prj names NAD27, whose datum shift to WGS84 shpjs does not apply. */
  nad27: boolean;
}

/** Every shapefile layer in the zip as source features, reprojected to lon/lat by shpjs from its .prj. */
export async function readShapefileZip(opened: OpenedZip, maxFeatures: number, maxUnzippedBytes: number): Promise<ShapefileSources> {
  const byStem = new Map<string, Map<string, ZipEntry>>();
  for (const entry of opened.entries) {
    const ext = extensionOf(entry.path);
    if (!['shp', 'dbf', 'prj', 'cpg'].includes(ext)) continue;
    const group = byStem.get(stem(entry.path)) ?? new Map<string, ZipEntry>();
    group.set(ext, entry);
    byStem.set(stem(entry.path), group);
  }
  const layers = [...byStem.values()].filter((group) => group.has('shp'));
  const sources: SourceFeature[] = [];
  let missingPrj = false;
  let nad27 = false;
  for (const group of layers) {
    const shpEntry = group.get('shp')!;
    const [shpBytes, dbfBytes, prjBytes, cpgBytes] = await Promise.all(
      ['shp', 'dbf', 'prj', 'cpg'].map((ext) => (group.has(ext) ? readEntry(group.get(ext)!, maxUnzippedBytes) : Promise.resolve(undefined))),
    );
    checkShpHeader(shpBytes!, shpEntry.path);
    const prj = prjBytes ? new TextDecoder().decode(prjBytes) : undefined;
    if (!prj) missingPrj = true;
    if (prj && /1927|NAD27|NAD_27/i.test(prj)) nad27 = true;
    let collection: Awaited<ReturnType<typeof shp>>;
    try {
      collection = await shp({
        shp: shpBytes!,
        ...(dbfBytes ? { dbf: dbfBytes } : {}),
        ...(prj ? { prj } : {}),
        ...(cpgBytes ? { cpg: new TextDecoder().decode(cpgBytes) } : {}),
      });
    } catch (error) {
      throw unreadableFile(
        `The shapefile "${shpEntry.path}" inside the zip could not be read (${(error as Error).message}). ` +
          'It may be damaged or incomplete; export it again with its .shp, .shx, .dbf and .prj files.',
      );
    }
    const features = (Array.isArray(collection) ? collection : [collection]).flatMap((c) => c.features ?? []);
    if (sources.length + features.length > maxFeatures) throw tooManyFeatures(sources.length + features.length, maxFeatures);
    const layerNote = layers.length > 1 ? [`from layer "${shpEntry.path}"`] : [];
    for (const feature of features) {
      sources.push({ index: sources.length, geometry: feature.geometry, properties: feature.properties, notes: layerNote });
    }
  }
  return { sources, missingPrj, nad27 };
}
