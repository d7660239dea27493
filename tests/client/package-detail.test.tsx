// @vitest-environment jsdom
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, screen, within } from '@testing-library/react';
import { callsTo, makePackage, makeUser, renderApp, stubFetch } from './support';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

describe('package page', () => {
  it('when a package opens, then its reference, lift, status and planned date are shown', async () => {
    const pkg = makePackage(7, {
      title: 'Boiler drum set',
      status: 'with_engineer',
      engineer: { id: makePackage(9).id, name: 'Ruth Halvorsen' },
    });
    const fetchMock = stubFetch((url) => {
      if (url.pathname === '/api/me') return { status: 200, body: { user: makeUser('engineer') } };
      if (url.pathname === `/api/packages/${pkg.id}`)
        return { status: 200, body: { package: pkg, revisions: [], latestResults: null } };
    });
    renderApp(`/packages/${pkg.id}`);

    expect(await screen.findByRole('heading', { level: 1, name: 'Boiler drum set' })).toBeTruthy();
    const summary = screen.getByRole('region', { name: 'Package summary' });
    expect(within(summary).getByText(pkg.reference)).toBeTruthy();
    expect(within(summary).getByText('With engineer')).toBeTruthy();
    expect(within(summary).getByText('14 Mar 2030')).toBeTruthy();
    expect(within(summary).getByText('Ruth Halvorsen')).toBeTruthy();
    expect(callsTo(fetchMock, `/api/packages/${pkg.id}`)).toHaveLength(1);
  });

  it("when the server answers 404, then the page says the package is not in this person's list", async () => {
    stubFetch((url) => {
      if (url.pathname === '/api/me') return { status: 200, body: { user: makeUser('contractor') } };
      if (url.pathname.startsWith('/api/packages/'))
        return { status: 404, body: { error: { code: 'not_found', message: 'Package not found.' } } };
    });
    renderApp(`/packages/${makePackage(3).id}`);

    const alert = await screen.findByRole('alert');
    expect(within(alert).getByText('No such package in your list')).toBeTruthy();
    expect(within(alert).getByRole('link', { name: 'Back to your list' }).getAttribute('href')).toBe(
      '/packages',
    );
  });
});
