/**
 * The document fonts: the .woff files of @fontsource/merriweather and @fontsource/source-sans-3
 * (latin subset), unwrapped once per machine into plain TrueType files in a cache folder.
 *
 * Why unwrap: pdfkit (through fontkit) inflates a WOFF in pure JavaScript every time a document
 * opens the font, which cost about 200 ms per PDF; the TrueType bytes inside are identical, and
 * Node's zlib unwraps them once in a few milliseconds. The .woff2 files are not used: they crash
 * pdfkit's subsetter. Should the cache folder not be writable, the .woff files are used directly.
 */
import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, renameSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { tmpdir } from 'node:os';
import { basename, dirname, join } from 'node:path';
import { inflateSync } from 'node:zlib';

const WOFF_SIGNATURE = 0x774f4646; // "wOFF"
const WOFF_HEADER_BYTES = 44;
const WOFF_ENTRY_BYTES = 20;
const SFNT_HEADER_BYTES = 12;
const SFNT_ENTRY_BYTES = 16;

/** Thrown when a font file is not a well-formed WOFF 1.0 file. */
export class FontFileError extends Error {
  readonly code = 'font-file-invalid';
  constructor(message: string) {
    super(message);
    this.name = 'FontFileError';
  }
}

/**
 * The TrueType/OpenType (sfnt) bytes wrapped in a WOFF 1.0 file (W3C "WOFF File Format 1.0",
 * 2012: 44-byte header, 20-byte table directory entries, zlib-compressed tables).
 */
export function woffToSfnt(woff: Buffer): Buffer {
  if (woff.length < WOFF_HEADER_BYTES || woff.readUInt32BE(0) !== WOFF_SIGNATURE) {
    throw new FontFileError('The font file is not a WOFF 1.0 file (its signature is not "wOFF").');
  }
  const flavor = woff.readUInt32BE(4);
  const numTables = woff.readUInt16BE(12);
  if (numTables === 0 || WOFF_HEADER_BYTES + numTables * WOFF_ENTRY_BYTES > woff.length) {
    throw new FontFileError('The WOFF table directory is empty or runs past the end of the file.');
  }
  const tables: Array<{ tag: number; checksum: number; data: Buffer }> = [];
  for (let i = 0; i < numTables; i++) {
    const at = WOFF_HEADER_BYTES + i * WOFF_ENTRY_BYTES;
    const tag = woff.readUInt32BE(at);
    const offset = woff.readUInt32BE(at + 4);
    const compLength = woff.readUInt32BE(at + 8);
    const origLength = woff.readUInt32BE(at + 12);
    const checksum = woff.readUInt32BE(at + 16);
    if (offset + compLength > woff.length) throw new FontFileError('A WOFF table runs past the end of the file.');
    const raw = woff.subarray(offset, offset + compLength);
    const data = compLength < origLength ? inflateSync(raw) : Buffer.from(raw);
    if (data.length !== origLength) throw new FontFileError('A WOFF table did not unpack to its stated length.');
    tables.push({ tag, checksum, data });
  }
  const pad4 = (n: number): number => (n + 3) & ~3;
  const dataStart = SFNT_HEADER_BYTES + numTables * SFNT_ENTRY_BYTES;
  const total = tables.reduce((sum, t) => sum + pad4(t.data.length), dataStart);
  const out = Buffer.alloc(total);
  const entrySelector = Math.floor(Math.log2(numTables));
  const searchRange = 2 ** entrySelector * 16;
  out.writeUInt32BE(flavor, 0);
  out.writeUInt16BE(numTables, 4);
  out.writeUInt16BE(searchRange, 6);
  out.writeUInt16BE(entrySelector, 8);
  out.writeUInt16BE(numTables * 16 - searchRange, 10);
  let offset = dataStart;
  tables.forEach((t, i) => {
    const at = SFNT_HEADER_BYTES + i * SFNT_ENTRY_BYTES;
    out.writeUInt32BE(t.tag, at);
    out.writeUInt32BE(t.checksum, at + 4);
    out.writeUInt32BE(offset, at + 8);
    out.writeUInt32BE(t.data.length, at + 12);
    t.data.copy(out, offset);
    offset += pad4(t.data.length);
  });
  return out;
}

const require = createRequire(import.meta.url);

function fontsourceFile(pkg: string, file: string): string {
  return join(dirname(require.resolve(`${pkg}/package.json`)), 'files', file);
}

/**
 * The TrueType twin of a .woff file in the cache folder, written on first use (atomically) and
 * checked byte for byte on later starts; the .woff path itself when the folder cannot be written.
 */
function unwrapped(woffPath: string): string {
  try {
    const woff = readFileSync(woffPath);
    const sfnt = woffToSfnt(woff);
    const hash = createHash('sha256').update(woff).digest('hex').slice(0, 16);
    const dir = join(tmpdir(), 'browseline-fonts');
    const target = join(dir, `${basename(woffPath, '.woff')}-${hash}.ttf`);
    // A file left there by anyone else is used only when its bytes are exactly ours.
    if (!existsSync(target) || !readFileSync(target).equals(sfnt)) {
      mkdirSync(dir, { recursive: true, mode: 0o700 });
      const partial = `${target}.${process.pid}.partial`;
      writeFileSync(partial, sfnt, { mode: 0o644 });
      renameSync(partial, target);
    }
    return target;
  } catch {
    return woffPath;
  }
}

interface FontFaces {
  normal: string;
  bold: string;
  italics: string;
  bolditalics: string;
}

/** File paths of the heading (Merriweather) and body (Source Sans 3) faces, ready for pdfmake. */
export function documentFontFiles(): { heading: FontFaces; body: FontFaces } {
  const merri = (f: string) => unwrapped(fontsourceFile('@fontsource/merriweather', f));
  const sans = (f: string) => unwrapped(fontsourceFile('@fontsource/source-sans-3', f));
  return {
    heading: {
      normal: merri('merriweather-latin-400-normal.woff'),
      bold: merri('merriweather-latin-700-normal.woff'),
      italics: merri('merriweather-latin-400-italic.woff'),
      bolditalics: merri('merriweather-latin-700-italic.woff'),
    },
    body: {
      normal: sans('source-sans-3-latin-400-normal.woff'),
      // Semibold reads as "bold" in a body face without shouting.
      bold: sans('source-sans-3-latin-600-normal.woff'),
      italics: sans('source-sans-3-latin-400-italic.woff'),
      bolditalics: sans('source-sans-3-latin-600-italic.woff'),
    },
  };
}
