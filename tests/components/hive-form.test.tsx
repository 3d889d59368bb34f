import { QueryClientProvider } from '@tanstack/react-query';
import { Slot } from 'expo-router';
import { fireEvent, renderRouter, screen, waitFor } from 'expo-router/testing-library';
import { Text } from 'react-native';
import type { ApiaryDto } from '@/shared/schemas/apiaries';
import type { HiveDto } from '@/shared/schemas/hives';
import { createQueryClient } from '@/components/api/query-client';
import { HiveCreateScreen } from '@/components/hives/hive-create-screen';
import { HiveEditScreen } from '@/components/hives/hive-edit-screen';

const APIARY_ID = '0b7f6a0e-4a43-4c55-9a53-1d1c7f1e2a01';
const HIVE_ID = '5c1f2b3d-8e9a-4b7c-a1d2-3e4f5a6b7c8d';

const apiary: ApiaryDto = {
  id: APIARY_ID,
  name: 'Orchard Row',
  hemisphere: 'north',
  climateNote: '',
  winterStoresTargetKg: 20,
  myRole: 'keeper',
  myStartsAt: null,
  myEndsAt: null,
  hiveCount: 1,
  createdAt: '2026-04-01T08:00:00.000Z',
  updatedAt: '2026-04-01T08:00:00.000Z',
};

const hive: HiveDto = {
  id: HIVE_ID,
  apiaryId: APIARY_ID,
  apiaryName: 'Orchard Row',
  name: 'Orchard 1',
  boxes: [{ size: 'deep', frames: 10 }],
  status: 'active',
  note: '',
  queen: { id: 'q1', origin: 'bought-mated', year: 2025, markColour: 'blue', clipped: false, status: 'present' },
  version: 3,
  createdAt: '2026-04-01T08:00:00.000Z',
  updatedAt: '2026-04-01T08:00:00.000Z',
};

type Answer = { status: number; body?: unknown };
function mockFetch(answers: Record<string, Answer>) {
  const fn = jest.fn(async (input: string | URL | Request, init?: RequestInit) => {
    const url = typeof input === 'string' ? input : input instanceof URL ? input.href : input.url;
    const key = `${init?.method ?? 'GET'} ${new URL(url, 'http://frameside.test').pathname}`;
    const a = answers[key] ?? { status: 404, body: { error: { code: 'not_found', message: `No answer for ${key}` } } };
    return new Response(a.body === undefined ? null : JSON.stringify(a.body), { status: a.status, headers: { 'Content-Type': 'application/json' } });
  });
  global.fetch = fn as unknown as typeof fetch;
  return fn;
}
const realFetch = global.fetch;
afterEach(() => {
  global.fetch = realFetch;
});

function renderAt(url: string) {
  const client = createQueryClient();
  return renderRouter(
    {
      _layout: () => (
        <QueryClientProvider client={client}>
          <Slot />
        </QueryClientProvider>
      ),
      'apiaries/[apiaryId]/hives/new': HiveCreateScreen,
      'hives/[hiveId]/edit': HiveEditScreen,
      'hives/[hiveId]/index': () => <Text>Hive page</Text>,
      'apiaries/[apiaryId]/index': () => <Text>Apiary page</Text>,
    },
    { initialUrl: url },
  );
}

const bodyOf = (call: unknown[]) => JSON.parse(String((call[1] as RequestInit).body));

describe('Hive form', () => {
  it('builds the boxes with chips and steppers and sends them in the create request', async () => {
    const fetchMock = mockFetch({
      [`GET /api/apiaries/${APIARY_ID}`]: { status: 200, body: { apiary } },
      [`POST /api/apiaries/${APIARY_ID}/hives`]: { status: 201, body: { hive: { ...hive, id: 'new-hive' } } },
    });
    renderAt(`/apiaries/${APIARY_ID}/hives/new`);

    fireEvent.changeText(await screen.findByTestId('hive-name'), 'Orchard 7');
    fireEvent.press(screen.getByTestId('stepper-box-0-frames-dec'));
    fireEvent.press(screen.getByTestId('stepper-box-0-frames-dec'));
    fireEvent.press(screen.getByTestId('add-box'));
    fireEvent.press(screen.getByTestId('chips-box-1-size-shallow'));
    fireEvent.press(screen.getByTestId('add-box'));
    fireEvent.press(screen.getByTestId('remove-box-2'));
    expect(screen.queryByTestId('stepper-box-2-frames')).toBeNull();
    fireEvent.press(screen.getByTestId('chips-queen-recorded-no'));
    fireEvent.press(screen.getByTestId('hive-save'));

    expect(await screen.findByText('Hive page')).toBeOnTheScreen();
    const post = fetchMock.mock.calls.find((c) => (c[1] as RequestInit | undefined)?.method === 'POST')!;
    expect(bodyOf(post)).toEqual({
      name: 'Orchard 7',
      boxes: [
        { size: 'deep', frames: 8 },
        { size: 'shallow', frames: 8 },
      ],
      status: 'active',
      note: '',
      queen: null,
    });
  });

  it('shows the name error only once the form is submitted, and sends nothing', async () => {
    const fetchMock = mockFetch({ [`GET /api/apiaries/${APIARY_ID}`]: { status: 200, body: { apiary } } });
    renderAt(`/apiaries/${APIARY_ID}/hives/new`);
    await screen.findByTestId('hive-name');
    expect(screen.queryByTestId('hive-name-error')).toBeNull();
    fireEvent.press(screen.getByTestId('hive-save'));
    expect(await screen.findByTestId('hive-name-error')).toHaveTextContent('The hive name is required.');
    expect(fetchMock.mock.calls.filter((c) => (c[1] as RequestInit | undefined)?.method === 'POST')).toHaveLength(0);
  });

  it('on a stale edit (409) says so and reloads the form with the current version', async () => {
    const current: HiveDto = { ...hive, name: 'Orchard One', boxes: [{ size: 'deep', frames: 10 }, { size: 'medium', frames: 10 }], version: 4 };
    const fetchMock = mockFetch({
      [`GET /api/hives/${HIVE_ID}`]: { status: 200, body: { hive } },
      [`GET /api/apiaries/${APIARY_ID}`]: { status: 200, body: { apiary } },
      [`PATCH /api/hives/${HIVE_ID}`]: {
        status: 409,
        body: { error: { code: 'stale', message: 'This hive was changed by someone else.' }, current },
      },
    });
    renderAt(`/hives/${HIVE_ID}/edit`);

    expect(await screen.findByDisplayValue('Orchard 1')).toBeOnTheScreen();
    fireEvent.press(screen.getByTestId('stepper-box-0-frames-inc'));
    fireEvent.press(screen.getByTestId('hive-save'));

    expect(await screen.findByTestId('hive-conflict')).toHaveTextContent(/Someone else changed this hive — here is the current version/);
    const patch = fetchMock.mock.calls.find((c) => (c[1] as RequestInit | undefined)?.method === 'PATCH')!;
    expect(bodyOf(patch)).toMatchObject({ version: 3, boxes: [{ size: 'deep', frames: 11 }] });
    // The form now shows the other keeper's version: their name, their second box.
    await waitFor(() => expect(screen.getByTestId('hive-name')).toHaveDisplayValue('Orchard One'));
    expect(screen.getByTestId('stepper-box-1-frames')).toBeOnTheScreen();
    expect(screen.getByTestId('stepper-box-0-frames-value')).toHaveTextContent('10');
  });
});
