import { index, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { apiaries, roleEnum } from './apiaries';
import { id } from './columns';
import { users } from './users';

/**
 * An e-mailed invitation to an apiary. Only the SHA-256 of the link's random token is kept, so
 * a copy of the database cannot be used to accept someone else's invitation.
 */
export const invitations = pgTable(
  'invitations',
  {
    id: id(),
    apiaryId: uuid('apiary_id')
      .notNull()
      .references(() => apiaries.id, { onDelete: 'cascade' }),
    email: text('email').notNull(),
    role: roleEnum('role').notNull(),
    /** A sitter's access window; null for the other roles. */
    startsAt: timestamp('starts_at', { withTimezone: true }),
    endsAt: timestamp('ends_at', { withTimezone: true }),
    tokenHash: text('token_hash').notNull().unique(),
    expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
    acceptedAt: timestamp('accepted_at', { withTimezone: true }),
    acceptedBy: uuid('accepted_by').references(() => users.id, { onDelete: 'set null' }),
    invitedBy: uuid('invited_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('invitations_apiary_idx').on(t.apiaryId)],
);

/** A password-reset link: hash only, single use, short expiry. */
export const passwordResets = pgTable(
  'password_resets',
  {
    id: id(),
    userId: uuid('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    tokenHash: text('token_hash').notNull().unique(),
    expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
    usedAt: timestamp('used_at', { withTimezone: true }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('password_resets_user_idx').on(t.userId)],
);
