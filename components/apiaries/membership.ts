import { can, daysLeft, windowState, type Action, type MembershipWindow, type Role } from '@/shared/domain/access';
import type { ApiaryDto } from '@/shared/schemas/apiaries';

/** The signed-in person's membership of an apiary, in the shape the access rules read. */
export function membershipOf(apiary: Pick<ApiaryDto, 'myRole' | 'myStartsAt' | 'myEndsAt'>): MembershipWindow {
  return { role: apiary.myRole, startsAt: apiary.myStartsAt, endsAt: apiary.myEndsAt };
}

/** May the signed-in person do `action` in this apiary now? The same rule the server applies. */
export function canIn(apiary: ApiaryDto | undefined, action: Action, now: Date): boolean {
  return apiary ? can(membershipOf(apiary), action, now) : false;
}

export const ROLE_LABELS: Record<Role, string> = {
  owner: 'Owner',
  keeper: 'Keeper',
  sitter: 'Sitter',
  viewer: 'Viewer',
};

const shortDate = (iso: string) => new Date(iso).toLocaleDateString(undefined, { day: 'numeric', month: 'short' });

/** "Keeper", "Sitter · 5 days left", "Sitter · starts 12 Aug", "Sitter · access ended". */
export function accessLine(apiary: ApiaryDto, now: Date): string {
  const m = membershipOf(apiary);
  const role = ROLE_LABELS[m.role];
  const state = windowState(m, now);
  if (state === 'not-started' && apiary.myStartsAt) return `${role} · starts ${shortDate(apiary.myStartsAt)}`;
  if (state === 'ended') return `${role} · access ended`;
  const left = daysLeft(m, now);
  if (left === null) return role;
  return `${role} · ${left === 1 ? '1 day' : `${left} days`} left`;
}

export function hiveCountLine(count: number): string {
  return count === 1 ? '1 hive' : `${count} hives`;
}
