import type { Readable } from 'node:stream';
import { and, asc, eq } from 'drizzle-orm';
import { can } from '../../shared/domain/access';
import { frameLabel, type PhotoSize } from '../../shared/domain/photos';
import { photoUploadFieldsSchema, type PhotoDto } from '../../shared/schemas/photos';
import { hives, inspections, photos, users } from '../../db/schema';
import type { Ctx, SessionUser } from '../context';
import { AppError, forbidden, fromZod, notFound } from '../errors';
import { inspectUpload, refusalMessage } from '../images/inspect';
import type { IncomingObject } from '../middleware/upload';
import { ObjectNotFoundError } from '../storage';
import { requireHive } from './access';
import { recordAudit } from './audit';
import { enqueuePhotos } from './photo-processing';

type PhotoRow = typeof photos.$inferSelect;

const toDto = (p: PhotoRow, uploaderName: string): PhotoDto => ({
  id: p.id,
  hiveId: p.hiveId,
  inspectionId: p.inspectionId,
  box: p.box,
  frame: p.frame,
  label: frameLabel(p, p.inspectionId != null),
  status: p.status,
  failureReason: p.status === 'failed' ? p.failureReason : null,
  width: p.width,
  height: p.height,
  bytes: p.bytes,
  uploadedBy: { id: p.uploadedBy, name: uploaderName },
  createdAt: p.createdAt.toISOString(),
  urls: {
    thumb: `/api/photos/${p.id}?size=thumb`,
    display: `/api/photos/${p.id}?size=display`,
    original: `/api/photos/${p.id}?size=original`,
  },
});

/** What the audit trail keeps of a photo: where it belongs, not where its bytes live. */
const auditView = (p: PhotoRow) => ({
  id: p.id,
  hiveId: p.hiveId,
  inspectionId: p.inspectionId,
  box: p.box,
  frame: p.frame,
  uploadBytes: p.uploadBytes,
  uploadedBy: p.uploadedBy,
});

/** The gate before the upload body is read: a stranger or a viewer is turned away before any byte is stored. */
export async function assertMayAddPhotos(ctx: Ctx, user: SessionUser, hiveId: string): Promise<void> {
  await requireHive(ctx, user, hiveId, 'record:create:photo');
}

const discard = (ctx: Ctx, incoming: IncomingObject[]) =>
  Promise.all(incoming.map((f) => ctx.storage.delete(f.key).catch((err) => ctx.logger.warn({ err, key: f.key }, 'could not discard upload'))));

/**
 * Adds uploaded photos to a hive (and optionally to one of its Quick checks, at a box and frame).
 * Each file must look like a whole JPEG or PNG within the pixel cap; any refusal refuses the
 * lot and discards every stored upload. The rows start 'processing'; the image worker takes it from there.
 */
export async function addPhotos(
  ctx: Ctx,
  user: SessionUser,
  hiveId: string,
  rawFields: unknown,
  incoming: IncomingObject[],
): Promise<PhotoDto[]> {
  let created: PhotoRow[];
  try {
    const m = await requireHive(ctx, user, hiveId, 'record:create:photo');
    const parsed = photoUploadFieldsSchema.safeParse(rawFields ?? {});
    if (!parsed.success) throw fromZod(parsed.error);
    const input = parsed.data;
    if (incoming.length === 0) throw new AppError('no_photo', 'Choose at least one photo to add.', 400);
    incoming.forEach((f, i) => {
      const r = inspectUpload(f.scan);
      if (r.ok === false) {
        const code = r.reason === 'too_many_pixels' ? 'photo_too_many_pixels' : r.reason === 'truncated' ? 'photo_cut_off' : 'not_a_photo';
        throw new AppError(code, refusalMessage(r, i + 1, incoming.length), 400);
      }
    });

    const [hive] = await ctx.db.select({ boxes: hives.boxes }).from(hives).where(eq(hives.id, hiveId)).limit(1);
    if (!hive) throw notFound('That hive');
    if (input.box !== undefined && input.box > hive.boxes.length) {
      const n = hive.boxes.length;
      throw new AppError('invalid', `This hive has ${n} box${n === 1 ? '' : 'es'}.`, 400, { fields: { box: `Choose a box from 1 to ${n}.` } });
    }
    if (input.box !== undefined && input.frame !== undefined) {
      const frames = hive.boxes[input.box - 1]!.frames;
      if (input.frame > frames) {
        throw new AppError('invalid', `Box ${input.box} holds ${frames} frames.`, 400, { fields: { frame: `Choose a frame from 1 to ${frames}.` } });
      }
    }
    if (input.inspectionId) {
      const [insp] = await ctx.db
        .select({ id: inspections.id })
        .from(inspections)
        .where(and(eq(inspections.id, input.inspectionId), eq(inspections.hiveId, hiveId)))
        .limit(1);
      if (!insp) {
        throw new AppError('invalid', 'That Quick check is not one of this hive’s.', 400, {
          fields: { inspectionId: 'That Quick check was not found for this hive.' },
        });
      }
    }

    created = await ctx.db.transaction(async (tx) => {
      const rows = await tx
        .insert(photos)
        .values(
          incoming.map((f) => ({
            hiveId,
            inspectionId: input.inspectionId ?? null,
            box: input.box ?? null,
            frame: input.frame ?? null,
            status: 'processing' as const,
            uploadKey: f.key,
            uploadBytes: f.bytes,
            uploadedBy: user.id,
            createdAt: ctx.now(),
            updatedAt: ctx.now(),
          })),
        )
        .returning();
      for (const p of rows) {
        await recordAudit(tx, ctx, { apiaryId: m.apiaryId, userId: user.id, entity: 'photo', entityId: p.id, action: 'create', after: auditView(p) });
      }
      return rows;
    });
  } catch (err) {
    await discard(ctx, incoming);
    throw err;
  }
  void enqueuePhotos(ctx, created.map((p) => p.id));
  return created.map((p) => toDto(p, user.name));
}

