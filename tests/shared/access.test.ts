import { can, daysLeft, windowState, PERMISSIONS, ACTIONS, type Action, type Role } from '../../shared/domain/access';

// The rules are Frameside's own policy (PRODUCT.md §9 and the roles issue), not a published table.
const now = new Date('2026-08-10T12:00:00Z');
const open = { startsAt: null, endsAt: null };

describe('permission table', () => {
  it.each<[Role, Action, boolean]>([
    ['owner', 'apiary:delete', true],
    ['owner', 'members:manage', true],
    ['keeper', 'hive:update', true],
    ['keeper', 'record:create:treatment', true],
    ['keeper', 'apiary:delete', false],
    ['keeper', 'members:manage', false],
    ['sitter', 'hive:read', true],
    ['sitter', 'record:create:inspection', true],
    ['sitter', 'record:create:feeding', true],
    ['sitter', 'record:create:treatment', false],
    ['sitter', 'hive:update', false],
    ['sitter', 'record:delete-others', false],
    ['viewer', 'hive:read', true],
    ['viewer', 'record:create:inspection', false],
    ['viewer', 'task:resolve', false],
    // The roles issue: a sitter marks tasks done, records photos and forage checks, reads the Handover.
    ['sitter', 'task:resolve', true],
    ['sitter', 'task:create', false],
    ['sitter', 'record:create:photo', true],
    ['sitter', 'record:create:forage-check', true],
    ['sitter', 'record:create:mite-count', false],
    ['sitter', 'record:edit-others', false],
    ['sitter', 'record:delete-own', false],
    ['sitter', 'handover:read', true],
    ['sitter', 'members:read', false],
    ['sitter', 'apiary:update', false],
    ['keeper', 'members:read', true],
    ['keeper', 'record:delete-own', true],
    ['keeper', 'record:delete-others', true],
    ['keeper', 'handover:read', true],
    ['keeper', 'activity:read', false],
    ['owner', 'activity:read', true],
    ['viewer', 'handover:read', false],
    ['viewer', 'members:read', false],
    ['viewer', 'record:create:photo', false],
  ])('%s → %s is %s', (role, action, expected) => {
    expect(can({ role, ...open }, action, now)).toBe(expected);
  });

  it('gives the owner every action', () => {
    expect([...PERMISSIONS.owner].sort()).toEqual([...ACTIONS].sort());
  });

  it('refuses everything without a membership', () => {
    expect(can(null, 'hive:read', now)).toBe(false);
  });
});

describe('access windows', () => {
  const start = '2026-08-01T00:00:00Z';
  const end = '2026-08-15T00:00:00Z';
  it.each([
    ['2026-07-31T23:59:59Z', 'not-started'],
    ['2026-08-01T00:00:00Z', 'active'],
    ['2026-08-14T23:59:59Z', 'active'],
    ['2026-08-15T00:00:00Z', 'ended'],
  ] as const)('at %s the window is %s (start inclusive, end exclusive)', (at, state) => {
    expect(windowState({ startsAt: start, endsAt: end }, new Date(at))).toBe(state);
  });

  it('stops a sitter outside the window', () => {
    const m = { role: 'sitter' as const, startsAt: start, endsAt: end };
    expect(can(m, 'hive:read', new Date('2026-08-10T00:00:00Z'))).toBe(true);
    expect(can(m, 'hive:read', new Date('2026-08-16T00:00:00Z'))).toBe(false);
  });

  it.each([
    ['2026-08-10T12:00:00Z', 5],
    ['2026-08-14T23:00:00Z', 1],
    ['2026-08-20T00:00:00Z', 0],
  ] as const)('counts days left from %s: %i', (at, days) => {
    expect(daysLeft({ endsAt: end }, new Date(at))).toBe(days);
  });

  it('has no days-left for an open-ended membership', () => {
    expect(daysLeft({ endsAt: null }, now)).toBeNull();
  });
});
