/**
 * Hive-logger CSV files: read them (papaparse does the CSV itself — quotes, delimiters,
 * line breaks inside quotes), suggest which column is which, and turn the rows into readings in
 * °C, kg and UTC instants. The one module both the import screen's preview and the server's
 * import use, so the preview shows exactly what the import will do. Pure: no clock, no I/O.
 *
 * Every data row ends up either as a reading or in `bad` with its line number and the reason;
 * nothing is dropped without a word. Blank lines are not rows.
 */
import Papa from 'papaparse';

export const TIME_FORMATS = ['iso', 'dmy', 'mdy', 'epoch-s', 'epoch-ms'] as const;
export type TimeFormat = (typeof TIME_FORMATS)[number];

export const TEMPERATURE_UNITS = ['C', 'F'] as const;
export type TemperatureUnit = (typeof TEMPERATURE_UNITS)[number];

export const WEIGHT_UNITS = ['kg', 'lb'] as const;
export type WeightUnit = (typeof WEIGHT_UNITS)[number];

/** The zones offered as chips: UTC and a few where keepers commonly are. Any IANA zone works. */
export const COMMON_TIME_ZONES = [
  'UTC',
  'Europe/London',
  'Europe/Berlin',
  'America/New_York',
  'America/Chicago',
  'America/Denver',
  'America/Los_Angeles',
  'Australia/Sydney',
  'Pacific/Auckland',
] as const;

export const CSV_DELIMITERS = [',', ';', '\t'] as const;
export type CsvDelimiter = (typeof CSV_DELIMITERS)[number];

/** Exact by definition (lb = 0.45359237 kg; TRADE-REFERENCES §2b). */
const KG_PER_LB = 0.45359237;

/**
 * Readings outside these are logger faults (a -999 "no value" marker, an unplugged probe), not
 * bees: the row is reported rather than plotted. Frameside's own bounds, generous on purpose.
 */
export const PLAUSIBLE = { minC: -40, maxC: 70, minKg: 0, maxKg: 500 } as const;

export interface BadRow {
  /** 1-based line in the file where the row starts (the header is line 1 or later). */
  line: number;
  reason: string;
}

export interface CsvTable {
  delimiter: CsvDelimiter;
  headers: string[];
  /** Data rows as text fields, in file order. */
  rows: string[][];
  /** rows[i] starts on file line lines[i]. */
  lines: number[];
  /** Rows the CSV reader itself could not read (unbalanced quotes). */
  unreadable: BadRow[];
  /** True when maxRows stopped the read before the end of the file. */
  truncated: boolean;
}

const BOM = '\uFEFF';

/** The delimiter of a file from its first non-blank line: the most frequent of , ; tab outside quotes (a header has no decimal commas). */
export function detectDelimiter(text: string): CsvDelimiter {
  const body = text.startsWith(BOM) ? text.slice(1) : text;
  const firstLine = body.split(/\r\n|\n|\r/).find((l) => l.trim() !== '') ?? '';
  const counts: Record<CsvDelimiter, number> = { ',': 0, ';': 0, '\t': 0 };
  let quoted = false;
  for (const ch of firstLine) {
    if (ch === '"') quoted = !quoted;
    else if (!quoted && (ch === ',' || ch === ';' || ch === '\t')) counts[ch]++;
  }
  let best: CsvDelimiter = ',';
  for (const d of CSV_DELIMITERS) if (counts[d] > counts[best]) best = d;
  return best;
}

/**
 * Reads CSV text into a header and rows, with the file line each row starts on. A UTF-8
 * byte-order mark is removed; blank lines are skipped; the first non-blank row is the header.
 * `maxRows` stops after that many data rows (for a preview).
 */
