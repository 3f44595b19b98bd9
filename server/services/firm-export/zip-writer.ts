/**
 * A zip written entry by entry to a file on disk (fflate's streaming Zip), so an export of any size
 * holds only one chunk of one entry in memory at a time. Entries are written one after another.
 */
import fs from 'node:fs';
import { once } from 'node:events';
import { Zip, ZipDeflate, ZipPassThrough } from 'fflate';

/** File kinds already compressed: stored as they are instead of deflated again. */
const STORED = /\.(zip|png|jpe?g|webp|gif|pdf|tiff?|kmz|gz)$/i;

export interface ZipFileWriter {
  /** Adds one entry from bytes or a stream of chunks; resolves once its bytes are handed to the file. */
  add(name: string, content: Uint8Array | string | AsyncIterable<Uint8Array | string>, mtime?: Date): Promise<void>;
  /** Writes the central directory and closes the file; answers the entry count. */
  close(): Promise<number>;
  /** Stops and closes the file after a failure (the caller removes it). */
  abort(): void;
}

/** Opens a zip file for writing at the path (which must not exist). */
export function createZipFile(path: string): ZipFileWriter {
  const out = fs.createWriteStream(path, { flags: 'wx', mode: 0o600 });
  let failure: Error | null = null;
  out.on('error', (err) => {
    failure = err;
  });
  const zip = new Zip((err, chunk, final) => {
    if (err) failure = err;
    else out.write(chunk);
    if (final) out.end();
  });
  let count = 0;
  const encoder = new TextEncoder();
  const bytes = (c: Uint8Array | string) => (typeof c === 'string' ? encoder.encode(c) : c);
  const drained = async () => {
    if (failure) throw failure;
    if (out.writableNeedDrain) await once(out, 'drain');
  };
  return {
    async add(name, content, mtime = new Date()) {
      const entry = STORED.test(name) ? new ZipPassThrough(name) : new ZipDeflate(name, { level: 6 });
      entry.mtime = mtime;
      zip.add(entry);
      count++;
      if (typeof content === 'string' || content instanceof Uint8Array) {
        entry.push(bytes(content), true);
        await drained();
        return;
      }
      for await (const chunk of content) {
        entry.push(bytes(chunk));
        await drained();
      }
      entry.push(new Uint8Array(0), true);
      await drained();
    },
    async close() {
      zip.end();
      if (!out.writableFinished) await once(out, 'finish');
      if (failure) throw failure;
      return count;
    },
    abort() {
      zip.terminate();
      out.destroy();
    },
  };
}
