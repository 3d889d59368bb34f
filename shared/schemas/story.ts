import { z } from 'zod';

/** GET /api/hives/:hiveId/story?season=YYYY */
export const storyQuerySchema = z
  .object({
    season: z
      .string({ message: 'The season is a year, e.g. 2026.' })
      .regex(/^\d{4}$/, { message: 'The season is a year, e.g. 2026.' })
      .transform(Number)
      .refine((y) => y >= 1990 && y <= 2200, { message: 'That season is out of range.' })
      .optional(),
  })
  .strict();

export const STORY_KINDS = [
  'inspection',
  'feeding',
  'treatment',
  'mite-count',
  'harvest',
  'queen-event',
  'colony-event',
  'forage-check',
] as const;
export type StoryKind = (typeof STORY_KINDS)[number];

/** A change since the previous record of the same kind: "Brood frames +2", "Mites per 100 bees 4.1 → 1.2". */
export interface StoryChange {
  field: string;
  label: string;
  from: number | string | null;
  to: number | string | null;
  /** The words to show. */
  text: string;
}

/** A date that follows from the record: a queen's emergence, a release check, a mite recount. */
export interface StoryDerivedDate {
  label: string;
  date: string;
  source: string;
}

export interface StoryPhoto {
  id: string;
  url: string;
  caption?: string;
}

export interface StoryItemDto {
  id: string;
  kind: StoryKind;
  /** ISO instant it happened. */
  occurredAt: string;
  /** YYYY-MM-DD of occurredAt (UTC). */
  date: string;
  title: string;
  /** Short facts in plain words ("8 frames of brood", "2:1 syrup, 4 L"). */
  facts: string[];
  changes: StoryChange[];
  derivedDates: StoryDerivedDate[];
  /** Cautions to show beside it (medicines, notifiable disease). */
  cautions: string[];
  note: string;
  recordedBy: { id: string; name: string };
  /** 'apiary' for forage checks, which belong to the whole site. */
  scope: 'hive' | 'apiary';
  photos: StoryPhoto[];
}

export interface StoryDto {
  hiveId: string;
  hiveName: string;
  apiaryId: string;
  apiaryName: string;
  season: number;
  /** YYYY-MM-DD, inclusive; YYYY-MM-DD exclusive. */
  from: string;
  to: string;
  /** Seasons with at least one record, newest first (for a season picker). */
  seasons: number[];
  items: StoryItemDto[];
}
