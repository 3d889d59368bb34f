/**
 * Exports a keeper can keep: the veterinary medicine record and a season's records as CSV, and
 * the whole account as versioned JSON that an import restores into an empty account.
 */
import { randomUUID } from 'node:crypto';
import Papa from 'papaparse';
import { and, asc, eq, gte, inArray, lt, sql } from 'drizzle-orm';
import { getTableColumns, type Column } from 'drizzle-orm';
import { getTableConfig, type PgTable } from 'drizzle-orm/pg-core';
import { z } from 'zod';
import * as schema from '../../db/schema';
import { apiaries, hives, memberships, treatments, users } from '../../db/schema';
import type { Hemisphere } from '../../shared/domain/hives';
import { SEASON_KIND_LABELS, seasonOf, seasonRange } from '../../shared/domain/season';
import { EXPORT_FORMAT, EXPORT_VERSION, exportEnvelopeSchema, type ImportResult } from '../../shared/schemas/exports';
import type { Ctx, SessionUser } from '../context';
import { AppError, conflict } from '../errors';
import { requireApiary } from './access';
import { recordAudit } from './audit';
import { apiarySeason } from './season';

// ---------------------------------------------------------------- CSV

export interface CsvFile {
  fileName: string;
  /** UTF-8 text with a byte-order mark, so spreadsheet programs read "°C" and "é" right. */
  body: string;
}

const slug = (s: string) =>
  s
    .normalize('NFKD')
    .replace(/[^\w\s-]/g, '')
    .trim()
    .replace(/\s+/g, '-')
    .toLowerCase()
    .slice(0, 40) || 'apiary';

function toCsv(fields: string[], data: (string | number | null)[][]): string {
  // escapeFormulae: a cell starting with = + - @ is prefixed so a spreadsheet does not run it.
  return `\uFEFF${Papa.unparse({ fields, data }, { escapeFormulae: true, newline: '\r\n' })}\r\n`;
}

const daysBetween = (a: string, b: string) => Math.round((Date.parse(`${b}T00:00:00Z`) - Date.parse(`${a}T00:00:00Z`)) / 86_400_000);

/**
 * The columns of the veterinary medicine record: what UK VMD guidance asks at administration —
 * product name, date of administration, quantity administered, withdrawal period, the animals
 * (colonies) treated — plus batch, end date and who administered it (TRADE-REFERENCES §11).
 */
export const TREATMENT_CSV_COLUMNS = [
  'Apiary',
  'Hive (colony treated)',
  'Product name',
  'Active ingredient',
  'Method',
  'Batch / lot',
  'Quantity / dose administered',
  'Date of administration',
  'End of treatment',
  'End is',
  'Withdrawal period (days after end)',
  'Withdrawal until',
  'Supers off during treatment',
  'Administered by',
  'Recorded by',
  'Note',
] as const;

async function seasonBounds(ctx: Ctx, apiaryId: string, seasonIn?: number) {
  const [a] = await ctx.db.select().from(apiaries).where(eq(apiaries.id, apiaryId)).limit(1);
  const hemisphere = (a?.hemisphere ?? 'north') as Hemisphere;
  const season = seasonIn ?? seasonOf(ctx.now(), hemisphere);
  const { fromMs, toMs } = seasonRange(season, hemisphere);
  return { apiary: a!, season, fromDate: new Date(fromMs).toISOString().slice(0, 10), toDate: new Date(toMs).toISOString().slice(0, 10) };
}

