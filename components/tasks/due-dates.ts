import { addDays, compareDates } from '@/shared/domain/dates';

/** The person's own calendar day, YYYY-MM-DD (local time: "today" is the keeper's today). */
export function localToday(now: Date): string {
  const y = now.getFullYear();
  const m = String(now.getMonth() + 1).padStart(2, '0');
  const d = String(now.getDate()).padStart(2, '0');
  return `${y}-${m}-${d}`;
}

/** "Mon 8 Jun": a YYYY-MM-DD day written for a keeper. */
export function formatDay(iso: string): string {
  const d = new Date(`${iso}T12:00:00Z`);
  return d.toLocaleDateString('en-GB', { weekday: 'short', day: 'numeric', month: 'short', timeZone: 'UTC' });
}

export type DueGroup = 'overdue' | 'today' | 'week' | 'later';

export const DUE_GROUP_TITLES: Readonly<Record<DueGroup, string>> = {
  overdue: 'Overdue',
  today: 'Today',
  week: 'This week',
  later: 'Later',
};

/** Which section a task goes in: overdue (as the server judged it), due today, in the next 7 days, or later. */
export function dueGroup(task: { dueDate: string; overdue: boolean }, today: string): DueGroup {
  if (task.overdue || compareDates(task.dueDate, today) < 0) return 'overdue';
  if (task.dueDate === today) return 'today';
  if (compareDates(task.dueDate, addDays(today, 7)) <= 0) return 'week';
  return 'later';
}

/** "Due today", "Due tomorrow", "Due Mon 8 Jun", "3 days overdue". */
export function dueLine(task: { dueDate: string }, today: string): string {
  const days = Math.round((Date.parse(`${task.dueDate}T00:00:00Z`) - Date.parse(`${today}T00:00:00Z`)) / 86_400_000);
  if (days === 0) return 'Due today';
  if (days === 1) return 'Due tomorrow';
  if (days === -1) return 'Overdue by 1 day';
  if (days < 0) return `Overdue by ${-days} days (due ${formatDay(task.dueDate)})`;
  return `Due ${formatDay(task.dueDate)}`;
}