export function readCsv(text: string, opts: { delimiter?: CsvDelimiter; maxRows?: number } = {}): CsvTable {
  const body = text.startsWith(BOM) ? text.slice(1) : text;
  const delimiter = opts.delimiter ?? detectDelimiter(body);
  const rows: string[][] = [];
  const lines: number[] = [];
  const unreadable: BadRow[] = [];
  let headers: string[] | null = null;
  let truncated = false;
  // Line counting: a row starts where the previous one's cursor ended.
  let prevCursor = 0;
  let lineAtPrev = 1;
  const maxRows = opts.maxRows ?? Infinity;

  Papa.parse<string[]>(body, {
    delimiter,
    skipEmptyLines: false,
    step: (result, parser) => {
      const start = prevCursor;
      const end = result.meta.cursor;
      const line = lineAtPrev;
      let nl = 0;
      for (let i = start; i < end; i++) {
        const c = body.charCodeAt(i);
        // \r\n counts once; a lone \r (old Mac files) counts too.
        if (c === 10 || (c === 13 && body.charCodeAt(i + 1) !== 10)) nl++;
      }
      lineAtPrev += nl;
      prevCursor = end;
      const data = result.data;
      if (data.length === 1 && data[0].trim() === '') return;
      if (result.errors.length > 0) {
        unreadable.push({ line, reason: `could not be read as CSV (${result.errors[0].message.replace(/\.$/, '')})` });
        return;
      }
      if (headers === null) {
        headers = data.map((h) => h.trim());
        return;
      }
      if (rows.length >= maxRows) {
        truncated = true;
        parser.abort();
        return;
      }
      rows.push(data);
      lines.push(line);
    },
  });
  return { delimiter, headers: headers ?? [], rows, lines, unreadable, truncated };
}

export interface ColumnGuess {
  time: string | null;
  temperature: string | null;
  weight: string | null;
  temperatureUnit: TemperatureUnit;
  weightUnit: WeightUnit;
}

/** Suggests the time, temperature and weight columns and their units from the header names (the keeper confirms with chips). */
export function suggestColumns(headers: readonly string[]): ColumnGuess {
  const find = (re: RegExp) => headers.find((h) => re.test(h)) ?? null;
  const time = find(/time|date|stamp|zeit|datum|heure|^t$/i);
  const temperature = find(/temp|°\s*[cf]|celsius|fahrenheit|\bdeg/i);
  const weight = find(/weight|mass|gewicht|poids|scale|\bkg\b|\blbs?\b/i);
  return {
    time,
    temperature: temperature === time ? null : temperature,
    weight: weight === time ? null : weight,
    temperatureUnit: temperature && /°\s*f|fahrenheit|\(f\)|\bf\b/i.test(temperature) ? 'F' : 'C',
    weightUnit: weight && /\blbs?\b|pound/i.test(weight) ? 'lb' : 'kg',
  };
}

const ISO_RE = /^(\d{4})-(\d{1,2})-(\d{1,2})(?:[T ](\d{1,2}):(\d{2})(?::(\d{2})(?:[.,](\d{1,6}))?)?)?\s*(Z|[+-]\d{2}(?::?\d{2})?)?$/i;
const DAY_FIRST_RE = /^(\d{1,2})[./-](\d{1,2})[./-](\d{2}|\d{4})(?:[ T,]+(\d{1,2}):(\d{2})(?::(\d{2}))?\s*(AM|PM)?)?$/i;

/** Suggests how the time column is written from a few sample values; `ambiguous` when day and month cannot be told apart. */
export function suggestTimeFormat(samples: readonly string[]): { format: TimeFormat; ambiguous: boolean } {
  const vals = samples.map((s) => s.trim()).filter(Boolean);
  if (vals.length === 0) return { format: 'iso', ambiguous: false };
  if (vals.every((v) => ISO_RE.test(v))) return { format: 'iso', ambiguous: false };
  if (vals.every((v) => /^\d{13}$/.test(v))) return { format: 'epoch-ms', ambiguous: false };
  if (vals.every((v) => /^\d{9,10}(\.\d+)?$/.test(v))) return { format: 'epoch-s', ambiguous: false };
  let firstOver12 = false;
  let secondOver12 = false;
  for (const v of vals) {
    const m = DAY_FIRST_RE.exec(v);
    if (!m) continue;
    if (Number(m[1]) > 12) firstOver12 = true;
    if (Number(m[2]) > 12) secondOver12 = true;
  }
  if (firstOver12 && !secondOver12) return { format: 'dmy', ambiguous: false };
  if (secondOver12 && !firstOver12) return { format: 'mdy', ambiguous: false };
  return { format: 'dmy', ambiguous: true };
}

