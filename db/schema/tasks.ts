import { sql } from 'drizzle-orm';
import { bigint, date, index, integer, pgEnum, pgTable, text, timestamp, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import { TASK_RESOLUTIONS } from '../../shared/domain/records';
import { apiaries } from './apiaries';
import { id, timestamps } from './columns';
import { hives } from './hives';
import { users } from './users';

export const taskKindEnum = pgEnum('task_kind', ['added', 'derived']);
export const taskStatusEnum = pgEnum('task_status', ['open', ...TASK_RESOLUTIONS]);

/**
 * The Due list's stored part. Two kinds of row:
 * - 'added': a task a person wrote (title, due date, note); open until resolved.
 * - 'derived': only the resolution of a task the rules in shared/domain/due.ts derive, matched
 *   by the derived task's stable `derivedKey`. The rules keep deriving it; this row says it is
 *   done, snoozed until a date, or dismissed. Title, rule and due date are a copy taken when it
 *   was resolved, for the record.
 */
export const tasks = pgTable(
  'tasks',
  {
    id: id(),
    kind: taskKindEnum('kind').notNull(),
    apiaryId: uuid('apiary_id')
      .notNull()
      .references(() => apiaries.id, { onDelete: 'cascade' }),
    hiveId: uuid('hive_id').references(() => hives.id, { onDelete: 'cascade' }),
    /** Derived tasks only: the key from deriveTasks (rule:hiveId:record-or-period). */
    derivedKey: text('derived_key'),
    /** Derived tasks only: the rule that made it. */
    rule: text('rule'),
    title: text('title').notNull(),
    dueDate: date('due_date').notNull(),
    note: text('note').notNull().default(''),
    status: taskStatusEnum('status').notNull().default('open'),
    snoozedUntil: date('snoozed_until'),
    resolvedBy: uuid('resolved_by').references(() => users.id),
    resolvedAt: timestamp('resolved_at', { withTimezone: true }),
    createdBy: uuid('created_by')
      .notNull()
      .references(() => users.id),
    version: integer('version').notNull().default(1),
    ...timestamps,
  },
  (t) => [
    uniqueIndex('tasks_derived_key_uq').on(t.derivedKey).where(sql`${t.derivedKey} is not null`),
    index('tasks_apiary_status_idx').on(t.apiaryId, t.status),
  ],
);

/**
 * A change counter per hive for the Due list's cache: database triggers on the record tables
 * the rules read (inspections, feedings, treatments, mite counts, queen and colony events) set
 * `stamp` from a sequence on every insert, edit or delete, whoever writes. The Due list reuses a
 * hive's derived tasks while its stamp, the day and the hive's own fields are unchanged.
 */
export const hiveRecordStamps = pgTable('hive_record_stamps', {
  hiveId: uuid('hive_id')
    .primaryKey()
    .references(() => hives.id, { onDelete: 'cascade' }),
  stamp: bigint('stamp', { mode: 'number' }).notNull(),
});
