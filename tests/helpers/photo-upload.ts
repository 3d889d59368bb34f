/** Shared by the photo tests: uploads, waiting for the image worker, and what is stored. */
import fs from 'node:fs';
import path from 'node:path';
import type request from 'supertest';
import { photos } from '../../db/schema';
import type { TestServer } from './server';

export type Agent = ReturnType<typeof request.agent> | ReturnType<typeof request>;
export interface UploadFile {
  buf: Buffer;
  name: string;
  type?: string;
}

export function upload(agent: Agent, hiveId: string, files: UploadFile[], fields: Record<string, string> = {}) {
  let req = agent.post(`/api/hives/${hiveId}/photos`);
  for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
  for (const f of files) req = req.attach('photos', f.buf, { filename: f.name, contentType: f.type ?? 'image/jpeg' });
  return req;
}

/** Every file under the storage folder, relative to it. */
export function storedFiles(dir: string): string[] {
  const out: string[] = [];
  const walk = (d: string) => {
    for (const e of fs.readdirSync(d, { withFileTypes: true })) {
      const p = path.join(d, e.name);
      if (e.isDirectory()) walk(p);
      else out.push(path.relative(dir, p));
    }
  };
  if (fs.existsSync(dir)) walk(dir);
  return out.sort();
}

export async function photoRowCount(s: TestServer): Promise<number> {
  return (await s.testDb.db.select({ id: photos.id }).from(photos)).length;
}

interface PhotoBody {
  id: string;
  status: string;
  [k: string]: unknown;
}

/** Polls the hive's photo list until the photo leaves 'processing' (the image worker runs off the request). */
export async function waitForPhoto(agent: Agent, hiveId: string, photoId: string, timeoutMs = 30_000): Promise<PhotoBody> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const res = await agent.get(`/api/hives/${hiveId}/photos`);
    const p = (res.body.photos as PhotoBody[] | undefined)?.find((x) => x.id === photoId);
    if (p && p.status !== 'processing') return p;
    if (Date.now() > until) throw new Error(`photo ${photoId} still ${p?.status ?? 'missing'} after ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

/** Reads a response body as bytes whatever its content type. */
export const binary = (res: request.Response, cb: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => cb(null, Buffer.concat(chunks)));
};
