import { QueryClientProvider } from '@tanstack/react-query';
import { Slot } from 'expo-router';
import { fireEvent, renderRouter, screen, waitFor } from 'expo-router/testing-library';
import { Text } from 'react-native';
import { createQueryClient } from '@/components/api/query-client';
import { SignInScreen, safeNext } from '@/components/auth/sign-in-screen';

/** A stand-in for fetch: answers by path, records what was sent. */
type Answer = { status: number; body?: unknown };
function mockFetch(answers: Record<string, Answer>) {
  const fn = jest.fn(async (input: string | URL | Request, init?: RequestInit) => {
    const url = typeof input === 'string' ? input : input instanceof URL ? input.href : input.url;
    const path = new URL(url, 'http://frameside.test').pathname;
    const answer = answers[`${init?.method ?? 'GET'} ${path}`] ?? { status: 404, body: { error: { code: 'not_found', message: 'Not found.' } } };
    return new Response(answer.body === undefined ? null : JSON.stringify(answer.body), {
      status: answer.status,
      headers: { 'Content-Type': 'application/json' },
    });
  });
  global.fetch = fn as unknown as typeof fetch;
  return fn;
}

const realFetch = global.fetch;
afterEach(() => {
  global.fetch = realFetch;
});

function renderSignIn(initialUrl = '/sign-in') {
  const client = createQueryClient();
  return renderRouter(
    {
      _layout: () => (
        <QueryClientProvider client={client}>
          <Slot />
        </QueryClientProvider>
      ),
      'sign-in': SignInScreen,
      'sign-up': () => <Text>Sign-up page</Text>,
      index: () => <Text>Due list</Text>,
      'hives/[hiveId]': () => <Text>Hive page</Text>,
    },
    { initialUrl },
  );
}

describe('Sign-in form', () => {
  it('shows no field error before a field is touched, and the field’s error once it is left', async () => {
    mockFetch({});
    renderSignIn();
    expect(screen.queryByTestId('sign-in-email-error')).toBeNull();
    expect(screen.queryByTestId('sign-in-password-error')).toBeNull();

    fireEvent.changeText(screen.getByTestId('sign-in-email'), 'ana@');
    // Typing alone does not scold: the e-mail field is not yet left.
    await waitFor(() => expect(screen.queryByTestId('sign-in-email-error')).toBeNull());
    fireEvent(screen.getByTestId('sign-in-email'), 'blur');
    expect(await screen.findByTestId('sign-in-email-error')).toHaveTextContent('That does not look like an e-mail address.');
    // The password was never reached: still no error there.
    expect(screen.queryByTestId('sign-in-password-error')).toBeNull();
  });

  it('shows every field error after a submit with empty fields, without calling the server', async () => {
    const fetchMock = mockFetch({});
    renderSignIn();
    fireEvent.press(screen.getByTestId('sign-in-submit'));
    expect(await screen.findByTestId('sign-in-password-error')).toHaveTextContent('Enter your password.');
    expect(screen.getByTestId('sign-in-email-error')).toBeOnTheScreen();
    expect(fetchMock).not.toHaveBeenCalled();
  });

  it('shows the server’s message when the e-mail or password is wrong (401)', async () => {
    const fetchMock = mockFetch({
      'POST /api/auth/sign-in': {
        status: 401,
        body: { error: { code: 'invalid_credentials', message: 'That e-mail and password do not match an account.' } },
      },
    });
    renderSignIn();
    fireEvent.changeText(screen.getByTestId('sign-in-email'), '  Ana@Example.org ');
    fireEvent.changeText(screen.getByTestId('sign-in-password'), 'not the password');
    fireEvent.press(screen.getByTestId('sign-in-submit'));

    expect(await screen.findByTestId('sign-in-error')).toHaveTextContent('That e-mail and password do not match an account.');
    const [, init] = fetchMock.mock.calls[0];
    expect(init?.credentials).toBe('include');
    // The body is what the shared schema makes of the input: trimmed, lower-cased.
    expect(JSON.parse(String(init?.body))).toEqual({ email: 'ana@example.org', password: 'not the password' });
  });

  it('goes to the Due list once signed in', async () => {
    mockFetch({
      'POST /api/auth/sign-in': { status: 200, body: { user: { id: 'u1', email: 'ana@example.org', name: 'Ana' } } },
      'GET /api/me': { status: 200, body: { user: { id: 'u1', email: 'ana@example.org', name: 'Ana' }, memberships: [] } },
    });
    const view = renderSignIn();
    fireEvent.changeText(screen.getByTestId('sign-in-email'), 'ana@example.org');
    fireEvent.changeText(screen.getByTestId('sign-in-password'), 'correct horse battery');
    fireEvent.press(screen.getByTestId('sign-in-submit'));
    expect(await screen.findByText('Due list')).toBeOnTheScreen();
    expect(view.getPathname()).toBe('/');
  });

  it('returns to the page the keeper was sent away from', async () => {
    mockFetch({
      'POST /api/auth/sign-in': { status: 200, body: { user: { id: 'u1', email: 'ana@example.org', name: 'Ana' } } },
      'GET /api/me': { status: 200, body: { user: { id: 'u1', email: 'ana@example.org', name: 'Ana' }, memberships: [] } },
    });
    const view = renderSignIn('/sign-in?next=%2Fhives%2Fh-42');
    fireEvent.changeText(screen.getByTestId('sign-in-email'), 'ana@example.org');
    fireEvent.changeText(screen.getByTestId('sign-in-password'), 'correct horse battery');
    fireEvent.press(screen.getByTestId('sign-in-submit'));
    expect(await screen.findByText('Hive page')).toBeOnTheScreen();
    expect(view.getPathname()).toBe('/hives/h-42');
  });
});

describe('safeNext', () => {
  it.each([
    [undefined, '/'],
    ['/hives/h-42', '/hives/h-42'],
    ['//evil.example/x', '/'],
    ['https://evil.example', '/'],
    ['/\\evil.example', '/'],
    [['/apiaries', '/tools'], '/apiaries'],
  ])('%p → %p', (next, expected) => {
    expect(safeNext(next)).toBe(expected);
  });
});
