// @vitest-environment jsdom
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { callsTo, listReply, makeUser, renderApp, stubFetch } from './support';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const signedOut = { status: 401, body: { error: { code: 'unauthenticated', message: 'Sign in first.' } } };
const TOKEN = 'tok_4f1a9b2c';
const info = {
  email: 'ruth@saltmarsh.example',
  name: 'Ruth Halvorsen',
  organisation: 'Saltmarsh Utilities',
  expiresAt: '2030-03-08T09:00:00.000Z',
};

describe('invitation link', () => {
  it('when the chosen password is too short, then the limit is named and nothing is sent', async () => {
    const fetchMock = stubFetch((url) => {
      if (url.pathname === '/api/me') return signedOut;
      if (url.pathname === `/api/invites/${TOKEN}`) return { status: 200, body: info };
    });
    renderApp(`/invite/${TOKEN}`);
    const user = userEvent.setup();

    expect(await screen.findByRole('heading', { name: 'Welcome, Ruth Halvorsen' })).toBeTruthy();
    expect(screen.getByText('ruth@saltmarsh.example')).toBeTruthy();
    await user.type(screen.getByLabelText('New password'), 'short');
    await user.type(screen.getByLabelText('The same password again'), 'short');
    await user.click(screen.getByRole('button', { name: 'Set password and sign in' }));

    expect(await screen.findByText('Password must be at least 10 characters')).toBeTruthy();
    expect(screen.getByLabelText('New password').getAttribute('aria-invalid')).toBe('true');
    const posts = fetchMock.mock.calls.filter(([, init]) => init?.method === 'POST');
    expect(posts).toEqual([]);
  });

  it('when the link has expired (410), then the page says the link expired and who can send a new one', async () => {
    stubFetch((url) => {
      if (url.pathname === '/api/me') return signedOut;
      if (url.pathname === `/api/invites/${TOKEN}`) {
        return {
          status: 410,
          body: { error: { code: 'invite_expired', message: 'This invitation has expired.' } },
        };
      }
    });
    renderApp(`/invite/${TOKEN}`);

    expect(await screen.findByRole('heading', { name: 'This link expired' })).toBeTruthy();
    expect(screen.getByText(/Ask the desk administrator who invited you to send a new link/)).toBeTruthy();
    expect(screen.queryByLabelText('New password')).toBeNull();
  });

  it('when the link is unknown (404), then the page says it is not valid', async () => {
    stubFetch((url) => {
      if (url.pathname === '/api/me') return signedOut;
      if (url.pathname === `/api/invites/${TOKEN}`) {
        return { status: 404, body: { error: { code: 'not_found', message: 'No such invitation.' } } };
      }
    });
    renderApp(`/invite/${TOKEN}`);
    expect(await screen.findByRole('heading', { name: 'This invitation link is not valid' })).toBeTruthy();
  });

  it('when a good password is set, then the person is signed in and lands on their own desk', async () => {
    let signedIn = false;
    const fetchMock = stubFetch((url, init) => {
      if (url.pathname === '/api/me')
        return signedIn ? { status: 200, body: { user: makeUser('engineer') } } : signedOut;
      if (url.pathname === `/api/invites/${TOKEN}` && init?.method === 'POST') {
        signedIn = true;
        return { status: 200, body: { user: makeUser('engineer') } };
      }
      if (url.pathname === `/api/invites/${TOKEN}`) return { status: 200, body: info };
      if (url.pathname === '/api/packages') return listReply([]);
    });
    const { router } = renderApp(`/invite/${TOKEN}`);
    const user = userEvent.setup();

    await user.type(await screen.findByLabelText('New password'), 'cranes on the quay');
    await user.type(screen.getByLabelText('The same password again'), 'cranes on the quay');
    await user.click(screen.getByRole('button', { name: 'Set password and sign in' }));

    await waitFor(() => expect(router.state.location.pathname).toBe('/assigned'));
    expect(callsTo(fetchMock, `/api/invites/${TOKEN}`)).toHaveLength(2);
    const post = fetchMock.mock.calls.find(([, init]) => init?.method === 'POST')!;
    expect(JSON.parse(String(post[1]!.body))).toEqual({ password: 'cranes on the quay' });
  });
});
