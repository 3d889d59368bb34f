import { index, jsonb, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { apiaries } from './apiaries';
import { id } from './columns';
import { users } from './users';

/** Who created, changed or deleted what, and when; the owner reads an apiary's recent activity here. */
export const auditLog = pgTable(
  'audit_log',
  {
    id: id(),
    apiaryId: uuid('apiary_id').references(() => apiaries.id, { onDelete: 'cascade' }),
    userId: uuid('user_id').references(() => users.id, { onDelete: 'set null' }),
    action: text('action').$type<'create' | 'update' | 'delete'>().notNull(),
    entity: text('entity').notNull(),
    entityId: uuid('entity_id').notNull(),
    /** For an edit, { field: [before, after] }; for a create or delete, the whole record. */
    changes: jsonb('changes').$type<Record<string, unknown>>().notNull().default({}),
    at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('audit_apiary_time_idx').on(t.apiaryId, t.at), index('audit_entity_idx').on(t.entity, t.entityId)],
);
