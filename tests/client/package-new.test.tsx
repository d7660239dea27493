// @vitest-environment jsdom
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { makeUser, renderApp, stubFetch } from './support';
import { makeDetail } from './package-fixtures';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

describe('new lift package', () => {
  it('when the title, site and date are given, then the package is created and the editor opens', async () => {
    const detail = makeDetail({ pkg: { title: 'Set transformer T2' } });
    const site = { id: detail.package.site.id, name: 'North Yard', code: 'NY', owner: 'Saltmarsh Utilities' };
    const fetchMock = stubFetch((url, init) => {
      if (url.pathname === '/api/me') return { status: 200, body: { user: makeUser('contractor') } };
      if (url.pathname === '/api/sites') return { status: 200, body: { items: [site] } };
      if (url.pathname === '/api/packages' && init?.method === 'POST') return { status: 201, body: detail };
      if (url.pathname === `/api/packages/${detail.package.id}`) return { status: 200, body: detail };
    });
    const { router } = renderApp('/packages/new');
    const user = userEvent.setup();

    await user.type(await screen.findByLabelText('Lift title', {}, { timeout: 8000 }), 'Set transformer T2');
    await user.selectOptions(screen.getByLabelText('Site'), site.id);
    await user.type(screen.getByLabelText(/Planned lift date/), '2030-03-14');
    await user.click(screen.getByRole('button', { name: 'Create and enter the lift data' }));

    await waitFor(() => expect(router.state.location.pathname).toBe(`/packages/${detail.package.id}/edit`));
    const post = fetchMock.mock.calls.find(([, init]) => init?.method === 'POST');
    expect(JSON.parse(String(post?.[1]?.body))).toEqual({
      title: 'Set transformer T2',
      siteId: site.id,
      plannedLiftDate: '2030-03-14',
    });
  });

  it('when the title is too short, then the form says the limit and nothing is sent', async () => {
    const fetchMock = stubFetch((url) => {
      if (url.pathname === '/api/me') return { status: 200, body: { user: makeUser('contractor') } };
      if (url.pathname === '/api/sites') return { status: 200, body: { items: [] } };
    });
    renderApp('/packages/new');
    const user = userEvent.setup();

    await user.type(await screen.findByLabelText('Lift title', {}, { timeout: 8000 }), 'ab');
    await user.click(screen.getByRole('button', { name: 'Create and enter the lift data' }));

    expect(await screen.findByText('The title must be at least 3 characters')).toBeTruthy();
    expect(fetchMock.mock.calls.some(([, init]) => init?.method === 'POST')).toBe(false);
  });
});
