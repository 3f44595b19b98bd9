/**
 * Zip archives: KMZ (a zipped KML, following NetworkLinks inside the archive) and zipped
 * shapefiles (read with shpjs, which reprojects from the .prj). The central directory is checked
 * first (entry count, declared sizes) and every entry is inflated with a running byte count, so a
 * zip bomb is refused before it costs memory or time.
 */
import yauzl from 'yauzl';
import shp from 'shpjs';
import { GeoFileError, unreadableFile, unsupportedFile, tooManyFeatures } from './geo-file-error';
import { decodeText } from './detect-format';
import type { SourceFeature } from './normalize-features';
import { readKmlText, VertexCounter, type XmlReadLimits } from './read-xml';
import { dbfEncoding, shapefileCounts } from './shapefile-header';

export interface ZipEntry {
  path: string;
  entry: yauzl.Entry;
}

export interface ZipLimits {
  /** Most bytes the entries together may expand to. */
  maxUnzippedBytes: number;
  /** Most entries (files and folders) the archive may list. */
  maxEntries: number;
}

export interface OpenedZip {
  zip: yauzl.ZipFile;
  entries: ZipEntry[];
  limits: ZipLimits;
  /** Bytes inflated so far (the running count the limit applies to). */
  inflated: number;
}

const megabytes = (bytes: number): string => `${Math.round(bytes / 1024 / 1024)} MB`;

function tooLarge(what: string, maxBytes: number): GeoFileError {
  return new GeoFileError(
    413,
    'too-large',
    `${what} expands to more than ${megabytes(maxBytes)}, more than one import can take. Split the data into smaller files, or zip only the layers you need.`,
    { maxUnzippedBytes: maxBytes },
  );
}

function damaged(claimedLabel: string, message: string): GeoFileError {
  return unreadableFile(
    `This file is a zip archive${claimedLabel ? ` (${claimedLabel})` : ''} but it could not be opened: ${message.replace(/\s*\?$/, '')}. ` +
      'It may be cut short or damaged; download or export it again.',
  );
}

/**
 * Open a zip archive from its central directory without inflating anything; refuse (413) an
 * archive listing more entries than `maxEntries` or declaring more than `maxUnzippedBytes` in all,
 * and (422) a damaged or truncated one.
 */
export async function openZip(buffer: Uint8Array, claimedLabel: string, limits: ZipLimits): Promise<OpenedZip> {
  const data = Buffer.isBuffer(buffer) ? buffer : Buffer.from(buffer.buffer, buffer.byteOffset, buffer.byteLength);
  const zip = await new Promise<yauzl.ZipFile>((resolve, reject) =>
    yauzl.fromBuffer(data, { lazyEntries: true, validateEntrySizes: true, strictFileNames: false }, (error, opened) =>
      error || !opened ? reject(damaged(claimedLabel, error?.message ?? 'no archive')) : resolve(opened),
    ),
  );
  if (zip.entryCount > limits.maxEntries) {
    zip.close();
    throw new GeoFileError(
      413,
      'too-many-entries',
      `This zip lists ${zip.entryCount.toLocaleString('en-US')} files; one import can open at most ${limits.maxEntries.toLocaleString('en-US')}. Zip only the layers you need.`,
      { maxEntries: limits.maxEntries },
    );
  }
  const entries: ZipEntry[] = [];
  let declared = 0;
  await new Promise<void>((resolve, reject) => {
    zip.on('entry', (entry: yauzl.Entry) => {
      declared += entry.uncompressedSize;
      if (declared > limits.maxUnzippedBytes) {
        zip.close();
        reject(tooLarge('This zip', limits.maxUnzippedBytes));
        return;
      }
      const path = entry.fileName;
      const base = path.split('/').pop() ?? '';
      if (!path.endsWith('/') && !path.includes('__MACOSX/') && !base.startsWith('._')) entries.push({ path, entry });
      zip.readEntry();
    });
    zip.on('end', () => resolve());
    zip.on('error', (error: Error) => reject(damaged(claimedLabel, error.message)));
    zip.readEntry();
  });
  return { zip, entries, limits, inflated: 0 };
}