/** The apiary's medicine record for a season, one row per treatment of a hive, by start date. */
export async function treatmentsCsv(ctx: Ctx, user: SessionUser, apiaryId: string, seasonIn?: number): Promise<CsvFile> {
  await requireApiary(ctx, user, apiaryId, 'export:read');
  const { apiary, season, fromDate, toDate } = await seasonBounds(ctx, apiaryId, seasonIn);
  const rows = await ctx.db
    .select({ t: treatments, hiveName: hives.name, recordedBy: users.name })
    .from(treatments)
    .innerJoin(hives, eq(hives.id, treatments.hiveId))
    .innerJoin(users, eq(users.id, treatments.createdBy))
    .where(
      and(
        eq(hives.apiaryId, apiaryId),
        lt(treatments.startDate, toDate),
        gte(sql`coalesce(${treatments.actualEndDate}, ${treatments.plannedEndDate}, ${treatments.startDate})`, fromDate),
      ),
    )
    .orderBy(asc(treatments.startDate), asc(hives.name));
  const data = rows.map(({ t, hiveName, recordedBy }) => {
    const end = t.actualEndDate ?? t.plannedEndDate;
    return [
      apiary.name,
      hiveName,
      t.productName,
      t.activeIngredient.replace(/-/g, ' '),
      t.method,
      t.batch,
      t.dose,
      t.startDate,
      end ?? '',
      t.actualEndDate ? 'actual' : t.plannedEndDate ? 'planned' : '',
      end && t.withdrawalUntil ? daysBetween(end, t.withdrawalUntil) : '',
      t.withdrawalUntil ?? '',
      t.supersOff ? 'yes' : 'no',
      t.appliedBy || recordedBy,
      recordedBy,
      t.note,
    ];
  });
  return { fileName: `frameside-treatments-${slug(apiary.name)}-${season}.csv`, body: toCsv([...TREATMENT_CSV_COLUMNS], data) };
}

export const RECORDS_CSV_COLUMNS = ['Date', 'Time (UTC)', 'Hive', 'Record', 'Details', 'Recorded by', 'Note'] as const;

/** Every record of an apiary's season (the Season review's table) as CSV, oldest first. */
export async function recordsCsv(ctx: Ctx, user: SessionUser, apiaryId: string, seasonIn?: number): Promise<CsvFile> {
  await requireApiary(ctx, user, apiaryId, 'export:read');
  const s = await apiarySeason(ctx, user, apiaryId, seasonIn);
  const data = s.records.map((r) => [r.at.slice(0, 10), r.at.slice(11, 16), r.hiveName, SEASON_KIND_LABELS[r.kind], r.summary, r.recordedBy, r.note]);
  return { fileName: `frameside-records-${slug(s.apiary.name)}-${s.season}.csv`, body: toCsv([...RECORDS_CSV_COLUMNS], data) };
}

// ---------------------------------------------------------------- whole-account JSON

type Scope = 'apiary-id' | 'apiary' | 'hive';

interface ExportTable {
  key: string;
  table: PgTable;
  scope: Scope;
}

/**
 * What an account export holds, in the order an import writes it (parents first). Left out on
 * purpose: users' password hashes and sessions (accounts are not copied, only named by e-mail),
 * invitations (their e-mailed links cannot move), password resets and idempotency keys.
 * Photos are metadata only: the image files stay in object storage and are not in the export.
 */
export const EXPORT_TABLES: ExportTable[] = [
  { key: 'apiaries', table: schema.apiaries, scope: 'apiary-id' },
  { key: 'memberships', table: schema.memberships, scope: 'apiary' },
  { key: 'hives', table: schema.hives, scope: 'apiary' },
  { key: 'queens', table: schema.queens, scope: 'hive' },
  { key: 'inspections', table: schema.inspections, scope: 'hive' },
  { key: 'feedings', table: schema.feedings, scope: 'hive' },
  { key: 'treatments', table: schema.treatments, scope: 'hive' },
  { key: 'miteCounts', table: schema.miteCounts, scope: 'hive' },
  { key: 'harvests', table: schema.harvests, scope: 'hive' },
  { key: 'queenEvents', table: schema.queenEvents, scope: 'hive' },
  { key: 'colonyEvents', table: schema.colonyEvents, scope: 'hive' },
  { key: 'forageChecks', table: schema.forageChecks, scope: 'apiary' },
  { key: 'tasks', table: schema.tasks, scope: 'apiary' },
  { key: 'photos', table: schema.photos, scope: 'hive' },
  { key: 'sensorImports', table: schema.sensorImports, scope: 'hive' },
  { key: 'sensorReadings', table: schema.sensorReadings, scope: 'hive' },
  { key: 'auditLog', table: schema.auditLog, scope: 'apiary' },
];

