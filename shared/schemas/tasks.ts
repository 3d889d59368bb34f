import { z } from 'zod';
import { isIsoDate } from '../domain/dates';
import type { DueRule } from '../domain/due';
import { idSchema, optionalNote, shortText } from './common';

/** A calendar day as YYYY-MM-DD (a real day: 2026-02-30 is refused). */
export const isoDateSchema = z
  .string({ message: 'The date must be written YYYY-MM-DD.' })
  .refine((v) => isIsoDate(v), { message: 'The date must be a real day, written YYYY-MM-DD.' });

/** POST /api/tasks: a task a person adds. `hiveId` ties it to one hive; without it the task is for the apiary. */
export const taskCreateSchema = z
  .object({
    apiaryId: idSchema,
    hiveId: idSchema.nullable().optional(),
    title: shortText('The task', 120),
    dueDate: isoDateSchema,
    note: optionalNote(500).default(''),
  })
  .strict();
export type TaskCreateInput = z.input<typeof taskCreateSchema>;

/** POST /api/tasks/:taskId/snooze. */
export const taskSnoozeSchema = z.object({ until: isoDateSchema }).strict();
export type TaskSnoozeInput = z.infer<typeof taskSnoozeSchema>;

/** GET /api/due filters. */
export const dueQuerySchema = z
  .object({
    apiaryId: idSchema.optional(),
    hiveId: idSchema.optional(),
    /** Days ahead to include (default 14); overdue tasks always come. */
    days: z.coerce
      .number({ message: 'Days ahead must be a number.' })
      .int({ message: 'Days ahead must be a whole number.' })
      .min(1, { message: 'Look at least 1 day ahead.' })
      .max(366, { message: 'Look at most 366 days ahead.' })
      .optional(),
  })
  .strict();

export type DueStatus = 'open' | 'snoozed';

/** One line of the Due list. `key` names the task in /api/tasks/:taskId/… (URL-encode it). */
export interface DueTaskDto {
  key: string;
  /** The rule that derived it, or 'added' for a task a person wrote. */
  rule: DueRule | 'added';
  title: string;
  /** Why it is due, in plain words. */
  reason: string;
  /** YYYY-MM-DD; for a snoozed task the day it was snoozed to. */
  dueDate: string;
  /** The source or practice the rule rests on ('Added by …' for a person's task). */
  source: string;
  hiveId: string | null;
  hiveName: string | null;
  apiaryId: string;
  apiaryName: string;
  status: DueStatus;
  overdue: boolean;
  snoozedUntil: string | null;
  /** Who snoozed it, or who added a person's task. */
  by: { id: string; name: string } | null;
  at: string | null;
  note: string;
}

/** What resolving a task answers with: the stored resolution. */
export interface TaskResolutionDto {
  id: string;
  key: string;
  kind: 'added' | 'derived';
  status: 'open' | 'done' | 'snoozed' | 'dismissed';
  snoozedUntil: string | null;
  resolvedBy: { id: string; name: string } | null;
  resolvedAt: string | null;
  title: string;
  dueDate: string;
  hiveId: string | null;
  apiaryId: string;
}