/** Inflate one entry, counting bytes as they come; over the archive's budget it stops at once (413). */
export async function readEntry(opened: OpenedZip, item: ZipEntry): Promise<Uint8Array> {
  const { limits } = opened;
  if (opened.inflated + item.entry.uncompressedSize > limits.maxUnzippedBytes) throw tooLarge(`"${item.path}" inside the zip`, limits.maxUnzippedBytes);
  const stream = await new Promise<NodeJS.ReadableStream & { destroy(): void }>((resolve, reject) =>
    opened.zip.openReadStream(item.entry, (error, s) =>
      error || !s
        ? reject(unreadableFile(`"${item.path}" inside the zip could not be unpacked: ${error?.message ?? 'no data'}. Download or export the zip again.`))
        : resolve(s as never),
    ),
  );
  const chunks: Buffer[] = [];
  await new Promise<void>((resolve, reject) => {
    stream.on('data', (chunk: Buffer) => {
      opened.inflated += chunk.length;
      if (opened.inflated > limits.maxUnzippedBytes) {
        stream.destroy();
        reject(tooLarge(`"${item.path}" inside the zip`, limits.maxUnzippedBytes));
        return;
      }
      chunks.push(chunk);
    });
    stream.on('end', () => resolve());
    stream.on('error', (error: Error) =>
      reject(unreadableFile(`"${item.path}" inside the zip could not be unpacked: ${error.message}. Download or export the zip again.`)),
    );
  });
  return new Uint8Array(Buffer.concat(chunks));
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

/** Resolve a NetworkLink href against the linking file's folder inside the archive; null for a link outside it. */
export function resolveArchiveLink(from: string, href: string): string | null {
  const clean = href.trim().replace(/^\.\//, '');
  if (/^[a-z][a-z0-9+.-]*:/i.test(clean) || clean.startsWith('/')) return null; // http:, file:, absolute paths
  const parts = from.split('/').slice(0, -1);
  for (const piece of decodeURIComponent(clean.split(/[?#]/)[0]).split('/')) {
    if (piece === '..') {
      if (parts.length === 0) return null;
      parts.pop();
    } else if (piece !== '.' && piece !== '') parts.push(piece);
  }
  return parts.join('/');
}

/** Most NetworkLink hops followed inside one KMZ (GDAL's LIBKML driver writes one: doc.kml → layers). */
const MAX_LINK_DEPTH = 8;

export interface KmzSources {
  sources: SourceFeature[];
  /** Remarks for the whole file, e.g. links to outside the archive that were not followed. */
  warnings: string[];
}

/**
 * The KML inside a KMZ (doc.kml at the root, else the first .kml) as source features; a
 * NetworkLink to another .kml inside the archive (as GDAL's LIBKML driver writes a layer per file)
 * is followed, once per file, and a link outside the archive is named in a warning.
 */
export async function readKmz(opened: OpenedZip, limits: XmlReadLimits): Promise<KmzSources> {
  const kmls = opened.entries.filter((e) => extensionOf(e.path) === 'kml');
  const first = kmls.find((e) => e.path.toLowerCase() === 'doc.kml') ?? kmls[0];
  if (!first) throw unsupportedFile(describeForeignZip(opened.entries));
  const byPath = new Map(opened.entries.map((e) => [e.path.toLowerCase(), e]));
  const vertices = new VertexCounter(limits.maxVertices);
  const sources: SourceFeature[] = [];
  const warnings: string[] = [];
  const visited = new Set<string>();
  const visit = async (entry: ZipEntry, depth: number, via: string | null): Promise<void> => {
    visited.add(entry.path.toLowerCase());
    const text = decodeText(await readEntry(opened, entry));
    const read = readKmlText(text, limits, vertices, `KMZ (its ${entry.path})`);
    if (sources.length + read.sources.length > limits.maxFeatures) throw tooManyFeatures(sources.length + read.sources.length, limits.maxFeatures);
    const note = via ? [`from "${entry.path}" (linked from ${via})`] : [];
    for (const source of read.sources) sources.push({ ...source, index: sources.length, notes: [...(source.notes ?? []), ...note] });
    for (const href of read.links) {
      const target = resolveArchiveLink(entry.path, href);
      const linked = target === null ? undefined : byPath.get(target.toLowerCase());
      if (!linked) {
        warnings.push(`"${entry.path}" links to "${href}", which is not inside this KMZ; that link was not followed. Put the linked layer in the KMZ, or export it on its own.`);
        continue;
      }
      if (visited.has(linked.path.toLowerCase())) continue;
      if (depth >= MAX_LINK_DEPTH) {
        warnings.push(`Links inside this KMZ nest deeper than ${MAX_LINK_DEPTH} levels; "${linked.path}" was not read.`);
        continue;
      }
      await visit(linked, depth + 1, `"${entry.path}"`);
    }
  };
  await visit(first, 0, null);
  return { sources, warnings };
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
  warnings: string[];
}

/**
 * Every shapefile layer in the zip as source features, reprojected to lon/lat by shpjs from its
 * .prj; the text encoding comes from the .cpg, else from the .dbf's language-driver byte. The
 * record and vertex counts are read from the .shp before shpjs parses anything.
 */
export async function readShapefileZip(opened: OpenedZip, limits: XmlReadLimits): Promise<ShapefileSources> {
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
  const vertices = new VertexCounter(limits.maxVertices);
  const warnings: string[] = [];
  let missingPrj = false;
  let nad27 = false;
  for (const group of layers) {
    const shpEntry = group.get('shp')!;
    const shpBytes = await readEntry(opened, shpEntry);
    checkShpHeader(shpBytes, shpEntry.path);
    const counts = shapefileCounts(shpBytes);
    if (sources.length + counts.records > limits.maxFeatures) throw tooManyFeatures(sources.length + counts.records, limits.maxFeatures);
    vertices.add(counts.vertices);
    const dbf = group.has('dbf') ? await readEntry(opened, group.get('dbf')!) : undefined;
    const prjData = group.has('prj') ? await readEntry(opened, group.get('prj')!) : undefined;
    const cpgData = group.has('cpg') ? await readEntry(opened, group.get('cpg')!) : undefined;
    const prj = prjData ? new TextDecoder().decode(prjData) : undefined;
    if (!prj) missingPrj = true;
    if (prj && /1927|NAD27|NAD_27/i.test(prj)) nad27 = true;
    let cpg = cpgData ? new TextDecoder().decode(cpgData).trim() : undefined;
    if (!cpg && dbf) {
      const encoding = dbfEncoding(dbf);
      if (encoding.label) cpg = encoding.label;
      else if (encoding.warning) warnings.push(`"${group.get('dbf')!.path}": ${encoding.warning}`);
    }
    let collection: Awaited<ReturnType<typeof shp>>;
    try {
      collection = await shp({ shp: shpBytes, ...(dbf ? { dbf } : {}), ...(prj ? { prj } : {}), ...(cpg ? { cpg } : {}) });
    } catch (error) {
      throw unreadableFile(
        `The shapefile "${shpEntry.path}" inside the zip could not be read (${(error as Error).message}). ` +
          'It may be damaged or incomplete; export it again with its .shp, .shx, .dbf and .prj files.',
      );
    }
    const features = (Array.isArray(collection) ? collection : [collection]).flatMap((c) => c.features ?? []);
    if (sources.length + features.length > limits.maxFeatures) throw tooManyFeatures(sources.length + features.length, limits.maxFeatures);
    const layerNote = layers.length > 1 ? [`from layer "${shpEntry.path}"`] : [];
    for (const feature of features) {
      sources.push({ index: sources.length, geometry: feature.geometry, properties: feature.properties, notes: layerNote });
    }
  }
  return { sources, missingPrj, nad27, warnings };
}
