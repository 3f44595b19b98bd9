/**
 * Uploaded files on disk, outside the web root, under random names; the database keeps the key.
 * Swap this module for object storage when several servers share no disk.
 */
import crypto from 'node:crypto';
import fs from 'node:fs/promises';
import path from 'node:path';
import { config } from '../../config';

const KEY = /^[a-z0-9-]+\/[a-f0-9]{32}(\.[a-z0-9]{1,8})?$/;

function fullPath(key: string): string {
  if (!KEY.test(key)) throw new Error('invalid storage key');
  return path.join(config.uploadsDir, key);
}

/** Writes bytes under a new random key in a folder ("overlays", "photos", …); answers the key. */
export async function saveFile(folder: string, bytes: Buffer, extension: string): Promise<string> {
  const key = `${folder}/${crypto.randomBytes(16).toString('hex')}${extension ? `.${extension}` : ''}`;
  const target = fullPath(key);
  await fs.mkdir(path.dirname(target), { recursive: true });
  await fs.writeFile(target, bytes, { flag: 'wx', mode: 0o640 });
  return key;
}

/** Reads a stored file. */
export async function readFile(key: string): Promise<Buffer> {
  return fs.readFile(fullPath(key));
}

/** Deletes a stored file; a missing file is not an error. */
export async function deleteFile(key: string): Promise<void> {
  await fs.rm(fullPath(key), { force: true });
}