export async function listPhotos(ctx: Ctx, user: SessionUser, hiveId: string, filter: { inspectionId?: string }): Promise<PhotoDto[]> {
  await requireHive(ctx, user, hiveId, 'hive:read');
  const where = filter.inspectionId
    ? and(eq(photos.hiveId, hiveId), eq(photos.inspectionId, filter.inspectionId))
    : eq(photos.hiveId, hiveId);
  const rows = await ctx.db
    .select({ p: photos, name: users.name })
    .from(photos)
    .innerJoin(users, eq(users.id, photos.uploadedBy))
    .where(where)
    .orderBy(asc(photos.createdAt), asc(photos.seq));
  return rows.map((r) => toDto(r.p, r.name));
}

/** Loads a photo and checks the viewer's access to its hive: unknown photos and strangers both get 404. */
async function loadPhoto(ctx: Ctx, user: SessionUser, photoId: string) {
  const [p] = await ctx.db.select().from(photos).where(eq(photos.id, photoId)).limit(1);
  if (!p) throw notFound('That photo');
  try {
    const m = await requireHive(ctx, user, p.hiveId, 'hive:read');
    return { p, m };
  } catch (err) {
    if (err instanceof AppError && err.status === 404) throw notFound('That photo');
    throw err;
  }
}

export interface PhotoStream {
  stream: Readable;
  contentType: 'image/jpeg';
}

/** The bytes of one stored size, for a viewer with access to the hive. */
export async function openPhoto(ctx: Ctx, user: SessionUser, photoId: string, size: PhotoSize): Promise<PhotoStream> {
  const { p } = await loadPhoto(ctx, user, photoId);
  if (p.status === 'processing') throw new AppError('photo_processing', 'This photo is still being processed. Try again in a moment.', 409);
  if (p.status === 'failed') throw new AppError('photo_failed', p.failureReason ?? 'This photo could not be processed.', 409);
  const key = size === 'thumb' ? p.thumbKey : size === 'display' ? p.displayKey : p.originalKey;
  if (!key) throw notFound('That photo');
  try {
    return { stream: await ctx.storage.get(key), contentType: 'image/jpeg' };
  } catch (err) {
    if (err instanceof ObjectNotFoundError) {
      ctx.logger.error({ photoId, size }, 'stored photo object is missing');
      throw notFound('That photo');
    }
    throw err;
  }
}

/**
 * Deletes a photo and its stored objects. The person who added it may, and so may anyone whose
 * role deletes others' records (owner, keeper).
 */
export async function deletePhoto(ctx: Ctx, user: SessionUser, photoId: string): Promise<void> {
  const { p, m } = await loadPhoto(ctx, user, photoId);
  if (p.uploadedBy !== user.id && !can(m, 'record:delete-others', ctx.now())) {
    throw forbidden('Only the person who added this photo, or an owner or keeper of the apiary, can delete it.');
  }
  await ctx.db.transaction(async (tx) => {
    await tx.delete(photos).where(eq(photos.id, photoId));
    await recordAudit(tx, ctx, { apiaryId: m.apiaryId, userId: user.id, entity: 'photo', entityId: p.id, action: 'delete', before: auditView(p) });
  });
  const keys = [p.uploadKey, p.originalKey, p.displayKey, p.thumbKey].filter((k): k is string => !!k);
  await Promise.all(keys.map((k) => ctx.storage.delete(k).catch((err) => ctx.logger.error({ err, key: k }, 'could not delete stored photo'))));
}
