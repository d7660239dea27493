// @vitest-environment jsdom
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import type { UnitSystem } from '@shared/schemas/common';
import { callsTo, makeUser, renderApp, stubFetch } from './support';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

function profileDesk(onPassword?: () => { status: number; body?: unknown }) {
  let unitSystem: UnitSystem = 'metric';
  const fetchMock = stubFetch((url, init) => {
    if (url.pathname === '/api/me')
      return { status: 200, body: { user: makeUser('engineer', { unitSystem }) } };
    if (url.pathname === '/api/me/profile' && init?.method === 'PATCH') {
      const body = JSON.parse(String(init.body)) as { unitSystem?: UnitSystem };
      if (body.unitSystem) unitSystem = body.unitSystem;
    }
    if (url.pathname === '/api/me/profile') {
      return {
        status: 200,
        body: { name: 'Ruth Halvorsen', email: 'ruth@saltmarsh.example', unitSystem, notifyReminders: true },
      };
    }
    if (url.pathname === '/api/me/password' && onPassword) return onPassword();
  });
  return fetchMock;
}

const calls = (fetchMock: ReturnType<typeof stubFetch>, pathname: string, method: string) =>
  fetchMock.mock.calls.filter(
    ([input, init]) =>
      new URL(String(input), 'http://localhost').pathname === pathname && (init?.method ?? 'GET') === method,
  );

describe('profile', () => {
  it('when the unit system is changed, then only that is PATCHed and /api/me is fetched again', async () => {
    const fetchMock = profileDesk();
    const { queryClient } = renderApp('/profile');
    const user = userEvent.setup();

    await user.click(await screen.findByRole('radio', { name: /US customary/ }));
    const meCallsBefore = callsTo(fetchMock, '/api/me').length;
    await user.click(screen.getByRole('button', { name: 'Save settings' }));

    await waitFor(() => expect(calls(fetchMock, '/api/me/profile', 'PATCH')).toHaveLength(1));
    expect(JSON.parse(String(calls(fetchMock, '/api/me/profile', 'PATCH')[0]![1]!.body))).toEqual({
      unitSystem: 'imperial',
    });
    await waitFor(() => expect(callsTo(fetchMock, '/api/me').length).toBeGreaterThan(meCallsBefore));
    await waitFor(() =>
      expect(queryClient.getQueryData<{ unitSystem: string }>(['auth', 'me'])?.unitSystem).toBe('imperial'),
    );
    expect(await screen.findByText('Saved.')).toBeTruthy();
  });

  it('when the page opens, then it says reminders can be turned off and hand-off messages cannot', async () => {
    profileDesk();
    renderApp('/profile');
    expect(await screen.findByRole('checkbox', { name: /Daily reminder/ })).toHaveProperty('checked', true);
    expect(screen.getByText(/always go out and cannot be turned off/)).toBeTruthy();
  });

  it('when the current password is wrong, then the message is shown under that field', async () => {
    const fetchMock = profileDesk(() => ({
      status: 400,
      body: { error: { code: 'wrong_password', message: 'The current password is not correct.' } },
    }));
    renderApp('/profile');
    const user = userEvent.setup();

    await user.type(await screen.findByLabelText('Current password'), 'guess-guess');
    await user.type(screen.getByLabelText('New password'), 'a much longer sentence');
    await user.type(screen.getByLabelText('New password again'), 'a much longer sentence');
    await user.click(screen.getByRole('button', { name: 'Change password' }));

    expect(await screen.findByText('The current password is not correct.')).toBeTruthy();
    expect(screen.getByLabelText('Current password').getAttribute('aria-invalid')).toBe('true');
    expect(JSON.parse(String(calls(fetchMock, '/api/me/password', 'POST')[0]![1]!.body))).toEqual({
      currentPassword: 'guess-guess',
      newPassword: 'a much longer sentence',
    });
  });

  it('when the new password is too short, then the limit is named and nothing is sent', async () => {
    const fetchMock = profileDesk(() => ({ status: 204 }));
    renderApp('/profile');
    const user = userEvent.setup();

    await user.type(await screen.findByLabelText('Current password'), 'old-password-here');
    await user.type(screen.getByLabelText('New password'), 'short');
    await user.type(screen.getByLabelText('New password again'), 'short');
    await user.click(screen.getByRole('button', { name: 'Change password' }));

    expect(await screen.findByText('New password must be at least 10 characters')).toBeTruthy();
    expect(calls(fetchMock, '/api/me/password', 'POST')).toEqual([]);
  });
});