/** Tables deliberately not in the export, by SQL name, and why. */
export const EXPORT_LEFT_OUT: Record<string, string> = {
  users: 'accounts are named by e-mail, never copied (no password hashes)',
  sessions: 'sign-ins belong to the server they were made on',
  password_resets: 'single-use secrets',
  invitations: 'pending e-mailed links cannot move to another account',
  idempotency_keys: 'a 24-hour replay guard for writes',
  hive_record_stamps: 'a cache key the Due list rebuilds on the next record write',
};

export const EXPORT_NOTES = [
  'Photos: their details (hive, check, frame, size) are here; the image files themselves are not.',
  'People other than you are named by e-mail; an import links them to accounts with that e-mail on the server it goes to.',
  'Not included: passwords, sessions, pending invitations.',
];

interface Meta {
  name: string;
  columns: Record<string, Column>;
  /** TS key of each foreign-key column → the SQL name of the table it points at. */
  refs: Map<string, string>;
  /** TS key of the uuid primary key, when the table has one. */
  idKey: string | null;
}

const metaCache = new Map<PgTable, Meta>();
function meta(table: PgTable): Meta {
  let m = metaCache.get(table);
  if (m) return m;
  const columns = getTableColumns(table) as Record<string, Column>;
  const cfg = getTableConfig(table);
  const keyOf = (c: Column) => Object.keys(columns).find((k) => columns[k] === c || columns[k].name === c.name)!;
  const refs = new Map<string, string>();
  for (const fk of cfg.foreignKeys) {
    const r = fk.reference();
    refs.set(keyOf(r.columns[0]), getTableConfig(r.foreignTable).name);
  }
  const idKey = columns.id && columns.id.primary ? 'id' : null;
  m = { name: cfg.name, columns, refs, idKey };
  metaCache.set(table, m);
  return m;
}

const scopeColumn = (t: ExportTable) => {
  const cols = meta(t.table).columns;
  return t.scope === 'apiary-id' ? cols.id : t.scope === 'apiary' ? cols.apiaryId : cols.hiveId;
};

export interface AccountExport {
  format: typeof EXPORT_FORMAT;
  version: typeof EXPORT_VERSION;
  exportedAt: string;
  account: { id: string; email: string; name: string };
  notes: string[];
  /** Everyone the rows name (members, record authors): id, e-mail and name only. */
  users: { id: string; email: string; name: string }[];
  tables: Record<string, Record<string, unknown>[]>;
}

/** Every apiary the person owns with everything in it, one query per table. */
export async function exportAccount(ctx: Ctx, user: SessionUser): Promise<AccountExport> {
  const owned = await ctx.db
    .select({ apiaryId: memberships.apiaryId })
    .from(memberships)
    .where(and(eq(memberships.userId, user.id), eq(memberships.role, 'owner')));
  const apiaryIds = owned.map((o) => o.apiaryId);
  const hiveIds = apiaryIds.length
    ? (await ctx.db.select({ id: hives.id }).from(hives).where(inArray(hives.apiaryId, apiaryIds))).map((h) => h.id)
    : [];
  const tables: Record<string, Record<string, unknown>[]> = {};
  const people = new Set<string>([user.id]);
  for (const t of EXPORT_TABLES) {
    const ids = t.scope === 'hive' ? hiveIds : apiaryIds;
    const rows = ids.length
      ? ((await ctx.db.select().from(t.table).where(inArray(scopeColumn(t), ids))) as Record<string, unknown>[])
      : [];
    const m = meta(t.table);
    for (const r of rows) for (const [k, target] of m.refs) if (target === 'users' && typeof r[k] === 'string') people.add(r[k] as string);
    tables[t.key] = rows.map((r) => JSON.parse(JSON.stringify(r)) as Record<string, unknown>);
  }
  const named = await ctx.db.select({ id: users.id, email: users.email, name: users.name }).from(users).where(inArray(users.id, [...people]));
  return {
    format: EXPORT_FORMAT,
    version: EXPORT_VERSION,
    exportedAt: ctx.now().toISOString(),
    account: { id: user.id, email: user.email, name: user.name },
    notes: EXPORT_NOTES,
    users: named,
    tables,
  };
}

