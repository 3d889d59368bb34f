import { and, eq } from 'drizzle-orm';
import { PHOTO_LIMITS } from '../../shared/domain/photos';
import { photos } from '../../db/schema';
import type { Ctx } from '../context';
import { createImagePipeline, type ImagePipeline, type PipelineResult } from '../images/pipeline';
import { randomKeyPart, readAll } from '../storage';

/**
 * The photo job: take the upload out of storage, let the image worker re-encode it, store the
 * three sizes and mark the photo ready (or failed, with the reason in a keeper's words).
 * Runs after the upload request has answered 202.
 */

let shared: ImagePipeline | null = null;
/** One image worker for the whole process, whatever number of apps a test boots. */
export function imagePipeline(): ImagePipeline {
  shared ??= createImagePipeline();
  return shared;
}

const chains = new WeakMap<Ctx, Promise<void>>();

/** Queues photos for processing, in order; resolves when these are done (tests and the benchmark may wait). */
export function enqueuePhotos(ctx: Ctx, photoIds: string[]): Promise<void> {
  let chain = chains.get(ctx) ?? Promise.resolve();
  for (const id of photoIds) {
    chain = chain.then(() =>
      processPhoto(ctx, id).catch((err) => ctx.logger.error({ err, photoId: id }, 'photo processing failed')),
    );
  }
  chains.set(ctx, chain);
  return chain;
}

/** Picks up photos left 'processing' by a stopped server (their upload is still in storage). */
export async function resumePhotoProcessing(ctx: Ctx): Promise<number> {
  const rows = await ctx.db.select({ id: photos.id }).from(photos).where(eq(photos.status, 'processing')).orderBy(photos.seq);
  if (rows.length) void enqueuePhotos(ctx, rows.map((r) => r.id));
  return rows.length;
}

function failureText(r: Extract<PipelineResult, { ok: false }>): string {
  switch (r.reason) {
    case 'not_image':
    case 'undecodable':
      return 'Frameside could not read this picture. Delete it and choose a JPEG or PNG photo.';
    case 'too_many_pixels':
      return `This picture is ${r.width} × ${r.height} pixels, more than Frameside takes (${PHOTO_LIMITS.maxPixels / 1_000_000} megapixels). Delete it and choose a smaller photo.`;
    case 'timeout':
      return 'This picture took too long to process. Delete it and try a smaller photo.';
    default:
      return 'Something went wrong while processing this photo. Delete it and add it again.';
  }
}

export async function processPhoto(ctx: Ctx, photoId: string): Promise<void> {
  const [row] = await ctx.db.select().from(photos).where(eq(photos.id, photoId)).limit(1);
  if (!row || row.status !== 'processing' || !row.uploadKey) return;
  const uploadKey = row.uploadKey;

  const fail = async (reason: string) => {
    await ctx.db
      .update(photos)
      .set({ status: 'failed', failureReason: reason, uploadKey: null, updatedAt: ctx.now() })
      .where(and(eq(photos.id, photoId), eq(photos.status, 'processing')));
    await ctx.storage.delete(uploadKey);
  };

  let input: Buffer;
  try {
    input = await readAll(ctx.storage, uploadKey, PHOTO_LIMITS.maxBytes + 1);
  } catch (err) {
    ctx.logger.warn({ err, photoId }, 'photo upload missing from storage');
    return fail('The upload was lost before it could be processed. Delete it and add the photo again.');
  }
  const r = await imagePipeline().process(input);
  if (!r.ok) {
    if (r.reason === 'internal') ctx.logger.error({ photoId, detail: r.detail }, 'image worker failed');
    return fail(failureText(r));
  }

  const base = `photos/${randomKeyPart()}`;
  const keys = { originalKey: `${base}/original.jpg`, displayKey: `${base}/display.jpg`, thumbKey: `${base}/thumb.jpg` };
  const put = { contentType: 'image/jpeg' };
  const stored = await ctx.storage.put(keys.originalKey, r.original, put);
  await ctx.storage.put(keys.displayKey, r.display, put);
  await ctx.storage.put(keys.thumbKey, r.thumb, put);
  const updated = await ctx.db
    .update(photos)
    .set({ status: 'ready', ...keys, width: r.width, height: r.height, bytes: stored.bytes, uploadKey: null, failureReason: null, updatedAt: ctx.now() })
    .where(and(eq(photos.id, photoId), eq(photos.status, 'processing')))
    .returning({ id: photos.id });
  if (updated.length === 0) {
    // Deleted while it was being processed: nothing may stay behind.
    await Promise.all(Object.values(keys).map((k) => ctx.storage.delete(k)));
  }
  await ctx.storage.delete(uploadKey);
}
