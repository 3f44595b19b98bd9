/**
 * A small zip writer for tests that need archives no zip library would write: declared sizes
 * chosen by the test, thousands of entries, entries that expand to hundreds of megabytes.
 * Layout from PKWARE's APPNOTE.TXT 6.3 (4.3.7 local file header, 4.3.12 central directory
 * header, 4.3.16 end of central directory record). Deflate is raw DEFLATE (RFC 1951).
 */
import { createDeflateRaw, crc32 } from 'node:zlib';

export interface ZipEntryBytes {
  name: string;
  /** The stored bytes (already deflated when `method` is 8). */
  data: Uint8Array;
  method: 0 | 8;
  crc: number;
  /** The uncompressed size written in both headers (a test may make it lie). */
  size: number;
}

/** An entry stored without compression. */
export function storedEntry(name: string, content: Uint8Array | string): ZipEntryBytes {
  const data = typeof content === 'string' ? Buffer.from(content) : content;
  return { name, data, method: 0, crc: crc32(data), size: data.length };
}

/** Raw-deflate `totalBytes` zero bytes in 1 MB chunks (about 1 KB out per MB in), with their CRC-32. */
export async function deflatedZeros(totalBytes: number): Promise<{ data: Buffer; crc: number }> {
  const chunk = Buffer.alloc(Math.min(totalBytes, 1024 * 1024));
  const deflate = createDeflateRaw({ level: 9 });
  const out: Buffer[] = [];
  deflate.on('data', (b: Buffer) => out.push(b));
  const done = new Promise<void>((resolve, reject) => {
    deflate.on('end', resolve);
    deflate.on('error', reject);
  });
  let crc = 0;
  for (let written = 0; written < totalBytes; written += chunk.length) {
    const piece = chunk.subarray(0, Math.min(chunk.length, totalBytes - written));
    crc = crc32(piece, crc);
    if (!deflate.write(piece)) await new Promise((r) => deflate.once('drain', r));
  }
  deflate.end();
  await done;
  return { data: Buffer.concat(out), crc };
}

/** Assemble a zip archive from entries. */
export function buildZip(entries: ZipEntryBytes[]): Buffer {
  const locals: Buffer[] = [];
  const centrals: Buffer[] = [];
  let offset = 0;
  for (const e of entries) {
    const name = Buffer.from(e.name, 'utf8');
    const local = Buffer.alloc(30);
    local.writeUInt32LE(0x04034b50, 0); // local file header signature
    local.writeUInt16LE(20, 4); // version needed: 2.0
    local.writeUInt16LE(0x0800, 6); // flags: UTF-8 names
    local.writeUInt16LE(e.method, 8);
    local.writeUInt32LE(e.crc >>> 0, 14);
    local.writeUInt32LE(e.data.length, 18);
    local.writeUInt32LE(e.size, 22);
    local.writeUInt16LE(name.length, 26);
    const central = Buffer.alloc(46);
    central.writeUInt32LE(0x02014b50, 0); // central directory header signature
    central.writeUInt16LE(20, 4);
    central.writeUInt16LE(20, 6);
    central.writeUInt16LE(0x0800, 8);
    central.writeUInt16LE(e.method, 10);
    central.writeUInt32LE(e.crc >>> 0, 16);
    central.writeUInt32LE(e.data.length, 20);
    central.writeUInt32LE(e.size, 24);
    central.writeUInt16LE(name.length, 28);
    central.writeUInt32LE(offset, 42); // offset of the local header
    locals.push(local, name, Buffer.from(e.data));
    centrals.push(central, name);
    offset += 30 + name.length + e.data.length;
  }
  const directory = Buffer.concat(centrals);
  const end = Buffer.alloc(22);
  end.writeUInt32LE(0x06054b50, 0); // end of central directory signature
  end.writeUInt16LE(entries.length, 8);
  end.writeUInt16LE(entries.length, 10);
  end.writeUInt32LE(directory.length, 12);
  end.writeUInt32LE(offset, 16);
  return Buffer.concat([...locals, directory, end]);
}

/**
 * The bomb of the issue: a "shapefile" zip of four entries, each expanding to `entryBytes` zero
 * bytes (200 MB unless told), about 200 KB each on the wire.
 */
export async function shapefileBomb(entryBytes = 200 * 1024 * 1024): Promise<Buffer> {
  const zeros = await deflatedZeros(entryBytes);
  const entry = (name: string): ZipEntryBytes => ({ name, data: zeros.data, method: 8, crc: zeros.crc, size: entryBytes });
  return buildZip([entry('parcels.shp'), entry('parcels.shx'), entry('parcels.dbf'), entry('parcels.prj')]);
}