/**
 * A number written with a decimal point or a decimal comma ("21.5", "21,5", "-0,25"); null for
 * an empty field, NaN for anything else (thousands separators are not guessed at).
 */
export function parseDecimal(field: string | undefined): number | null {
  if (field === undefined) return null;
  const s = field.trim();
  if (s === '') return null;
  if (!/^[+-]?(\d+([.,]\d*)?|[.,]\d+)([eE][+-]?\d+)?$/.test(s)) return NaN;
  return Number(s.replace(',', '.'));
}

const offsetCache = new Map<string, Intl.DateTimeFormat>();

function formatterFor(zone: string): Intl.DateTimeFormat {
  let f = offsetCache.get(zone);
  if (!f) {
    f = new Intl.DateTimeFormat('en-US', {
      timeZone: zone,
      hourCycle: 'h23',
      year: 'numeric',
      month: 'numeric',
      day: 'numeric',
      hour: 'numeric',
      minute: 'numeric',
      second: 'numeric',
    });
    offsetCache.set(zone, f);
  }
  return f;
}

/** True when the runtime knows the IANA zone. */
export function isKnownTimeZone(zone: string): boolean {
  try {
    formatterFor(zone);
    return true;
  } catch {
    return false;
  }
}

/** The zone's offset from UTC in ms at an instant (positive east of Greenwich). */
export function zoneOffsetMs(zone: string, utcMs: number): number {
  if (zone === 'UTC') return 0;
  const parts = formatterFor(zone).formatToParts(new Date(utcMs));
  const get = (type: string) => Number(parts.find((p) => p.type === type)?.value ?? 0);
  const asUtc = Date.UTC(get('year'), get('month') - 1, get('day'), get('hour'), get('minute'), get('second'));
  return asUtc - Math.floor(utcMs / 1000) * 1000;
}

/**
 * The UTC instant of a wall-clock time in a zone (the wall time given as if it were UTC ms). In
 * the spring-forward gap the time is read with the offset before the change (so 01:30 in a
 * 01:00→02:00 gap becomes 02:30 summer time); in the autumn's repeated hour the first of the two
 * instants is taken. Assumes at most one offset change within 14 hours, true of every zone.
 */
export function zonedTimeToUtc(wallUtcMs: number, zone: string, cache?: Map<number, number>): number {
  if (zone === 'UTC') return wallUtcMs;
  const offsetAt = (ms: number) => {
    const key = Math.floor(ms / 3_600_000);
    let off = cache?.get(key);
    if (off === undefined) {
      off = zoneOffsetMs(zone, ms);
      cache?.set(key, off);
    }
    return off;
  };
  const early = offsetAt(wallUtcMs - 14 * 3_600_000);
  const late = offsetAt(wallUtcMs + 14 * 3_600_000);
  const tEarly = wallUtcMs - early;
  if (early === late) return tEarly;
  const tLate = wallUtcMs - late;
  const earlyFits = offsetAt(tEarly) === early;
  const lateFits = offsetAt(tLate) === late;
  if (earlyFits && lateFits) return Math.min(tEarly, tLate);
  if (lateFits) return tLate;
  return tEarly;
}

const daysIn = (y: number, m: number) => new Date(Date.UTC(y, m, 0)).getUTCDate();

function wallClock(y: number, mo: number, d: number, h: number, mi: number, s: number, ms: number): number | string {
  if (mo < 1 || mo > 12) return `month ${mo} is not 1–12`;
  if (d < 1 || d > daysIn(y, mo)) return `day ${d} is not in that month`;
  if (h > 23 || mi > 59 || s > 59) return 'the time of day is not valid';
  return Date.UTC(y, mo - 1, d, h, mi, s, ms);
}

