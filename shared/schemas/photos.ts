import { z } from 'zod';
import { MAX_BOX, MAX_FRAME, PHOTO_SIZES, type PhotoSize, type PhotoStatus } from '../domain/photos';
import { idSchema } from './common';

/** A form field may arrive as text ("2") from a multipart body or as a number from a test; '' means "not given". */
const blankToUndefined = (v: unknown) => (v === '' || v === null ? undefined : v);

const wholeNumber = (label: string, max: number) =>
  z.preprocess(
    (v) => {
      const b = blankToUndefined(v);
      return typeof b === 'string' && /^\d{1,3}$/.test(b.trim()) ? Number(b.trim()) : b;
    },
    z
      .number({ message: `${label} must be a whole number.` })
      .int({ message: `${label} must be a whole number.` })
      .min(1, { message: `${label} starts at 1.` })
      .max(max, { message: `${label} is at most ${max}.` })
      .optional(),
  );

/** The text fields beside the files in POST /api/hives/:hiveId/photos. */
export const photoUploadFieldsSchema = z
  .strictObject(
    {
      inspectionId: z.preprocess(blankToUndefined, idSchema.optional()),
      /** Box number from the bottom (1 = lowest box). */
      box: wholeNumber('The box number', MAX_BOX),
      /** Frame number within the box, counted from one side. */
      frame: wholeNumber('The frame number', MAX_FRAME),
    },
    { message: 'These upload details are not expected here.' },
  )
  .refine((v) => v.frame === undefined || v.box !== undefined, {
    message: 'Choose the box as well as the frame.',
    path: ['box'],
  });
export type PhotoUploadFields = z.infer<typeof photoUploadFieldsSchema>;

/** GET /api/hives/:hiveId/photos?inspectionId=… */
export const photoListQuerySchema = z.strictObject({
  inspectionId: idSchema.optional(),
});

/** GET /api/photos/:photoId?size=… */
export const photoGetQuerySchema = z.strictObject({
  size: z.enum(PHOTO_SIZES, { message: 'The size is thumb, display or original.' }).default('display'),
});

export interface PhotoDto {
  id: string;
  hiveId: string;
  inspectionId: string | null;
  box: number | null;
  frame: number | null;
  /** "Box 2, frame 5" or "Whole check": the caption and the alt text. */
  label: string;
  status: PhotoStatus;
  /** Why processing failed, in a keeper's words; null unless status is 'failed'. */
  failureReason: string | null;
  /** Of the stored original, upright; null until ready. */
  width: number | null;
  height: number | null;
  /** Bytes of the stored original; null until ready. */
  bytes: number | null;
  uploadedBy: { id: string; name: string };
  createdAt: string;
  /** Where each size is served (through the access-checked route); meaningful once ready. */
  urls: Record<PhotoSize, string>;
}
