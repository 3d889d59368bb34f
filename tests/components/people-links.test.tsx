/**
 * The client shows or hides People actions with the same permission table the server applies
 * (shared/domain/access.ts; Frameside's own policy from the roles issue).
 */
import { renderRouter, screen } from 'expo-router/testing-library';
import type { Role } from '@/shared/domain/access';
import type { ApiaryDto } from '@/shared/schemas/apiaries';
import { ApiaryPeopleLinks } from '@/components/people/apiary-people-links';

const DAY = 86_400_000;

function apiary(role: Role, window?: { startsAt: Date; endsAt: Date }): ApiaryDto {
  return {
    id: '6f4bf718-a703-4764-9120-4cbda571f932',
    name: 'Orchard Row',
    hemisphere: 'north',
    climateNote: '',
    winterStoresTargetKg: 20,
    myRole: role,
    myStartsAt: window?.startsAt.toISOString() ?? null,
    myEndsAt: window?.endsAt.toISOString() ?? null,
    hiveCount: 6,
    createdAt: new Date().toISOString(),
    updatedAt: new Date().toISOString(),
  };
}

function show(a: ApiaryDto) {
  renderRouter({ index: () => <ApiaryPeopleLinks apiary={a} /> }, { initialUrl: '/' });
}

describe('ApiaryPeopleLinks', () => {
  it.each<[Role, boolean, boolean]>([
    ['owner', true, true],
    ['keeper', true, true],
    ['sitter', true, false],
    ['viewer', false, false],
  ])('%s: handover %s, people %s', (role, handover, people) => {
    const now = Date.now();
    show(apiary(role, role === 'sitter' ? { startsAt: new Date(now - 3 * DAY), endsAt: new Date(now + 11 * DAY) } : undefined));
    expect(screen.queryByTestId('open-handover') !== null).toBe(handover);
    expect(screen.queryByTestId('open-members') !== null).toBe(people);
  });

  it('offers a sitter nothing once her window has ended', () => {
    const now = Date.now();
    show(apiary('sitter', { startsAt: new Date(now - 20 * DAY), endsAt: new Date(now - DAY) }));
    expect(screen.queryByTestId('open-handover')).toBeNull();
  });
});
