import { index, integer, pgTable, primaryKey, real, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { hives } from './hives';
import { id } from './columns';
import { users } from './users';

/** One CSV file from a hive logger, as it was imported: who, when, and what came of its rows. */
export const sensorImports = pgTable(
  'sensor_imports',
  {
    id: id(),
    hiveId: uuid('hive_id')
      .notNull()
      .references(() => hives.id, { onDelete: 'cascade' }),
    fileName: text('file_name').notNull(),
    /** SHA-256 of the raw file, hex: tells the keeper when the same file comes again. */
    sha256: text('sha256').notNull(),
    /** Data rows in the file (the header not counted). */
    rows: integer('rows').notNull(),
    newRows: integer('new_rows').notNull(),
    existingRows: integer('existing_rows').notNull(),
    badRows: integer('bad_rows').notNull(),
    importedBy: uuid('imported_by')
      .notNull()
      .references(() => users.id),
    importedAt: timestamp('imported_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('sensor_imports_hive_idx').on(t.hiveId, t.importedAt)],
);

/**
 * Hive-logger readings, at most one per hive and instant: the primary key (hive_id, at) is what
 * makes a second import of the same file add nothing (INSERT … ON CONFLICT DO NOTHING).
 */
export const sensorReadings = pgTable(
  'sensor_readings',
  {
    hiveId: uuid('hive_id')
      .notNull()
      .references(() => hives.id, { onDelete: 'cascade' }),
    at: timestamp('at', { withTimezone: true }).notNull(),
    /** Brood-nest (or in-hive) temperature, °C. */
    temperatureC: real('temperature_c'),
    /** Whole-hive weight from a hive scale, kg. */
    weightKg: real('weight_kg'),
    /** The import that first brought this reading; null for readings from the demo seed. */
    importId: uuid('import_id').references(() => sensorImports.id, { onDelete: 'set null' }),
  },
  (t) => [primaryKey({ name: 'sensor_readings_hive_at_pk', columns: [t.hiveId, t.at] })],
);
