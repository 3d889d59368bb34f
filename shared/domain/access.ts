/**
 * Who may do what in an apiary. One table, read by the server on every request and by the
 * client to show or hide actions. Pure: the caller passes `now`.
 */

export const ROLES = ['owner', 'keeper', 'sitter', 'viewer'] as const;
export type Role = (typeof ROLES)[number];

/** Record kinds that hang off a hive or an apiary. */
export const RECORD_KINDS = [
  'inspection',
  'feeding',
  'treatment',
  'mite-count',
  'harvest',
  'queen-event',
  'colony-event',
  'forage-check',
  'photo',
  'sensor',
] as const;
export type RecordKind = (typeof RECORD_KINDS)[number];

export const ACTIONS = [
  'apiary:read',
  'apiary:update',
  'apiary:delete',
  'members:read',
  'members:manage',
  'hive:read',
  'hive:create',
  'hive:update',
  'task:create',
  'task:resolve',
  'record:edit-others',
  /** Deleting a record you wrote yourself: a sitter may correct her entries but not remove them while the owner is away. */
  'record:delete-own',
  'record:delete-others',
  'export:read',
  'handover:read',
  'activity:read',
  ...RECORD_KINDS.map((kind) => `record:create:${kind}` as const),
] as const;
export type Action = (typeof ACTIONS)[number];

/** Kinds a sitter may record during their window: the everyday care, nothing that needs judgement or a medicine record. */
const SITTER_RECORDS: readonly RecordKind[] = ['inspection', 'feeding', 'forage-check', 'photo'];

const ALL_RECORDS = RECORD_KINDS.map((kind) => `record:create:${kind}` as const);

/** The permission table: for each role, the actions it holds. */
export const PERMISSIONS: Readonly<Record<Role, readonly Action[]>> = {
  owner: ACTIONS,
  // A keeper runs the hives with the owner but does not decide who has access, delete the
  // apiary or read the trail of other people's changes.
  keeper: ACTIONS.filter((a) => a !== 'apiary:delete' && a !== 'members:manage' && a !== 'activity:read'),
  sitter: [
    'apiary:read',
    'hive:read',
    'handover:read',
    'task:resolve',
    ...SITTER_RECORDS.map((kind) => `record:create:${kind}` as const),
  ],
  viewer: ['apiary:read', 'hive:read'],
};

export interface MembershipWindow {
  role: Role;
  /** ISO timestamp or null for "from the start". */
  startsAt: string | Date | null;
  /** ISO timestamp or null for "no end". */
  endsAt: string | Date | null;
}

export type WindowState = 'active' | 'not-started' | 'ended';

const toMs = (v: string | Date): number => (v instanceof Date ? v.getTime() : Date.parse(v));

/** Where `now` falls in a membership's window: an end is exclusive, a start inclusive. */
export function windowState(m: Pick<MembershipWindow, 'startsAt' | 'endsAt'>, now: Date): WindowState {
  const t = now.getTime();
  if (m.startsAt != null && t < toMs(m.startsAt)) return 'not-started';
  if (m.endsAt != null && t >= toMs(m.endsAt)) return 'ended';
  return 'active';
}

/** True when the membership is inside its window and its role holds the action. */
export function can(m: MembershipWindow | null | undefined, action: Action, now: Date): boolean {
  if (!m) return false;
  if (windowState(m, now) !== 'active') return false;
  return PERMISSIONS[m.role].includes(action);
}

/** Shorthand the screens use: may this person change hives and records here? */
export function canWrite(m: MembershipWindow | null | undefined, now: Date): boolean {
  return can(m, 'hive:update', now);
}

/** Whole days left in a window (rounded up), or null when it has no end. */
export function daysLeft(m: Pick<MembershipWindow, 'endsAt'>, now: Date): number | null {
  if (m.endsAt == null) return null;
  const ms = toMs(m.endsAt) - now.getTime();
  return Math.max(0, Math.ceil(ms / 86_400_000));
}
