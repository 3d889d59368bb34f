import { index, pgEnum, pgTable, real, text, timestamp, unique, uuid } from 'drizzle-orm/pg-core';
import { ROLES } from '../../shared/domain/access';
import { HEMISPHERES } from '../../shared/domain/hives';
import { id, timestamps } from './columns';
import { users } from './users';

export const hemisphereEnum = pgEnum('hemisphere', HEMISPHERES);
export const roleEnum = pgEnum('role', ROLES);

export const apiaries = pgTable('apiaries', {
  id: id(),
  name: text('name').notNull(),
  hemisphere: hemisphereEnum('hemisphere').notNull().default('north'),
  climateNote: text('climate_note').notNull().default(''),
  winterStoresTargetKg: real('winter_stores_target_kg').notNull().default(20),
  ...timestamps,
});

export const memberships = pgTable(
  'memberships',
  {
    id: id(),
    apiaryId: uuid('apiary_id')
      .notNull()
      .references(() => apiaries.id, { onDelete: 'cascade' }),
    userId: uuid('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    role: roleEnum('role').notNull(),
    startsAt: timestamp('starts_at', { withTimezone: true }),
    endsAt: timestamp('ends_at', { withTimezone: true }),
    ...timestamps,
  },
  (t) => [unique('memberships_apiary_user_uq').on(t.apiaryId, t.userId), index('memberships_user_idx').on(t.userId)],
);
