import { boolean, index, integer, jsonb, pgEnum, pgTable, text, uuid } from 'drizzle-orm/pg-core';
import { FRAME_SIZES, HIVE_STATUSES, MARK_COLOURS, QUEEN_LIFE_STATUSES, QUEEN_ORIGINS, type Box } from '../../shared/domain/hives';
import { apiaries } from './apiaries';
import { id, timestamps } from './columns';

export const frameSizeEnum = pgEnum('frame_size', FRAME_SIZES);
export const hiveStatusEnum = pgEnum('hive_status', HIVE_STATUSES);
export const queenOriginEnum = pgEnum('queen_origin', QUEEN_ORIGINS);
export const queenLifeStatusEnum = pgEnum('queen_life_status', QUEEN_LIFE_STATUSES);
export const markColourEnum = pgEnum('mark_colour', MARK_COLOURS);

export const hives = pgTable(
  'hives',
  {
    id: id(),
    apiaryId: uuid('apiary_id')
      .notNull()
      .references(() => apiaries.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    /** Boxes from the bottom up; validated by shared/schemas before it is stored. */
    boxes: jsonb('boxes').$type<Box[]>().notNull(),
    status: hiveStatusEnum('status').notNull().default('active'),
    note: text('note').notNull().default(''),
    version: integer('version').notNull().default(1),
    ...timestamps,
  },
  (t) => [index('hives_apiary_idx').on(t.apiaryId)],
);

export const queens = pgTable(
  'queens',
  {
    id: id(),
    hiveId: uuid('hive_id')
      .notNull()
      .references(() => hives.id, { onDelete: 'cascade' }),
    origin: queenOriginEnum('origin').notNull().default('unknown'),
    year: integer('year'),
    markColour: markColourEnum('mark_colour').notNull().default('unmarked'),
    clipped: boolean('clipped').notNull().default(false),
    status: queenLifeStatusEnum('status').notNull().default('present'),
    ...timestamps,
  },
  (t) => [index('queens_hive_idx').on(t.hiveId)],
);
