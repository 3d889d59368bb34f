import fs from 'node:fs';
import fsp from 'node:fs/promises';
import path from 'node:path';
import { Readable, Transform } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import { assertKey, ObjectNotFoundError, randomKeyPart, type ObjectStorage } from './storage';

/**
 * The local-folder driver: each object is a file under `root` named by its key. Writes go to a
 * temporary file first and are renamed into place, so a reader never sees half an object.
 * The folder is never served statically; photos go out through the access-checked route.
 */
export function createLocalStorage(root: string): ObjectStorage {
  const base = path.resolve(root);

  const fileOf = (key: string) => {
    assertKey(key);
    const file = path.resolve(base, ...key.split('/'));
    // Belt and braces: the key check already forbids anything that could climb out.
    if (!file.startsWith(base + path.sep)) throw new Error(`Object key escapes the storage folder: ${key}`);
    return file;
  };

  return {
    async put(key, body) {
      const file = fileOf(key);
      await fsp.mkdir(path.dirname(file), { recursive: true });
      const part = `${file}.part-${randomKeyPart().slice(0, 8)}`;
      let bytes = 0;
      const count = new Transform({
        transform(chunk: Buffer, _enc, cb) {
          bytes += chunk.length;
          cb(null, chunk);
        },
      });
      try {
        const source = Buffer.isBuffer(body) ? Readable.from([body]) : body;
        await pipeline(source, count, fs.createWriteStream(part, { flags: 'wx', mode: 0o600 }));
        await fsp.rename(part, file);
      } catch (err) {
        await fsp.rm(part, { force: true });
        throw err;
      }
      return { bytes };
    },

    async get(key) {
      const file = fileOf(key);
      const handle = await fsp.open(file, 'r').catch((err: NodeJS.ErrnoException) => {
        if (err.code === 'ENOENT') throw new ObjectNotFoundError(key);
        throw err;
      });
      return handle.createReadStream();
    },

    async delete(key) {
      const file = fileOf(key);
      await fsp.rm(file, { force: true });
      // Tidy the now-empty per-object folder; a folder still in use stays.
      const dir = path.dirname(file);
      if (dir !== base) await fsp.rmdir(dir).catch(() => undefined);
    },

    async exists(key) {
      try {
        return (await fsp.stat(fileOf(key))).isFile();
      } catch {
        return false;
      }
    },
  };
}
