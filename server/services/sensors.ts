/**
 * Hive-logger readings: import a CSV file into a hive (once per instant, however often the same
 * file comes), and read them back averaged into buckets for the charts.
 */
import { createHash } from 'node:crypto';
import { and, eq, sql } from 'drizzle-orm';
import { sensorImports } from '../../db/schema';
import {
  SensorMappingError,
  describeBadRows,
  mapReadings,
  readCsv,
  type SensorMapping,
} from '../../shared/domain/sensor-csv';
import { DELIMITER_NAMES, type SensorImportQuery, type SensorImportResult, type SensorPoint, type SensorSeries } from '../../shared/schemas/sensors';
import type { Ctx, SessionUser } from '../context';
import { AppError } from '../errors';
import { requireHive } from './access';
import { recordAudit } from './audit';

/** Bad rows listed in the answer; the count covers all of them. */
const BAD_ROWS_LISTED = 200;

/** Rows per INSERT: each is one statement of four array parameters, so the size is only about memory. */
const INSERT_CHUNK = 25_000;

const plural = (n: number, one: string, many = `${one}s`) => `${n.toLocaleString('en-GB')} ${n === 1 ? one : many}`;

/**
 * Imports a logger CSV into a hive. The file is read and mapped by shared/domain/sensor-csv (the
 * same code the preview ran); readings go in with ON CONFLICT DO NOTHING, so a second import of
 * the same file reports every reading as already there. One transaction: the import row, the
 * readings and the audit row stand or fall together.
 */
export async function importSensorCsv(
  ctx: Ctx,
  user: SessionUser,
  hiveId: string,
  q: SensorImportQuery,
  csvText: string,
): Promise<SensorImportResult> {
  const m = await requireHive(ctx, user, hiveId, 'record:create:sensor');
  if (csvText.trim() === '') throw new AppError('empty_file', 'The file is empty.', 400);

  const table = readCsv(csvText, { delimiter: q.delimiter ? DELIMITER_NAMES[q.delimiter] : undefined });
  if (table.headers.length < 2) {
    throw new AppError('no_columns', 'The file has fewer than two columns; a logger file needs a time and a temperature or weight.', 400);
  }
  const mapping: SensorMapping = {
    timeColumn: q.timeColumn,
    temperatureColumn: q.temperatureColumn,
    weightColumn: q.weightColumn,
    timeFormat: q.timeFormat,
    temperatureUnit: q.temperatureUnit,
    weightUnit: q.weightUnit,
    timeZone: q.timeZone,
  };
  let mapped;
  try {
    mapped = mapReadings(table, mapping);
  } catch (err) {
    if (err instanceof SensorMappingError) throw new AppError('bad_mapping', err.message, 400);
    throw err;
  }
  if (mapped.readings.length === 0) {
    const detail = mapped.bad.length ? ` Skipped: ${describeBadRows(mapped.bad)}.` : '';
    throw new AppError('no_readings', `No row of the file could be read as a reading.${detail}`, 400, {
      bad: mapped.bad.slice(0, BAD_ROWS_LISTED),
      badCount: mapped.bad.length,
    });
  }

  const sha256 = createHash('sha256').update(csvText).digest('hex');
  return ctx.db.transaction(async (tx) => {
    const [before] = await tx
      .select({ n: sql<number>`count(*)::int` })
      .from(sensorImports)
      .where(and(eq(sensorImports.hiveId, hiveId), eq(sensorImports.sha256, sha256)));
    const [imp] = await tx
      .insert(sensorImports)
      .values({
        hiveId,
        fileName: q.fileName,
        sha256,
        rows: mapped.rows,
        newRows: 0,
        existingRows: 0,
        badRows: mapped.bad.length,
        importedBy: user.id,
        importedAt: ctx.now(),
      })
      .returning();

    let inserted = 0;
    for (let i = 0; i < mapped.readings.length; i += INSERT_CHUNK) {
      const chunk = mapped.readings.slice(i, i + INSERT_CHUNK);
      const at = chunk.map((r) => new Date(r.atMs).toISOString());
      const temp = chunk.map((r) => r.temperatureC);
      const weight = chunk.map((r) => r.weightKg);
      // unnest() turns three arrays into rows: one round trip per 25,000 readings.
      const res = await tx.execute(sql`
        INSERT INTO sensor_readings (hive_id, at, temperature_c, weight_kg, import_id)
        SELECT ${hiveId}::uuid, u.at, u.t, u.w, ${imp!.id}::uuid
        FROM unnest(${sql.param(at)}::timestamptz[], ${sql.param(temp)}::real[], ${sql.param(weight)}::real[]) AS u(at, t, w)
        ON CONFLICT (hive_id, at) DO NOTHING`);
      inserted += res.rowCount ?? 0;
    }
    const existing = mapped.readings.length - inserted;
    const [done] = await tx
      .update(sensorImports)
      .set({ newRows: inserted, existingRows: existing })
      .where(eq(sensorImports.id, imp!.id))
      .returning();
    await recordAudit(tx, ctx, {
      apiaryId: m.apiaryId,
      userId: user.id,
      entity: 'sensor-import',
      entityId: imp!.id,
      action: 'create',
      after: { ...done!, hiveId },
    });

    const parts = [`${inserted.toLocaleString('en-GB')} new`, `${existing.toLocaleString('en-GB')} already there`];
    if (mapped.repeated.length) parts.push(`${plural(mapped.repeated.length, 'row')} repeating a time in the file`);
    if (mapped.bad.length) parts.push(`${plural(mapped.bad.length, 'bad row')} skipped (${describeBadRows(mapped.bad, 3)})`);
    return {
      importId: imp!.id,
      fileName: q.fileName,
      rows: mapped.rows,
      newReadings: inserted,
      alreadyThere: existing,
      repeatedInFile: mapped.repeated.length,
      bad: mapped.bad.slice(0, BAD_ROWS_LISTED),
      badCount: mapped.bad.length,
      sameFileBefore: (before?.n ?? 0) > 0,
      summary: `${parts.join(', ')}.`,
    };
  });
}

