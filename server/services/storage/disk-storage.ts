/**
 * Uploaded files on disk, outside the web root, under random names; the database keeps the key.
 * The default for one machine (STORAGE=disk); several machines share object storage instead.
 */
import fsp from 'node:fs/promises';
import path from 'node:path';
import { StoredFileMissing, type Storage, type StoredObject } from './storage-types';

const isMissing = (err: unknown): boolean => (err as NodeJS.ErrnoException)?.code === 'ENOENT';

/** Storage in a folder on this machine's disk. */
export function createDiskStorage(root: string): Storage {
  const fullPath = (key: string) => path.join(root, key);
  return {
    kind: 'disk',
    async put(key, bytes) {
      const target = fullPath(key);
      await fsp.mkdir(path.dirname(target), { recursive: true });
      await fsp.writeFile(target, bytes, { flag: 'wx', mode: 0o640 });
    },
    async get(key) {
      try {
        return await fsp.readFile(fullPath(key));
      } catch (err) {
        if (isMissing(err)) throw new StoredFileMissing(key);
        throw err;
      }
    },
    async open(key) {
      let handle: fsp.FileHandle;
      try {
        handle = await fsp.open(fullPath(key), 'r');
      } catch (err) {
        if (isMissing(err)) throw new StoredFileMissing(key);
        throw err;
      }
      const { size } = await handle.stat();
      return { stream: handle.createReadStream(), byteSize: size };
    },
    async remove(key) {
      await fsp.rm(fullPath(key), { force: true });
    },
    async *list(prefix) {
      const folder = fullPath(prefix.replace(/\/$/, ''));
      let names: string[];
      try {
        names = await fsp.readdir(folder);
      } catch (err) {
        if (isMissing(err)) return;
        throw err;
      }
      for (const name of names) {
        const stat = await fsp.stat(path.join(folder, name)).catch(() => null);
        if (!stat?.isFile()) continue;
        const object: StoredObject = { key: `${prefix.replace(/\/$/, '')}/${name}`, byteSize: stat.size, lastModified: stat.mtime };
        yield object;
      }
    },
  };
}