// ---------------------------------------------------------------- import

const UUID_RE = /[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}/gi;

function columnSchema(c: Column): z.ZodType {
  const base = (col: Column): z.ZodType => {
    switch (col.columnType) {
      case 'PgUUID':
        return z.uuid();
      case 'PgTimestamp':
        return z.iso.datetime({ offset: true }).transform((v) => new Date(v));
      case 'PgDateString':
        return z.iso.date();
      case 'PgText':
        return z.string().max(100_000);
      case 'PgEnumColumn':
        return z.enum((col as unknown as { enumValues: [string, ...string[]] }).enumValues);
      case 'PgReal':
      case 'PgDoublePrecision':
        return z.number();
      case 'PgInteger':
        return z.number().int();
      case 'PgBoolean':
        return z.boolean();
      case 'PgJsonb':
      case 'PgJson':
        return z.unknown();
      case 'PgArray':
        return z.array(base((col as unknown as { baseColumn: Column }).baseColumn));
      default:
        return z.unknown();
    }
  };
  let s = base(c);
  if (!c.notNull) s = s.nullable();
  if (!c.notNull || c.hasDefault) s = s.optional();
  return s;
}

const rowSchemaCache = new Map<PgTable, z.ZodType<Record<string, unknown>>>();
function rowSchema(table: PgTable) {
  let s = rowSchemaCache.get(table);
  if (!s) {
    const shape = Object.fromEntries(Object.entries(meta(table).columns).map(([k, c]) => [k, columnSchema(c)]));
    s = z.object(shape).strict() as unknown as z.ZodType<Record<string, unknown>>;
    rowSchemaCache.set(table, s);
  }
  return s;
}

/** Replaces every mapped id inside a value (text such as a derived task key, JSON such as audit changes). */
function remapDeep(v: unknown, ids: Map<string, string>): unknown {
  if (typeof v === 'string') return v.replace(UUID_RE, (u) => ids.get(u.toLowerCase()) ?? u);
  if (Array.isArray(v)) return v.map((x) => remapDeep(x, ids));
  if (v && typeof v === 'object' && !(v instanceof Date)) {
    return Object.fromEntries(Object.entries(v as Record<string, unknown>).map(([k, x]) => [k, remapDeep(x, ids)]));
  }
  return v;
}

const INSERT_CHUNK = 2000;

/**
 * Restores an export into the signed-in person's account, which must own nothing yet (409
 * otherwise). Every row gets a new id, and every reference to it — foreign keys, derived task
 * keys, audit entries — the same new id. The exporting person becomes the signed-in person;
 * other people are matched by e-mail (memberships of people with no account here are left out
 * and listed). One transaction: all of it or none of it.
 */
