/**
 * Calendar arithmetic on 'YYYY-MM-DD' strings, done in UTC so the answer never depends on
 * the machine's time zone or a daylight-saving change. No clock: every date comes in.
 */

/** A calendar date written 'YYYY-MM-DD'. */
export type IsoDate = string;

const DAY_MS = 86_400_000;
const DATE_RE = /^(\d{4})-(\d{2})-(\d{2})$/;

// Parsed days, remembered: the Due-list rules compare the same few hundred dates thousands of
// times per request. A pure cache (same input, same output), emptied when it grows large.
const parsed = new Map<string, number>();
const PARSED_MAX = 20_000;

/** Epoch milliseconds of 00:00 UTC on `date`; throws a RangeError unless `date` is a real 'YYYY-MM-DD' day. */
export function dateToUtcMs(date: IsoDate): number {
  const hit = parsed.get(date);
  if (hit !== undefined) return hit;
  const ms = parseDay(date);
  if (parsed.size >= PARSED_MAX) parsed.clear();
  parsed.set(date, ms);
  return ms;
}

function parseDay(date: IsoDate): number {
  const m = DATE_RE.exec(date);
  if (!m) throw new RangeError(`Expected a date as YYYY-MM-DD, got "${date}".`);
  const [y, mo, d] = [Number(m[1]), Number(m[2]), Number(m[3])];
  const ms = Date.UTC(y, mo - 1, d);
  const back = new Date(ms);
  // Date.UTC rolls 2025-02-30 over to March; a round trip catches days that do not exist.
  if (back.getUTCFullYear() !== y || back.getUTCMonth() !== mo - 1 || back.getUTCDate() !== d) {
    throw new RangeError(`"${date}" is not a calendar day.`);
  }
  return ms;
}

/** The UTC calendar date ('YYYY-MM-DD') containing the instant `ms` (epoch milliseconds). */
export function utcMsToDate(ms: number): IsoDate {
  if (!Number.isFinite(ms)) throw new RangeError('Expected a finite epoch time in milliseconds.');
  return new Date(ms).toISOString().slice(0, 10);
}

/** True when `date` is a real 'YYYY-MM-DD' calendar day. */
export function isIsoDate(date: unknown): date is IsoDate {
  if (typeof date !== 'string') return false;
  try {
    dateToUtcMs(date);
    return true;
  } catch {
    return false;
  }
}

/** `date` moved by `days` whole days (negative goes back); throws a RangeError for a non-integer count. */
export function addDays(date: IsoDate, days: number): IsoDate {
  if (!Number.isInteger(days)) throw new RangeError('Days to add must be a whole number.');
  return utcMsToDate(dateToUtcMs(date) + days * DAY_MS);
}

/** Whole days from `from` to `to` (positive when `to` is later, 0 on the same day). */
export function diffDays(from: IsoDate, to: IsoDate): number {
  return Math.round((dateToUtcMs(to) - dateToUtcMs(from)) / DAY_MS);
}

/** `date` moved by whole months; a day past the end of the target month falls back to its last day (01-31 + 1 → 02-28/29). */
export function addMonths(date: IsoDate, months: number): IsoDate {
  if (!Number.isInteger(months)) throw new RangeError('Months to add must be a whole number.');
  const ms = dateToUtcMs(date);
  const d = new Date(ms);
  const target = d.getUTCFullYear() * 12 + d.getUTCMonth() + months;
  const y = Math.floor(target / 12);
  const mo = target - y * 12;
  const lastDay = new Date(Date.UTC(y, mo + 1, 0)).getUTCDate();
  return utcMsToDate(Date.UTC(y, mo, Math.min(d.getUTCDate(), lastDay)));
}

/** Month of `date`, 1 (January) to 12 (December). */
export function monthOf(date: IsoDate): number {
  return new Date(dateToUtcMs(date)).getUTCMonth() + 1;
}

/** Year of `date`. */
export function yearOf(date: IsoDate): number {
  return new Date(dateToUtcMs(date)).getUTCFullYear();
}

/** Negative, 0 or positive as `a` is before, on or after `b` (for Array.sort). */
export function compareDates(a: IsoDate, b: IsoDate): number {
  return dateToUtcMs(a) - dateToUtcMs(b);
}

/** The later of two dates. */
export function maxDate(a: IsoDate, b: IsoDate): IsoDate {
  return compareDates(a, b) >= 0 ? a : b;
}

/** The earlier of two dates. */
export function minDate(a: IsoDate, b: IsoDate): IsoDate {
  return compareDates(a, b) <= 0 ? a : b;
}

const HAS_ZONE_RE = /(Z|[+-]\d{2}:?\d{2})$/i;
const ISO_INSTANT_RE = /^\d{4}-\d{2}-\d{2}([T ]\d{2}:\d{2}(:\d{2}(\.\d+)?)?)?(Z|[+-]\d{2}:?\d{2})?$/i;

/**
 * Epoch milliseconds of an instant given as epoch ms or an ISO 8601 string. A string without a
 * zone is read as UTC (JavaScript would read it as local time, which would make results depend
 * on the machine). Throws a RangeError for anything else.
 */
export function parseInstant(t: string | number): number {
  if (typeof t === 'number') {
    if (!Number.isFinite(t)) throw new RangeError('Expected a finite epoch time in milliseconds.');
    return t;
  }
  const s = t.trim();
  if (!ISO_INSTANT_RE.test(s)) throw new RangeError(`Expected an ISO 8601 time, got "${t}".`);
  const withT = s.replace(' ', 'T');
  const ms = Date.parse(HAS_ZONE_RE.test(withT) || !withT.includes('T') ? withT : `${withT}Z`);
  if (!Number.isFinite(ms)) throw new RangeError(`"${t}" is not a valid time.`);
  return ms;
}
