import { randomBytes } from 'node:crypto';
import type { Readable } from 'node:stream';

/**
 * Object storage, by key. The local-folder driver stands in for an S3-compatible store; a
 * driver for one implements the same four calls and callers do not change.
 */
export interface ObjectStorage {
  /** Stores the bytes under the key, replacing any object there; resolves with the byte count once durable. */
  put(key: string, body: Readable | Buffer, meta?: { contentType?: string }): Promise<{ bytes: number }>;
  /** A stream of the object's bytes; rejects with `ObjectNotFoundError` when there is none. */
  get(key: string): Promise<Readable>;
  /** Removes the object; a missing key is not an error (deletes are retried). */
  delete(key: string): Promise<void>;
  exists(key: string): Promise<boolean>;
}

export class ObjectNotFoundError extends Error {
  constructor(public readonly key: string) {
    super(`No stored object under ${key}`);
    this.name = 'ObjectNotFoundError';
  }
}

/** Keys are lowercase path-like names made by the server: `photos/<32 hex>/thumb.jpg`. */
const KEY_RE = /^[a-z0-9]+(?:[/_.-][a-z0-9]+)*$/;

export function assertKey(key: string): void {
  if (key.length > 200 || !KEY_RE.test(key) || key.split('/').some((p) => p === '.' || p === '..')) {
    throw new Error(`Not a valid object key: ${JSON.stringify(key)}`);
  }
}

/** 128 random bits: a key nobody can guess, and never made from anything a client sent. */
export function randomKeyPart(): string {
  return randomBytes(16).toString('hex');
}

/** Reads a whole object into memory (the image worker needs the whole file anyway). */
export async function readAll(storage: ObjectStorage, key: string, maxBytes = Infinity): Promise<Buffer> {
  const stream = await storage.get(key);
  const chunks: Buffer[] = [];
  let total = 0;
  for await (const chunk of stream) {
    total += (chunk as Buffer).length;
    if (total > maxBytes) {
      stream.destroy();
      throw new Error(`Object ${key} is larger than ${maxBytes} bytes`);
    }
    chunks.push(chunk as Buffer);
  }
  return Buffer.concat(chunks);
}
