import { index, integer, jsonb, pgTable, text, timestamp, unique, uuid } from 'drizzle-orm/pg-core';
import { id } from './columns';
import { users } from './users';

/**
 * One row per `Idempotency-Key` a person sent with a write (IETF httpapi draft
 * "The Idempotency-Key HTTP Header Field"). The row is inserted before the write runs, so the
 * unique (user_id, key) pair is what makes two racing copies of a request store one record.
 * `status` is null while the first request is still being processed. Rows older than 24 h may
 * be purged (server/middleware/idempotency.ts does so as it goes).
 */
export const idempotencyKeys = pgTable(
  'idempotency_keys',
  {
    id: id(),
    userId: uuid('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    key: text('key').notNull(),
    method: text('method').notNull(),
    path: text('path').notNull(),
    /** SHA-256 of the method, path and canonical JSON body: the same key with another payload answers 422. */
    fingerprint: text('fingerprint').notNull(),
    /** The stored answer; null while in flight. */
    status: integer('status'),
    responseBody: jsonb('response_body'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    completedAt: timestamp('completed_at', { withTimezone: true }),
  },
  (t) => [unique('idempotency_keys_user_key_uq').on(t.userId, t.key), index('idempotency_keys_created_idx').on(t.createdAt)],
);
