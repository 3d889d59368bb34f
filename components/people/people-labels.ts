import type { Role } from '@/shared/domain/access';

/** Writes a UTC calendar day or timestamp as "Tue 2 Dec"; the server's dates are UTC days. */
export function dayLabel(iso: string): string {
  const d = new Date(iso.length === 10 ? `${iso}T00:00:00Z` : iso);
  return d.toLocaleDateString('en-GB', { weekday: 'short', day: 'numeric', month: 'short', timeZone: 'UTC' });
}

/** "2026-12-02" for today (UTC) moved by `days`. */
export function isoDayFrom(now: Date, days: number): string {
  return new Date(now.getTime() + days * 86_400_000).toISOString().slice(0, 10);
}

/** Whole days from today (UTC) to the day of `iso`. */
export function daysFromToday(now: Date, iso: string): number {
  const a = Date.parse(`${now.toISOString().slice(0, 10)}T00:00:00Z`);
  const b = Date.parse(`${iso.slice(0, 10)}T00:00:00Z`);
  return Math.round((b - a) / 86_400_000);
}

export const ROLE_HELP: Record<Role, string> = {
  owner: 'Everything, including who has access and deleting the apiary.',
  keeper: 'All hives and records; no member changes.',
  sitter: 'Only between the dates: Quick checks, feedings, forage checks, photos and ticking off tasks.',
  viewer: 'Reads everything, changes nothing.',
};

const QUEEN_WORDS: Record<string, string> = {
  'eggs-seen': 'eggs seen',
  'queen-seen': 'queen seen',
  'young-larvae-only': 'young larvae, no eggs',
  'no-eggs-or-brood': 'no eggs or brood',
};
export const queenWords = (s: string) => QUEEN_WORDS[s] ?? s.replace(/-/g, ' ');

export const frames = (n: number) => (n === 1 ? '1 frame' : `${String(n).replace('.5', '½')} frames`);
