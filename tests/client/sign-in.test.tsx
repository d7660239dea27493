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

describe('sign-in page', () => {
  it('when the form is sent empty, then each field shows its rule and nothing is posted', async () => {
    const fetchMock = stubFetch((url) => (url.pathname === '/api/me' ? signedOut : undefined));
    renderApp('/sign-in');
    const user = userEvent.setup();

    await user.click(await screen.findByRole('button', { name: 'Sign in' }));

    expect(await screen.findByText('Email must be a valid e-mail address')).toBeTruthy();
    expect(screen.getByText('Password is required')).toBeTruthy();
    expect(screen.getByLabelText('Work e-mail').getAttribute('aria-invalid')).toBe('true');
    expect(callsTo(fetchMock, '/api/auth/sign-in')).toEqual([]);
  });

  it('when the server refuses the credentials, then its one generic message is shown', async () => {
    const fetchMock = stubFetch((url) => {
      if (url.pathname === '/api/me') return signedOut;
      if (url.pathname === '/api/auth/sign-in') {
        return {
          status: 401,
          body: { error: { code: 'invalid_credentials', message: 'Email or password is incorrect.' } },
        };
      }
    });
    renderApp('/sign-in');
    const user = userEvent.setup();

    await user.type(await screen.findByLabelText('Work e-mail'), 'planner@fenwick.example');
    await user.type(screen.getByLabelText('Password'), 'not-the-password');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    expect((await screen.findByRole('alert')).textContent).toBe('Email or password is incorrect.');
    const [, init] = fetchMock.mock.calls.find(([input]) => String(input).endsWith('/api/auth/sign-in'))!;
    expect(init?.method).toBe('POST');
    expect(init?.credentials).toBe('include');
    expect(JSON.parse(String(init?.body))).toEqual({
      email: 'planner@fenwick.example',
      password: 'not-the-password',
    });
  });

  it('when the server names a field in a 400, then the message appears under that field', async () => {
    stubFetch((url) => {
      if (url.pathname === '/api/me') return signedOut;
      if (url.pathname === '/api/auth/sign-in') {
        return {
          status: 400,
          body: {
            error: {
              code: 'validation_failed',
              message: 'The request has errors.',
              fields: [{ path: 'email', message: 'email is not on an allowed domain' }],
            },
          },
        };
      }
    });
    renderApp('/sign-in');
    const user = userEvent.setup();

    await user.type(await screen.findByLabelText('Work e-mail'), 'someone@elsewhere.example');
    await user.type(screen.getByLabelText('Password'), 'x');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByText('email is not on an allowed domain')).toBeTruthy();
    expect(screen.queryByRole('alert')).toBeNull();
  });

  it('when a reviewer signs in, then they land on the site queue', async () => {
    let signedIn = false;
    stubFetch((url) => {
      if (url.pathname === '/api/me')
        return signedIn ? { status: 200, body: { user: makeUser('reviewer') } } : signedOut;
      if (url.pathname === '/api/auth/sign-in') {
        signedIn = true;
        return { status: 200, body: { user: makeUser('reviewer') } };
      }
      if (url.pathname === '/api/packages') return listReply([]);
    });
    const { router } = renderApp('/sign-in');
    const user = userEvent.setup();

    await user.type(await screen.findByLabelText('Work e-mail'), 'coordinator@saltmarsh.example');
    await user.type(screen.getByLabelText('Password'), 'correct horse');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByRole('heading', { level: 1, name: 'Site queue' })).toBeTruthy();
    expect(router.state.location.pathname).toBe('/queue');
  });

  it('when sign-in came from a deep link, then the person returns to that page', async () => {
    stubFetch((url) => {
      if (url.pathname === '/api/me') return signedOut;
      if (url.pathname === '/api/auth/sign-in') return { status: 200, body: { user: makeUser('reviewer') } };
      if (url.pathname === '/api/packages') return listReply([]);
    });
    const { router } = renderApp('/sign-in?next=%2Fqueue%3Fstatus%3Ddecided');
    const user = userEvent.setup();

    await user.type(await screen.findByLabelText('Work e-mail'), 'coordinator@saltmarsh.example');
    await user.type(screen.getByLabelText('Password'), 'correct horse');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    await waitFor(() => expect(router.state.location.pathname).toBe('/queue'));
    expect(router.state.location.search).toBe('?status=decided');
  });

  it('when the sign-in page opens, then the caution about the chart, a qualified person and local codes is shown', async () => {
    stubFetch((url) => (url.pathname === '/api/me' ? signedOut : undefined));
    renderApp('/sign-in');
    const footer = await screen.findByRole('contentinfo');
    expect(footer.textContent).toMatch(/manufacturer's load chart/);
    expect(footer.textContent).toMatch(/qualified person/);
    expect(footer.textContent).toMatch(/local codes and regulations/);
  });
});
