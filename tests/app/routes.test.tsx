import { renderRouter, screen, waitFor } from 'expo-router/testing-library';
import { fireEvent } from '@testing-library/react-native';

// The first render transforms the whole router; on a cold cache that alone can take many seconds.
jest.setTimeout(60_000);

type Answer = { status: number; body: unknown };

/** Stands in for the server: answers /api paths from a table and records what was asked. */
function fakeServer(answers: Record<string, Answer>) {
  const calls: { url: string; method: string; body?: unknown }[] = [];
  global.fetch = jest.fn(async (url: string, init?: { method?: string; body?: string }) => {
    calls.push({ url, method: init?.method ?? 'GET', body: init?.body ? JSON.parse(init.body) : undefined });
    const answer = answers[`${init?.method ?? 'GET'} ${url}`] ?? { status: 404, body: { error: { code: 'not_found', message: 'No.' } } };
    return { ok: answer.status < 400, status: answer.status, text: async () => JSON.stringify(answer.body) } as Response;
  }) as unknown as typeof fetch;
  return calls;
}

// Signed out is a state the session probe answers with 200, not an error.
const signedOut = { 'GET /api/me/session': { status: 200, body: { signedIn: false } } };
const me = {
  user: { id: 1, email: 'designer@brassmoth.test', name: 'Dario Moth' },
  team: { id: 1, name: 'Brassmoth Interactive' },
  role: 'designer',
  permissions: ['me.read', 'team.read'],
  teams: [{ id: 1, name: 'Brassmoth Interactive', role: 'designer' }],
};

describe('routes', () => {
  it('sends a signed-out visitor of /characters to sign-in', async () => {
    fakeServer(signedOut);
    const router = renderRouter('./app', { initialUrl: '/characters' });
    await waitFor(() => expect(router.getPathname()).toBe('/sign-in'));
    expect(await screen.findByText('Sign in to your studio')).toBeTruthy();
  });

  it('shows the schema field messages before asking the server', async () => {
    const calls = fakeServer(signedOut);
    renderRouter('./app', { initialUrl: '/sign-in' });
    fireEvent.press(await screen.findByRole('button', { name: 'Sign in' }));
    expect(await screen.findByText('Enter your e-mail address.')).toBeTruthy();
    expect(screen.getByText('Enter your password.')).toBeTruthy();
    expect(calls.filter((c) => c.url.includes('/auth/'))).toHaveLength(0);
  });

  it('opens a deep link inside the studio shell for a signed-in member', async () => {
    fakeServer({ 'GET /api/me/session': { status: 200, body: { signedIn: true, me } } });
    renderRouter('./app', { initialUrl: '/courses' });
    expect(await screen.findByText('Brassmoth Interactive')).toBeTruthy();
    expect(screen.getByText('Dario Moth · Designer')).toBeTruthy();
    expect(screen.getByRole('heading', { name: 'Courses' })).toBeTruthy();
  });
});