function zoneSuffixMs(z: string): number {
  if (z.toUpperCase() === 'Z') return 0;
  const sign = z.startsWith('-') ? -1 : 1;
  const digits = z.slice(1).replace(':', '');
  const hours = Number(digits.slice(0, 2));
  const minutes = digits.length > 2 ? Number(digits.slice(2, 4)) : 0;
  return sign * (hours * 60 + minutes) * 60_000;
}

/**
 * Reads one time field as a UTC instant in ms, or returns why it cannot. Times without their own
 * offset are wall-clock times in `zone`; an ISO time with Z or ±hh:mm keeps its own offset.
 */
export function parseLoggerTime(field: string, format: TimeFormat, zone: string, cache?: Map<number, number>): number | string {
  const s = field.trim();
  if (s === '') return 'the time is empty';
  if (format === 'epoch-s' || format === 'epoch-ms') {
    if (!/^\d+(\.\d+)?$/.test(s)) return `"${s}" is not a Unix time`;
    return format === 'epoch-s' ? Math.round(Number(s) * 1000) : Math.round(Number(s));
  }
  if (format === 'iso') {
    const m = ISO_RE.exec(s);
    if (!m) return `"${s}" is not a date like 2026-05-31 14:00`;
    const frac = m[7] ? Math.round(Number(`0.${m[7]}`) * 1000) : 0;
    const wall = wallClock(+m[1], +m[2], +m[3], +(m[4] ?? 0), +(m[5] ?? 0), +(m[6] ?? 0), frac);
    if (typeof wall === 'string') return `"${s}": ${wall}`;
    return m[8] ? wall - zoneSuffixMs(m[8]) : zonedTimeToUtc(wall, zone, cache);
  }
  const m = DAY_FIRST_RE.exec(s);
  if (!m) return `"${s}" is not a date like ${format === 'dmy' ? '31/05/2026 14:00' : '05/31/2026 14:00'}`;
  const [a, b] = [Number(m[1]), Number(m[2])];
  const day = format === 'dmy' ? a : b;
  const month = format === 'dmy' ? b : a;
  let year = Number(m[3]);
  if (m[3].length === 2) year += 2000;
  let hour = Number(m[4] ?? 0);
  if (m[7]) {
    if (hour < 1 || hour > 12) return `"${s}": hour ${hour} with AM/PM`;
    hour = (hour % 12) + (m[7].toUpperCase() === 'PM' ? 12 : 0);
  }
  const wall = wallClock(year, month, day, hour, Number(m[5] ?? 0), Number(m[6] ?? 0), 0);
  if (typeof wall === 'string') return `"${s}": ${wall}`;
  return zonedTimeToUtc(wall, zone, cache);
}

export interface SensorMapping {
  /** Header names as they appear in the file. */
  timeColumn: string;
  temperatureColumn?: string | null;
  weightColumn?: string | null;
  timeFormat: TimeFormat;
  temperatureUnit: TemperatureUnit;
  weightUnit: WeightUnit;
  /** IANA zone for times written without an offset. */
  timeZone: string;
}

export interface SensorReadingValue {
  /** UTC instant, epoch ms. */
  atMs: number;
  temperatureC: number | null;
  weightKg: number | null;
}

export interface MappedReadings {
  readings: SensorReadingValue[];
  bad: BadRow[];
  /** Rows whose instant an earlier row of the same file already had (the first is kept). */
  repeated: BadRow[];
  /** Data rows in the file. */
  rows: number;
}

/** A mapping that cannot be applied to this file at all (a named column is not in the header). */
export class SensorMappingError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'SensorMappingError';
  }
}

/** Throws a SensorMappingError when the mapping names a column the file lacks, maps no value column, or names an unknown zone. */
export function checkMapping(headers: readonly string[], mapping: SensorMapping): void {
  const missing = [mapping.timeColumn, mapping.temperatureColumn, mapping.weightColumn].filter(
    (c): c is string => typeof c === 'string' && !headers.includes(c),
  );
  if (missing.length > 0) {
    throw new SensorMappingError(
      `The file has no column called ${missing.map((c) => `"${c}"`).join(' or ')}. Its columns are: ${headers.map((h) => `"${h}"`).join(', ') || 'none'}.`,
    );
  }
  if (!mapping.temperatureColumn && !mapping.weightColumn) {
    throw new SensorMappingError('Choose a temperature column, a weight column, or both.');
  }
  if (!isKnownTimeZone(mapping.timeZone)) throw new SensorMappingError(`"${mapping.timeZone}" is not a time zone Frameside knows.`);
}

