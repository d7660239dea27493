// @vitest-environment jsdom
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import type { Role } from '@shared/schemas/common';
import { callsTo, listReply, makeUser, renderApp, stubFetch } from './support';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const signedOut = { status: 401, body: { error: { code: 'unauthenticated', message: 'Sign in first.' } } };

function signedInAs(role: Role) {
  return stubFetch((url) => {
    if (url.pathname === '/api/me') return { status: 200, body: { user: makeUser(role) } };
    if (url.pathname === '/api/packages') return listReply([]);
    if (url.pathname === '/api/health')
      return { status: 200, body: { status: 'ok', database: { ok: true }, queue: { ok: true } } };
    if (url.pathname === '/api/auth/sign-out') return { status: 204 };
  });
}

describe('route guard', () => {
  it('when /api/me answers 401, then a desk page sends the person to sign-in with the page to come back to', async () => {
    const fetchMock = stubFetch((url) => (url.pathname === '/api/me' ? signedOut : undefined));
    const { router } = renderApp('/queue?status=decided');

    expect(await screen.findByRole('heading', { name: 'Sign in to Counterpoise' })).toBeTruthy();
    expect(router.state.location.pathname).toBe('/sign-in');
    expect(new URLSearchParams(router.state.location.search).get('next')).toBe('/queue?status=decided');
    expect(callsTo(fetchMock, '/api/packages')).toEqual([]);
  });

  it('when a list request answers 401 mid-session, then the person is sent to sign-in', async () => {
    stubFetch((url) => {
      if (url.pathname === '/api/me') return { status: 200, body: { user: makeUser('reviewer') } };
      if (url.pathname === '/api/packages')
        return { status: 401, body: { error: { code: 'token_expired', message: 'Sign in again.' } } };
    });
    const { router } = renderApp('/queue');

    await waitFor(() => expect(router.state.location.pathname).toBe('/sign-in'));
    expect(new URLSearchParams(router.state.location.search).get('next')).toBe('/queue');
  });

  it('when a contractor opens the site queue, then they are sent to their own desk', async () => {
    signedInAs('contractor');
    const { router } = renderApp('/queue');

    expect(await screen.findByRole('heading', { level: 1, name: 'Lift packages' })).toBeTruthy();
    expect(router.state.location.pathname).toBe('/packages');
  });

  it.each([
    ['contractor', '/packages'],
    ['reviewer', '/queue'],
    ['engineer', '/assigned'],
    ['admin', '/admin'],
  ] as const)('when a %s opens /, then they land on %s', async (role, home) => {
    signedInAs(role);
    const { router } = renderApp('/');
    await waitFor(() => expect(router.state.location.pathname).toBe(home));
  });

  it('when the path is unknown, then the not-found page says so and offers the way back', async () => {
    stubFetch(() => undefined);
    renderApp('/no/such/page');
    expect(await screen.findByRole('heading', { name: 'There is no page here' })).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Go to your desk' }).getAttribute('href')).toBe('/');
  });
});

describe('role navigation', () => {
  it.each([
    ['contractor', ['Lift packages', 'Fleet library', 'Profile']],
    ['reviewer', ['Site queue', 'Profile']],
    ['engineer', ['Assigned to me', 'Profile']],
    [
      'admin',
      [
        'Site queue',
        'Desk administration',
        'Organisations',
        'Sites and policies',
        'People',
        'Mail outbox',
        'Profile',
      ],
    ],
  ] as const)('when a %s is signed in, then the navigation shows only %j', async (role, expected) => {
    signedInAs(role);
    renderApp('/');
    const nav = await screen.findByRole('navigation', { name: 'Main' });
    const labels = within(nav)
      .getAllByRole('link')
      .map((link) => link.textContent);
    expect(labels).toEqual([...expected]);
  });

  it('when signed in, then the person, their role and organisation are shown with the caution', async () => {
    signedInAs('engineer');
    renderApp('/assigned');
    const block = await screen.findByRole('region', { name: 'Signed in' });
    expect(within(block).getByText('Ruth Halvorsen')).toBeTruthy();
    expect(within(block).getByText('Engineer of record')).toBeTruthy();
    expect(within(block).getByText('Saltmarsh Utilities')).toBeTruthy();
    expect(screen.getByRole('contentinfo').textContent).toMatch(
      /do not replace the crane manufacturer's load chart/,
    );
  });

  it('when sign out is pressed, then the session is ended on the server and the sign-in page shows', async () => {
    let signedIn = true;
    const fetchMock = stubFetch((url) => {
      if (url.pathname === '/api/me')
        return signedIn ? { status: 200, body: { user: makeUser('reviewer') } } : signedOut;
      if (url.pathname === '/api/packages') return listReply([]);
      if (url.pathname === '/api/auth/sign-out') {
        signedIn = false;
        return { status: 204 };
      }
    });
    const { router } = renderApp('/queue');
    const user = userEvent.setup();

    await user.click(await screen.findByRole('button', { name: 'Sign out' }));

    expect(await screen.findByRole('heading', { name: 'Sign in to Counterpoise' })).toBeTruthy();
    expect(router.state.location.pathname).toBe('/sign-in');
    expect(callsTo(fetchMock, '/api/auth/sign-out')).toEqual(['/api/auth/sign-out']);
  });
});
