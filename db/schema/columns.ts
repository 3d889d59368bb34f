import { timestamp, uuid } from 'drizzle-orm/pg-core';

/** Primary key: a random UUID, so a client can name a record before the server sees it. */
export const id = () => uuid('id').primaryKey().defaultRandom();

export const timestamps = {
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
};

