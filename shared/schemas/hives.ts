import { z } from 'zod';
import { FRAME_SIZES, HIVE_STATUSES, MARK_COLOURS, QUEEN_LIFE_STATUSES, QUEEN_ORIGINS, type Box } from '../domain/hives';
import { optionalNote, shortText } from './common';

export const boxSchema = z.object({
  size: z.enum(FRAME_SIZES, { message: 'A box is deep, medium or shallow.' }),
  frames: z
    .number({ message: 'Frames per box must be a number.' })
    .int({ message: 'Frames per box must be a whole number.' })
    .min(1, { message: 'A box holds at least 1 frame.' })
    .max(12, { message: 'A box holds at most 12 frames.' }),
});

export const boxesSchema = z
  .array(boxSchema, { message: 'List the hive’s boxes.' })
  .min(1, { message: 'A hive has at least one box.' })
  .max(8, { message: 'A hive has at most 8 boxes.' });

const currentYear = () => new Date().getUTCFullYear();

export const queenSchema = z.object({
  origin: z.enum(QUEEN_ORIGINS, { message: 'Choose where the queen came from.' }).default('unknown'),
  year: z
    .number({ message: 'The queen’s year must be a number.' })
    .int()
    .min(1990, { message: 'The queen’s year looks too early.' })
    .refine((y) => y <= currentYear() + 1, { message: 'The queen’s year cannot be in the future.' })
    .nullable()
    .default(null),
  markColour: z.enum(MARK_COLOURS, { message: 'Choose a marking colour or unmarked.' }).default('unmarked'),
  clipped: z.boolean({ message: 'Clipped is yes or no.' }).default(false),
  status: z.enum(QUEEN_LIFE_STATUSES, { message: 'Choose the queen’s status.' }).default('present'),
});
export type QueenInput = z.input<typeof queenSchema>;

export const hiveCreateSchema = z
  .object({
    name: shortText('The hive name', 60),
    boxes: boxesSchema,
    status: z.enum(HIVE_STATUSES, { message: 'Choose active, dead-out, combined or sold.' }).default('active'),
    note: optionalNote(500).default(''),
    queen: queenSchema.nullable().optional(),
  })
  .strict();
export type HiveCreateInput = z.input<typeof hiveCreateSchema>;

export const hiveUpdateSchema = z
  .object({
    name: shortText('The hive name', 60),
    boxes: boxesSchema,
    status: z.enum(HIVE_STATUSES, { message: 'Choose active, dead-out, combined or sold.' }),
    note: optionalNote(500),
    queen: queenSchema.nullable(),
    /** The version the edit was based on; a stale one answers 409. */
    version: z.number().int().min(1).optional(),
  })
  .partial()
  .strict();
export type HiveUpdateInput = z.infer<typeof hiveUpdateSchema>;

export interface QueenDto {
  id: string;
  origin: (typeof QUEEN_ORIGINS)[number];
  year: number | null;
  markColour: (typeof MARK_COLOURS)[number];
  clipped: boolean;
  status: (typeof QUEEN_LIFE_STATUSES)[number];
}

export interface HiveDto {
  id: string;
  apiaryId: string;
  apiaryName: string;
  name: string;
  boxes: Box[];
  status: (typeof HIVE_STATUSES)[number];
  note: string;
  queen: QueenDto | null;
  version: number;
  createdAt: string;
  updatedAt: string;
}