/**
 * Turns a read file into readings (°C, kg, UTC). A row is bad — reported with its line and
 * reason, and skipped — when it has too few fields, an unreadable time, a value that is not a
 * number or outside PLAUSIBLE, or neither value. Throws SensorMappingError (see checkMapping).
 */
export function mapReadings(table: CsvTable, mapping: SensorMapping): MappedReadings {
  checkMapping(table.headers, mapping);
  const ti = table.headers.indexOf(mapping.timeColumn);
  const ci = mapping.temperatureColumn ? table.headers.indexOf(mapping.temperatureColumn) : -1;
  const wi = mapping.weightColumn ? table.headers.indexOf(mapping.weightColumn) : -1;
  const need = Math.max(ti, ci, wi) + 1;
  const readings: SensorReadingValue[] = [];
  const bad: BadRow[] = [...table.unreadable];
  const repeated: BadRow[] = [];
  const seen = new Set<number>();
  const cache = new Map<number, number>();

  for (let r = 0; r < table.rows.length; r++) {
    const row = table.rows[r];
    const line = table.lines[r];
    if (row.length < need) {
      bad.push({ line, reason: `has ${row.length} field${row.length === 1 ? '' : 's'}, the mapped columns need ${need}` });
      continue;
    }
    const at = parseLoggerTime(row[ti], mapping.timeFormat, mapping.timeZone, cache);
    if (typeof at === 'string') {
      bad.push({ line, reason: at });
      continue;
    }
    let temperatureC: number | null = null;
    let weightKg: number | null = null;
    let problem: string | null = null;
    if (ci >= 0) {
      const v = parseDecimal(row[ci]);
      if (v !== null && Number.isNaN(v)) problem = `temperature "${row[ci].trim()}" is not a number`;
      else if (v !== null) {
        temperatureC = mapping.temperatureUnit === 'F' ? ((v - 32) * 5) / 9 : v;
        if (temperatureC < PLAUSIBLE.minC || temperatureC > PLAUSIBLE.maxC) problem = `temperature ${row[ci].trim()} is outside ${PLAUSIBLE.minC} to ${PLAUSIBLE.maxC} °C`;
      }
    }
    if (!problem && wi >= 0) {
      const v = parseDecimal(row[wi]);
      if (v !== null && Number.isNaN(v)) problem = `weight "${row[wi].trim()}" is not a number`;
      else if (v !== null) {
        weightKg = mapping.weightUnit === 'lb' ? v * KG_PER_LB : v;
        if (weightKg < PLAUSIBLE.minKg || weightKg > PLAUSIBLE.maxKg) problem = `weight ${row[wi].trim()} is outside ${PLAUSIBLE.minKg} to ${PLAUSIBLE.maxKg} kg`;
      }
    }
    if (!problem && temperatureC === null && weightKg === null) problem = 'has no temperature or weight';
    if (problem) {
      bad.push({ line, reason: problem });
      continue;
    }
    if (seen.has(at)) {
      repeated.push({ line, reason: `repeats the time ${new Date(at).toISOString()}` });
      continue;
    }
    seen.add(at);
    readings.push({ atMs: at, temperatureC, weightKg });
  }
  bad.sort((a, b) => a.line - b.line);
  return { readings, bad, repeated, rows: table.rows.length + table.unreadable.length };
}

/** A short list of bad lines for a message: "line 4: …; line 9: …" and how many more. */
export function describeBadRows(bad: readonly BadRow[], max = 5): string {
  const shown = bad.slice(0, max).map((b) => `line ${b.line}: ${b.reason}`);
  const more = bad.length - shown.length;
  return shown.join('; ') + (more > 0 ? `; and ${more} more` : '');
}
