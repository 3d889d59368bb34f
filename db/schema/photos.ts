import { index, integer, pgEnum, pgTable, text, uuid } from 'drizzle-orm/pg-core';
import { PHOTO_STATUSES } from '../../shared/domain/photos';
import { id, timestamps } from './columns';
import { hives } from './hives';
import { inspections } from './records';
import { users } from './users';

export const photoStatusEnum = pgEnum('photo_status', PHOTO_STATUSES);

/**
 * A frame photo. The upload waits in object storage under `uploadKey` until the image worker
 * has re-encoded it (all metadata dropped) into the three stored sizes; then `uploadKey` is
 * cleared. Object keys are random, never the client's file name.
 */
export const photos = pgTable(
  'photos',
  {
    id: id(),
    hiveId: uuid('hive_id')
      .notNull()
      .references(() => hives.id, { onDelete: 'cascade' }),
    /** The Quick check it belongs to, or null for a photo of the hive on its own. */
    inspectionId: uuid('inspection_id').references(() => inspections.id, { onDelete: 'set null' }),
    /** Box number from the bottom and frame number; both null = the whole check. */
    box: integer('box'),
    frame: integer('frame'),
    status: photoStatusEnum('status').notNull().default('processing'),
    failureReason: text('failure_reason'),
    uploadKey: text('upload_key'),
    originalKey: text('original_key'),
    displayKey: text('display_key'),
    thumbKey: text('thumb_key'),
    width: integer('width'),
    height: integer('height'),
    /** Bytes of the stored (re-encoded) original. */
    bytes: integer('bytes'),
    /** Bytes the client sent. */
    uploadBytes: integer('upload_bytes').notNull(),
    /** Arrival order: photos added in the same instant (one upload, or a test's frozen clock) keep the order they were sent in. */
    seq: integer('seq').generatedAlwaysAsIdentity(),
    uploadedBy: uuid('uploaded_by')
      .notNull()
      .references(() => users.id),
    ...timestamps,
  },
  (t) => [
    index('photos_hive_idx').on(t.hiveId, t.createdAt),
    index('photos_inspection_idx').on(t.inspectionId),
    index('photos_status_idx').on(t.status),
  ],
);