export async function importAccount(ctx: Ctx, user: SessionUser, input: unknown): Promise<ImportResult> {
  const env = exportEnvelopeSchema.safeParse(input);
  if (!env.success) {
    const issue = env.error.issues[0];
    const where = issue?.path.join('.') || 'the file';
    throw new AppError('invalid_export', `This is not a Frameside export Frameside can read (${where}: ${issue?.message ?? 'not valid'}).`, 400);
  }
  const data = env.data;
  const known = new Set(EXPORT_TABLES.map((t) => t.key));
  const unknown = Object.keys(data.tables).filter((k) => !known.has(k));
  if (unknown.length) throw new AppError('invalid_export', `This export has parts Frameside does not know: ${unknown.join(', ')}.`, 400);

  // Validate every row before touching the database, so a bad file says where it is bad.
  const parsed = new Map<string, Record<string, unknown>[]>();
  for (const t of EXPORT_TABLES) {
    const rows = data.tables[t.key] ?? [];
    const s = rowSchema(t.table);
    parsed.set(
      t.key,
      rows.map((r, i) => {
        const res = s.safeParse(r);
        if (!res.success) {
          const issue = res.error.issues[0];
          throw new AppError('invalid_export', `Row ${i + 1} of ${t.key} is not valid (${issue.path.join('.') || 'row'}: ${issue.message}).`, 400);
        }
        return res.data;
      }),
    );
  }

  const [owns] = await ctx.db
    .select({ n: sql<number>`count(*)::int` })
    .from(memberships)
    .where(and(eq(memberships.userId, user.id), eq(memberships.role, 'owner')));
  if ((owns?.n ?? 0) > 0) {
    throw conflict('An import goes into an empty account: this account already owns an apiary. Sign up a new account for the import, or use it as it is.');
  }

  // People: the exporter is the importer; the rest by e-mail.
  const ids = new Map<string, string>();
  const emails = data.users.map((u) => u.email.toLowerCase());
  const here = emails.length ? await ctx.db.select({ id: users.id, email: users.email }).from(users).where(inArray(sql`lower(${users.email})`, emails)) : [];
  const byEmail = new Map(here.map((u) => [u.email.toLowerCase(), u.id]));
  for (const u of data.users) {
    const target = u.id === data.account.id ? user.id : byEmail.get(u.email.toLowerCase());
    if (target) ids.set(u.id.toLowerCase(), target);
  }
  ids.set(data.account.id.toLowerCase(), user.id);

  // New ids for every row that has one, decided before any insert so forward references work.
  for (const t of EXPORT_TABLES) {
    const m = meta(t.table);
    if (!m.idKey) continue;
    for (const r of parsed.get(t.key)!) ids.set(String(r[m.idKey]).toLowerCase(), randomUUID());
  }

  const counts: Record<string, number> = {};
  const skipped: string[] = [];
  let credited = 0;
  try {
    await ctx.db.transaction(async (tx) => {
    for (const t of EXPORT_TABLES) {
      const m = meta(t.table);
      const out: Record<string, unknown>[] = [];
      for (const row of parsed.get(t.key)!) {
        const r: Record<string, unknown> = { ...row };
        let keep = true;
        for (const [k, target] of m.refs) {
          const v = r[k];
          if (typeof v !== 'string') continue;
          const mapped = ids.get(v.toLowerCase());
          if (mapped) {
            r[k] = mapped;
          } else if (target === 'users') {
            if (t.key === 'memberships') {
              keep = false;
              const who = data.users.find((u) => u.id.toLowerCase() === v.toLowerCase());
              skipped.push(`membership of ${who?.email ?? 'an unknown person'} (${String(r.role)}): no account with that e-mail here`);
            } else if (m.columns[k].notNull) {
              r[k] = user.id;
              credited++;
            } else r[k] = null;
          } else if (m.columns[k].notNull) {
            throw new AppError('invalid_export', `A row of ${t.key} points at something that is not in the export (${k}).`, 400);
          } else r[k] = null;
        }
        if (!keep) continue;
        if (m.idKey) r[m.idKey] = ids.get(String(row[m.idKey]).toLowerCase());
        for (const k of Object.keys(r)) {
          if (k === m.idKey || m.refs.has(k)) continue;
          r[k] = remapDeep(r[k], ids);
        }
        out.push(r);
      }
      for (let i = 0; i < out.length; i += INSERT_CHUNK) {
        await tx.insert(t.table).values(out.slice(i, i + INSERT_CHUNK) as never);
      }
      counts[t.key] = out.length;
    }
    for (const a of parsed.get('apiaries')!) {
      const newId = ids.get(String(a.id).toLowerCase())!;
      await recordAudit(tx, ctx, {
        apiaryId: newId,
        userId: user.id,
        entity: 'account-import',
        entityId: newId,
        action: 'create',
        after: { from: data.account.email, exportedAt: data.exportedAt, rows: counts },
      });
    }
    });
  } catch (err) {
    if (err instanceof AppError) throw err;
    const cause = (err as { cause?: { code?: string; detail?: string; message?: string } }).cause;
    if (cause?.code && /^(22|23)/.test(cause.code)) {
      throw new AppError('invalid_export', `The export has a value Frameside cannot store: ${cause.detail ?? cause.message ?? cause.code}. Nothing was imported.`, 400);
    }
    throw err;
  }
  if (credited > 0) skipped.push(`${credited} record${credited === 1 ? '' : 's'} by people with no account here are now credited to you`);
  return { imported: counts, skipped, ids: Object.fromEntries(ids) };
}
