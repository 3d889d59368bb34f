import { integer, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { id, timestamps } from './columns';
import { users } from './users';

/**
 * Columns every hive or apiary record carries: when it happened, who wrote it, and a version
 * that a stale edit must match (409 otherwise).
 */
export const recordColumns = () => ({
  id: id(),
  occurredAt: timestamp('occurred_at', { withTimezone: true }).notNull(),
  note: text('note').notNull().default(''),
  createdBy: uuid('created_by')
    .notNull()
    .references(() => users.id),
  updatedBy: uuid('updated_by').references(() => users.id),
  version: integer('version').notNull().default(1),
  ...timestamps,
});
