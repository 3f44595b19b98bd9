/** The storage contract: bytes under keys such as "photos/<32 hex>.jpg", on disk or in object storage. */
import type { Readable } from 'node:stream';

/** One stored object as a listing shows it. */
export interface StoredObject {
  key: string;
  byteSize: number;
  lastModified: Date;
}

/** Where uploaded and generated files live; every reader and writer of files goes through one of these. */
export interface Storage {
  readonly kind: 'disk' | 's3';
  /** Writes bytes (or a stream of them, never held whole in memory) under a key that does not exist yet. */
  put(key: string, bytes: Buffer | Readable, contentType: string): Promise<void>;
  /** Reads a whole object; throws StoredFileMissing when there is none. */
  get(key: string): Promise<Buffer>;
  /** Opens an object as a stream with its size; throws StoredFileMissing when there is none. */
  open(key: string): Promise<{ stream: Readable; byteSize: number }>;
  /** Removes an object; a missing one is not an error. */
  remove(key: string): Promise<void>;
  /** Every object whose key starts with the prefix (e.g. "photos/"). */
  list(prefix: string): AsyncIterable<StoredObject>;
}

/** Thrown when a row points at a file the storage does not hold (answered as a 404). */
export class StoredFileMissing extends Error {
  constructor(public readonly key: string) {
    super(`stored file ${key} is missing`);
    this.name = 'StoredFileMissing';
  }
}
