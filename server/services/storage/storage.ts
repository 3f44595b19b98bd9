/**
 * The one way to files: task photos, shared files, season report PDFs and imagery overlays are
 * saved, read, streamed and deleted here, on disk (STORAGE=disk, one machine) or in S3-compatible
 * object storage (STORAGE=s3, any number of machines). Keys are random; the database keeps them.
 */
import crypto from 'node:crypto';
import type { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type { Response } from 'express';
import { config } from '../../config';
import { AppError } from '../../errors';
import { createDiskStorage } from './disk-storage';
import { createS3Storage } from './s3-storage';
import { StoredFileMissing, type Storage } from './storage-types';

export type { Storage, StoredObject } from './storage-types';

const KEY = /^[a-z0-9-]+\/[a-f0-9]{32}(\.[a-z0-9]{1,8})?$/;
const CONTENT_TYPES: Record<string, string> = { pdf: 'application/pdf', png: 'image/png', jpg: 'image/jpeg', jpeg: 'image/jpeg', webp: 'image/webp', heic: 'image/heic', tif: 'image/tiff', tiff: 'image/tiff', csv: 'text/csv', txt: 'text/plain', zip: 'application/zip' };

let current: Storage | null = null;

/** The configured storage (one per process). */
export function storage(): Storage {
  if (!current) {
    current =
      config.storage.kind === 's3'
        ? createS3Storage({ ...config.storage.s3 })
        : createDiskStorage(config.uploadsDir);
  }
  return current;
}

/** Replaces the storage (tests); answers the one it replaced. */
export function useStorage(next: Storage | null): Storage | null {
  const previous = current;
  current = next;
  return previous;
}

function checked(key: string): string {
  if (!KEY.test(key)) throw new Error('invalid storage key');
  return key;
}

/** A 404 with a sentence a person can act on, for a row whose file storage does not hold. */
export const storedFileMissing = (): AppError =>
  new AppError(404, 'stored_file_missing', 'The file is missing from storage. Upload it again (or, for a report, make it again).');

async function missingAs404<T>(work: () => Promise<T>): Promise<T> {
  try {
    return await work();
  } catch (err) {
    if (err instanceof StoredFileMissing) throw storedFileMissing();
    throw err;
  }
}

/** Writes bytes under a new random key in a folder ("overlays", "photos", "files"); answers the key. */
export async function saveFile(folder: string, bytes: Buffer, extension: string): Promise<string> {
  const key = checked(`${folder}/${crypto.randomBytes(16).toString('hex')}${extension ? `.${extension}` : ''}`);
  await storage().put(key, bytes, CONTENT_TYPES[extension] ?? 'application/octet-stream');
  return key;
}

/** Writes a stream under a new random key in a folder without holding it whole in memory; answers the key. */
export async function saveStream(folder: string, stream: Readable, extension: string): Promise<string> {
  const key = checked(`${folder}/${crypto.randomBytes(16).toString('hex')}${extension ? `.${extension}` : ''}`);
  await storage().put(key, stream, CONTENT_TYPES[extension] ?? 'application/octet-stream');
  return key;
}

/** Opens a stored file as a stream with its size; a missing one is a 404 AppError. */
export async function openStoredFile(key: string): Promise<{ stream: Readable; byteSize: number }> {
  return missingAs404(() => storage().open(checked(key)));
}

/** Reads a stored file whole; a missing one is a 404 AppError. */
export async function readFile(key: string): Promise<Buffer> {
  return missingAs404(() => storage().get(checked(key)));
}

/** Deletes a stored file; a missing file is not an error. */
export async function deleteFile(key: string): Promise<void> {
  await storage().remove(checked(key));
}

/**
 * Streams a stored file as the answer (Content-Length from storage). The file is opened before
 * any header is sent, so a missing one is still a clean 404.
 */
export async function sendStoredFile(res: Response, key: string): Promise<void> {
  let opened: { stream: Readable; byteSize: number };
  try {
    opened = await missingAs404(() => storage().open(checked(key)));
  } catch (err) {
    // The route set the file's headers already; the error answer is JSON and must not be cached.
    for (const name of ['Content-Type', 'Content-Disposition', 'Content-Length', 'Cache-Control']) res.removeHeader(name);
    throw err;
  }
  const { stream, byteSize } = opened;
  if (byteSize > 0) res.setHeader('Content-Length', String(byteSize));
  await pipeline(stream, res);
}