/** Bucket lengths the charts use, in minutes: the smallest that fits the points asked for is chosen. */
const BUCKETS_MIN = [1, 5, 10, 15, 30, 60, 120, 180, 360, 720, 1440, 2880, 10080];

export function bucketMinutesFor(spanMs: number, points: number): number {
  const needed = spanMs / points / 60_000;
  return BUCKETS_MIN.find((b) => b >= needed) ?? BUCKETS_MIN[BUCKETS_MIN.length - 1];
}

type Executor = Pick<Ctx['db'], 'execute'>;

/**
 * Readings of some hives in [from, to), averaged into buckets of `bucketMinutes` aligned on
 * `from` — one query for all the hives.
 */
export async function bucketedReadings(
  db: Executor,
  hiveIds: string[],
  from: Date,
  to: Date,
  bucketMinutes: number,
): Promise<Map<string, { points: SensorPoint[]; readings: number }>> {
  const out = new Map<string, { points: SensorPoint[]; readings: number }>();
  if (hiveIds.length === 0) return out;
  const res = await db.execute<{ hive_id: string; t: Date | string; temp: number | null; weight: number | null; n: number }>(sql`
    SELECT hive_id, date_bin(${`${bucketMinutes} minutes`}::interval, at, ${from.toISOString()}::timestamptz) AS t,
           avg(temperature_c)::float8 AS temp, avg(weight_kg)::float8 AS weight, count(*)::int AS n
    FROM sensor_readings
    WHERE hive_id = ANY(${sql.param(hiveIds)}::uuid[]) AND at >= ${from.toISOString()}::timestamptz AND at < ${to.toISOString()}::timestamptz
    GROUP BY 1, 2 ORDER BY 1, 2`);
  for (const r of res.rows) {
    let entry = out.get(r.hive_id);
    if (!entry) {
      entry = { points: [], readings: 0 };
      out.set(r.hive_id, entry);
    }
    entry.points.push({
      t: new Date(r.t).toISOString(),
      temperatureC: r.temp === null ? null : Math.round(r.temp * 100) / 100,
      weightKg: r.weight === null ? null : Math.round(r.weight * 1000) / 1000,
      n: r.n,
    });
    entry.readings += r.n;
  }
  return out;
}

/** A hive's readings between two instants (default: all of them), downsampled to at most `points` buckets. */
export async function listSensorReadings(
  ctx: Ctx,
  user: SessionUser,
  hiveId: string,
  q: { from?: string; to?: string; points: number },
): Promise<SensorSeries> {
  await requireHive(ctx, user, hiveId, 'hive:read');
  let from = q.from ? new Date(q.from) : null;
  let to = q.to ? new Date(q.to) : null;
  if (from && to && from >= to) throw new AppError('invalid', '"from" must be before "to".', 400, { fields: { from: '"from" must be before "to".' } });
  if (!from || !to) {
    const res = await ctx.db.execute<{ lo: Date | string | null; hi: Date | string | null }>(
      sql`SELECT min(at) AS lo, max(at) AS hi FROM sensor_readings WHERE hive_id = ${hiveId}::uuid`,
    );
    const row = res.rows[0];
    if (!row?.lo || !row.hi) {
      const now = ctx.now();
      return { from: (from ?? now).toISOString(), to: (to ?? now).toISOString(), bucketMinutes: 0, points: [], readings: 0 };
    }
    from ??= new Date(row.lo);
    to ??= new Date(new Date(row.hi).getTime() + 1);
  }
  const bucketMinutes = bucketMinutesFor(to.getTime() - from.getTime(), q.points);
  const got = (await bucketedReadings(ctx.db, [hiveId], from, to, bucketMinutes)).get(hiveId) ?? { points: [], readings: 0 };
  return { from: from.toISOString(), to: to.toISOString(), bucketMinutes, points: got.points, readings: got.readings };
}
