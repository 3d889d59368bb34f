/**
 * Times and dates as the keeper's device sees them (local time): the visit time chips and the
 * ±1 day date steppers. shared/domain works on 'YYYY-MM-DD' in UTC; these helpers only turn the
 * local calendar into those strings at the edge.
 */
import type { IsoDate } from '@/shared/domain/dates';

export const VISIT_TIMES = ['now', 'hour-ago', 'earlier-today', 'yesterday'] as const;
export type VisitTime = (typeof VISIT_TIMES)[number];

const HOUR_MS = 3_600_000;

/** How far back each visit-time chip sets the visit: "earlier today" is three hours ago. */
export const VISIT_TIME_OFFSET_MS: Readonly<Record<VisitTime, number>> = {
  now: 0,
  'hour-ago': HOUR_MS,
  'earlier-today': 3 * HOUR_MS,
  yesterday: 24 * HOUR_MS,
};

export const VISIT_TIME_LABELS: Readonly<Record<VisitTime, string>> = {
  now: 'Now',
  'hour-ago': '1 h ago',
  'earlier-today': 'Earlier today',
  yesterday: 'Yesterday',
};

/** The visit instant a chip stands for, as an ISO string. */
export function visitInstant(choice: VisitTime, now: Date): string {
  return new Date(now.getTime() - VISIT_TIME_OFFSET_MS[choice]).toISOString();
}

/** The local calendar date of `d` as 'YYYY-MM-DD'. */
export function localIsoDate(d: Date): IsoDate {
  const p = (n: number) => String(n).padStart(2, '0');
  return `${d.getFullYear()}-${p(d.getMonth() + 1)}-${p(d.getDate())}`;
}

/** The local date `days` after today. */
export function dateFromToday(days: number, now: Date): IsoDate {
  const d = new Date(now.getFullYear(), now.getMonth(), now.getDate() + days, 12);
  return localIsoDate(d);
}

/** Whole days from today (local) to `date`. */
export function daysFromToday(date: IsoDate, now: Date): number {
  const [y, m, d] = date.split('-').map(Number);
  const a = Date.UTC(now.getFullYear(), now.getMonth(), now.getDate());
  return Math.round((Date.UTC(y, m - 1, d) - a) / 86_400_000);
}

const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];
const WEEKDAYS = ['Sun', 'Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat'];

/** "12 May" for a 'YYYY-MM-DD' date. */
export function shortDate(date: IsoDate): string {
  const [, m, d] = date.split('-').map(Number);
  return `${d} ${MONTHS[m - 1]}`;
}

/** "12 May" for an instant, in local time. */
export function shortDateOfInstant(iso: string): string {
  return shortDate(localIsoDate(new Date(iso)));
}

/** "Tue 12 May, 14:05" for an instant, in local time. */
export function dayAndTime(iso: string): string {
  const d = new Date(iso);
  const p = (n: number) => String(n).padStart(2, '0');
  return `${WEEKDAYS[d.getDay()]} ${d.getDate()} ${MONTHS[d.getMonth()]}, ${p(d.getHours())}:${p(d.getMinutes())}`;
}

/** "today", "yesterday", "tomorrow", "3 days ago", "in 5 days". */
export function relativeDay(days: number): string {
  if (days === 0) return 'today';
  if (days === -1) return 'yesterday';
  if (days === 1) return 'tomorrow';
  return days < 0 ? `${-days} days ago` : `in ${days} days`;
}
