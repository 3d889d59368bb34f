import { z } from 'zod';
import { CSV_DELIMITERS, TEMPERATURE_UNITS, TIME_FORMATS, WEIGHT_UNITS, type BadRow } from '../domain/sensor-csv';

/** Largest sensor CSV the server takes: 20 MB, about 400,000 rows of a typical logger file. */
export const SENSOR_CSV_MAX_BYTES = 20 * 1024 * 1024;

const column = z.string().trim().min(1).max(200);
const optionalColumn = z
  .string()
  .max(200)
  .optional()
  .transform((v) => (v === undefined || v.trim() === '' ? null : v.trim()));

/**
 * The mapping chosen on the import screen, sent as query parameters beside the raw file
 * (the body is the file itself, Content-Type text/csv).
 */
export const sensorImportQuerySchema = z
  .object({
    fileName: z.string().trim().min(1, { message: 'The file name is missing.' }).max(200),
    timeColumn: column,
    temperatureColumn: optionalColumn,
    weightColumn: optionalColumn,
    timeFormat: z.enum(TIME_FORMATS, { message: 'Choose how the times are written.' }),
    temperatureUnit: z.enum(TEMPERATURE_UNITS, { message: 'The temperature unit is °C or °F.' }).default('C'),
    weightUnit: z.enum(WEIGHT_UNITS, { message: 'The weight unit is kg or lb.' }).default('kg'),
    timeZone: z.string().trim().min(1).max(64).default('UTC'),
    delimiter: z.enum(['comma', 'semicolon', 'tab']).optional(),
  })
  .strict();
export type SensorImportQuery = z.infer<typeof sensorImportQuerySchema>;

export const DELIMITER_NAMES: Record<'comma' | 'semicolon' | 'tab', (typeof CSV_DELIMITERS)[number]> = {
  comma: ',',
  semicolon: ';',
  tab: '\t',
};

export interface SensorImportResult {
  importId: string;
  fileName: string;
  /** Data rows in the file. */
  rows: number;
  /** Readings stored now. */
  newReadings: number;
  /** Readings the hive already had (an earlier import of the same or an overlapping file). */
  alreadyThere: number;
  /** Rows whose time an earlier row of the same file already had. */
  repeatedInFile: number;
  /** Rows skipped, each with its line and reason (the first 200; badCount has them all). */
  bad: BadRow[];
  badCount: number;
  /** True when a file with the same content was imported into this hive before. */
  sameFileBefore: boolean;
  /** "N new, M already there" and the rest, for the screen. */
  summary: string;
}

export const sensorReadingsQuerySchema = z
  .object({
    from: z.iso.datetime({ offset: true, message: 'from is a date-time like 2026-05-01T00:00:00Z.' }).optional(),
    to: z.iso.datetime({ offset: true, message: 'to is a date-time like 2026-09-30T00:00:00Z.' }).optional(),
    /** Most points to return; readings are averaged into equal time buckets to fit. */
    points: z.coerce.number().int().min(10).max(5000).default(1000),
  })
  .strict();

export interface SensorPoint {
  /** Start of the bucket, ISO UTC. */
  t: string;
  temperatureC: number | null;
  weightKg: number | null;
  /** Readings averaged into this point. */
  n: number;
}

export interface SensorSeries {
  from: string;
  to: string;
  /** Bucket length in minutes. */
  bucketMinutes: number;
  points: SensorPoint[];
  /** Readings in the range before downsampling. */
  readings: number;
}
