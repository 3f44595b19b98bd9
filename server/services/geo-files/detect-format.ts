/** Content sniffing for uploaded geometry files: magic bytes first, the file name second. */
import type { ImportFormat } from './types';

export type SniffedContent =
  | { kind: 'zip' }
  | { kind: 'xml'; text: string; root: string | null }
  | { kind: 'json'; text: string }
  | { kind: 'unknown'; looksLike?: string };

/** What the file name's extension claims, or null for an extension we do not read. */
export type ExtensionClaim = ImportFormat | 'zip' | 'xml' | 'json' | 'shp' | null;

const FORMAT_LABELS: Record<ImportFormat, string> = {
  geojson: 'GeoJSON',
  kml: 'KML',
  kmz: 'KMZ',
  gpx: 'GPX',
  shapefile: 'zipped shapefile',
};

/** Human label of an import format, for messages. */
export function formatLabel(format: ImportFormat): string {
  return FORMAT_LABELS[format];
}

/** The lower-case extension of a file name without the dot ('' when there is none). */
export function fileExtension(filename: string): string {
  const base = filename.split(/[\\/]/).pop() ?? '';
  const dot = base.lastIndexOf('.');
  return dot > 0 ? base.slice(dot + 1).toLowerCase() : '';
}

/** The format a file name's extension suggests. */
export function extensionClaim(filename: string): ExtensionClaim {
  switch (fileExtension(filename)) {
    case 'geojson':
      return 'geojson';
    case 'json':
      return 'json';
    case 'kml':
      return 'kml';
    case 'kmz':
      return 'kmz';
    case 'gpx':
      return 'gpx';
    case 'zip':
      return 'zip';
    case 'xml':
      return 'xml';
    case 'shp':
      return 'shp';
    default:
      return null;
  }
}

/** True when the extension is compatible with the format read from the content. */
export function extensionFits(claim: ExtensionClaim, format: ImportFormat): boolean {
  if (claim === null) return false;
  if (claim === format) return true;
  if (claim === 'json') return format === 'geojson';
  if (claim === 'xml') return format === 'kml' || format === 'gpx';
  if (claim === 'zip') return format === 'shapefile' || format === 'kmz';
  return false;
}

const startsWith = (bytes: Uint8Array, magic: number[]): boolean =>
  bytes.length >= magic.length && magic.every((b, i) => bytes[i] === b);

// Signatures of files people upload by mistake, so the message can say what the file seems to be.
const FOREIGN_SIGNATURES: { magic: number[]; looksLike: string }[] = [
  { magic: [0x4d, 0x5a], looksLike: 'a Windows program (.exe or .dll)' },
  { magic: [0x7f, 0x45, 0x4c, 0x46], looksLike: 'a Linux program (ELF)' },
  { magic: [0x25, 0x50, 0x44, 0x46], looksLike: 'a PDF document' },
  { magic: [0x89, 0x50, 0x4e, 0x47], looksLike: 'a PNG image' },
  { magic: [0xff, 0xd8, 0xff], looksLike: 'a JPEG image' },
  { magic: [0x47, 0x49, 0x46, 0x38], looksLike: 'a GIF image' },
  { magic: [0x49, 0x49, 0x2a, 0x00], looksLike: 'a TIFF image' },
  { magic: [0x4d, 0x4d, 0x00, 0x2a], looksLike: 'a TIFF image' },
  { magic: [0x52, 0x61, 0x72, 0x21], looksLike: 'a RAR archive' },
  { magic: [0x37, 0x7a, 0xbc, 0xaf], looksLike: 'a 7-Zip archive' },
  { magic: [0x1f, 0x8b], looksLike: 'a gzip archive' },
  { magic: [0xd0, 0xcf, 0x11, 0xe0], looksLike: 'an old Microsoft Office document' },
  { magic: [0x53, 0x51, 0x4c, 0x69, 0x74, 0x65], looksLike: 'an SQLite database (a GeoPackage?)' },
  // ESRI Shapefile Technical Description (1998): the main file starts with file code 9994, big-endian.
  { magic: [0x00, 0x00, 0x27, 0x0a], looksLike: 'a bare shapefile main file (.shp)' },
];

const ZIP_LOCAL_HEADER = [0x50, 0x4b, 0x03, 0x04]; // "PK\x03\x04" (PKWARE APPNOTE 4.3.7)
const ZIP_EMPTY_ARCHIVE = [0x50, 0x4b, 0x05, 0x06]; // end of central directory only: an empty zip

/** Decode text, honouring a byte-order mark and an XML encoding declaration; UTF-8 otherwise. */
export function decodeText(bytes: Uint8Array): string {
  if (startsWith(bytes, [0xef, 0xbb, 0xbf])) return new TextDecoder('utf-8').decode(bytes.subarray(3));
  if (startsWith(bytes, [0xff, 0xfe])) return new TextDecoder('utf-16le').decode(bytes.subarray(2));
  if (startsWith(bytes, [0xfe, 0xff])) return new TextDecoder('utf-16be').decode(bytes.subarray(2));
  const head = new TextDecoder('latin1').decode(bytes.subarray(0, 200));
  const declared = /^\s*<\?xml[^>]*encoding\s*=\s*["']([A-Za-z0-9._-]+)["']/.exec(head)?.[1];
  if (declared && !/^utf-?8$/i.test(declared)) {
    try {
      return new TextDecoder(declared).decode(bytes);
    } catch {
      // An encoding label TextDecoder does not know: fall back to UTF-8.
    }
  }
  return new TextDecoder('utf-8').decode(bytes);
}

/** The local name of the first element of an XML text (skipping the declaration, comments, DOCTYPE). */
export function sniffXmlRoot(text: string): string | null {
  const match = /^(?:\s*(?:<\?[\s\S]*?\?>|<!--[\s\S]*?-->|<!DOCTYPE[^>[]*(?:\[[\s\S]*?\])?\s*>))*\s*<([A-Za-z_][\w.-]*:)?([A-Za-z_][\w.-]*)/.exec(
    text.slice(0, 64 * 1024),
  );
  return match ? match[2] : null;
}

/** Look at the bytes and say whether the content is a zip archive, XML, JSON or something else. */
export function sniffContent(bytes: Uint8Array): SniffedContent {
  if (startsWith(bytes, ZIP_LOCAL_HEADER) || startsWith(bytes, ZIP_EMPTY_ARCHIVE)) return { kind: 'zip' };
  for (const signature of FOREIGN_SIGNATURES) {
    if (startsWith(bytes, signature.magic)) return { kind: 'unknown', looksLike: signature.looksLike };
  }
  // Text formats: look at the first non-blank character after decoding.
  const text = decodeText(bytes);
  const first = /\S/.exec(text.slice(0, 4096))?.[0];
  if (first === '<') return { kind: 'xml', text, root: sniffXmlRoot(text) };
  if (first === '{' || first === '[') return { kind: 'json', text };
  // A NUL byte (outside UTF-16, handled above) means binary content.
  if (bytes.subarray(0, 4096).includes(0)) return { kind: 'unknown', looksLike: 'a binary file' };
  return { kind: 'unknown', looksLike: first === undefined ? 'an empty text file' : 'a plain text file' };
}
