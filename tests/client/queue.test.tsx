// @vitest-environment jsdom
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, fireEvent, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { callsTo, listReply, makePackage, makeUser, renderApp, stubFetch } from './support';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

function reviewerWithList(items = [makePackage(1), makePackage(2), makePackage(3)], extra = {}) {
  return stubFetch((url) => {
    if (url.pathname === '/api/me') return { status: 200, body: { user: makeUser('reviewer') } };
    if (url.pathname === '/api/packages') return listReply(items, extra);
  });
}

describe('site queue', () => {
  it('when the URL carries filters, then the list request carries the same query string and the controls show them', async () => {
    const fetchMock = reviewerWithList();
    renderApp('/queue?status=with_engineer&q=crawler&sort=-plannedLiftDate&page=2&pageSize=50');

    await screen.findByRole('table');
    expect(callsTo(fetchMock, '/api/packages')).toEqual([
      '/api/packages?status=with_engineer&q=crawler&sort=-plannedLiftDate&page=2&pageSize=50',
    ]);
    expect((screen.getByRole('searchbox') as HTMLInputElement).value).toBe('crawler');
    expect((screen.getByRole('combobox', { name: 'Status' }) as HTMLSelectElement).value).toBe(
      'with_engineer',
    );
  });

  it('when the URL carries values the server would refuse, then they are left out and the defaults are asked for', async () => {
    const fetchMock = reviewerWithList();
    renderApp('/queue?status=lost&sort=colour&page=-3&pageSize=5000&siteId=north');

    await screen.findByRole('table');
    expect(callsTo(fetchMock, '/api/packages')).toEqual([
      '/api/packages?sort=plannedLiftDate&page=1&pageSize=25',
    ]);
  });

  it('when a status count is pressed, then the URL and the request filter by that status from page 1', async () => {
    const fetchMock = reviewerWithList(undefined, { countsByStatus: { ready_for_review: 3, decided: 4 } });
    const { router } = renderApp('/queue?page=3');
    const user = userEvent.setup();

    const counts = await screen.findByRole('group', { name: 'Packages by status' });
    await user.click(within(counts).getByRole('button', { name: /Decision recorded/ }));

    await waitFor(() => expect(router.state.location.search).toBe('?status=decided'));
    await waitFor(() =>
      expect(callsTo(fetchMock, '/api/packages').at(-1)).toBe(
        '/api/packages?status=decided&sort=plannedLiftDate&page=1&pageSize=25',
      ),
    );
  });

  it('when someone types in the search box, then the URL and the request carry the words after a pause', async () => {
    const fetchMock = reviewerWithList();
    const { router } = renderApp('/queue');
    const user = userEvent.setup();

    await user.type(await screen.findByRole('searchbox'), 'tailing');

    await waitFor(() => expect(router.state.location.search).toBe('?q=tailing'));
    await waitFor(() =>
      expect(callsTo(fetchMock, '/api/packages').at(-1)).toBe(
        '/api/packages?q=tailing&sort=plannedLiftDate&page=1&pageSize=25',
      ),
    );
  });

  it('when the planned lift header is pressed, then the list is asked for latest first', async () => {
    const fetchMock = reviewerWithList();
    const { router } = renderApp('/queue');
    const user = userEvent.setup();

    await user.click(await screen.findByRole('button', { name: /Planned lift/ }));

    await waitFor(() => expect(router.state.location.search).toBe('?sort=-plannedLiftDate'));
    await waitFor(() =>
      expect(callsTo(fetchMock, '/api/packages').at(-1)).toContain('sort=-plannedLiftDate'),
    );
  });

  it('when next page is pressed, then the page after is asked for by its cursor with the same filters', async () => {
    const fetchMock = reviewerWithList([makePackage(1)], {
      total: 60,
      page: 1,
      pageSize: 25,
      nextCursor: 'after-row-25',
      previousCursor: null,
    });
    const { router } = renderApp('/queue?status=ready_for_review');
    const user = userEvent.setup();

    expect((await screen.findByRole('button', { name: /Previous/ })).hasAttribute('disabled')).toBe(true);
    await user.click(await screen.findByRole('button', { name: /Next/ }));

    await waitFor(() =>
      expect(callsTo(fetchMock, '/api/packages').at(-1)).toBe(
        '/api/packages?status=ready_for_review&sort=plannedLiftDate&cursor=after-row-25&page=2&pageSize=25',
      ),
    );
    expect(router.state.location.search).toBe('?status=ready_for_review&page=2&cursor=after-row-25');
  });

  it('when previous is pressed, then page 3 goes back by its cursor and page 2 to the first page without one', async () => {
    // The server echoes the page it was asked for.
    const fetchMock = stubFetch((url) => {
      if (url.pathname === '/api/me') return { status: 200, body: { user: makeUser('reviewer') } };
      if (url.pathname === '/api/packages') {
        const page = Number(url.searchParams.get('page'));
        return listReply([makePackage(page)], {
          total: 80,
          page,
          nextCursor: 'n',
          previousCursor: page === 3 ? 'before-row-51' : 'before-row-26',
        });
      }
    });
    const { router } = renderApp('/queue?page=3&cursor=after-row-50');
    const user = userEvent.setup();
    await screen.findByRole('table');
    await user.click(await screen.findByRole('button', { name: /Previous/ }));
    await waitFor(() => expect(router.state.location.search).toBe('?page=2&cursor=before-row-51'));
    await user.click(await screen.findByRole('button', { name: /Previous/ }));
    await waitFor(() => expect(router.state.location.search).toBe(''));
    expect(callsTo(fetchMock, '/api/packages').at(-1)).toBe(
      '/api/packages?sort=plannedLiftDate&page=1&pageSize=25',
    );
  });

  it('when more packages match than the server counts, then the counts say "at least" in words', async () => {
    reviewerWithList(undefined, {
      countsByStatus: { ready_for_review: 997, decided: 4 },
      countLimit: 1000,
      countsOverLimit: [
        'draft',
        'checking',
        'check_failed',
        'ready_for_review',
        'with_engineer',
        'decided',
        'returned',
      ],
      total: 1001,
      totalOverLimit: true,
    });
    renderApp('/queue?critical=true');

    const counts = await screen.findByRole('group', { name: 'Packages by status' });
    const ready = within(counts).getByRole('button', { name: /Ready for review/ });
    expect(ready.textContent).toContain('at least 997');
    expect(within(counts).getByRole('button', { name: /All/ }).textContent).toContain('at least 1,001');
    expect(within(counts).getByRole('button', { name: /Decision recorded/ }).textContent).toContain(
      'at least 4',
    );
    expect(counts.textContent).toContain('More than 1,000 packages match these filters');
    expect(screen.getByRole('navigation', { name: 'Pages' }).textContent).toContain('of at least 1,001');
  });

  it('when j and k are pressed on the rows, then focus moves down and up, and Enter opens the package', async () => {
    reviewerWithList();
    const { router } = renderApp('/queue');

    await screen.findByRole('table');
    const rows = screen.getAllByRole('row').slice(1);
    expect(rows.map((row) => row.tabIndex)).toEqual([0, -1, -1]);

    rows[0].focus();
    fireEvent.keyDown(rows[0], { key: 'j' });
    expect(document.activeElement).toBe(rows[1]);
    fireEvent.keyDown(rows[1], { key: 'ArrowDown' });
    expect(document.activeElement).toBe(rows[2]);
    fireEvent.keyDown(rows[2], { key: 'k' });
    expect(document.activeElement).toBe(rows[1]);

    fireEvent.keyDown(rows[1], { key: 'Enter' });
    await waitFor(() => expect(router.state.location.pathname).toBe(`/packages/${makePackage(2).id}`));
  });

  it('when a row is shown, then its status reads as a word and its check outcome and discrepancies are named', async () => {
    reviewerWithList([
      makePackage(1, { status: 'with_engineer', worstStatus: 'fail', openDiscrepancies: 2 }),
    ]);
    renderApp('/queue');

    const row = (await screen.findAllByRole('row'))[1];
    expect(within(row).getByText('With engineer')).toBeTruthy();
    expect(within(row).getByText('Fail')).toBeTruthy();
    expect(within(row).getByText('2 discrepancies')).toBeTruthy();
    expect(within(row).getByText('14 Mar 2030')).toBeTruthy();
  });

  it('when the list fails, then the server message is shown with a way to try again', async () => {
    stubFetch((url) => {
      if (url.pathname === '/api/me') return { status: 200, body: { user: makeUser('reviewer') } };
      if (url.pathname === '/api/packages') {
        return {
          status: 503,
          body: { error: { code: 'database_unavailable', message: 'The database is not answering.' } },
        };
      }
    });
    renderApp('/queue');

    const alert = await screen.findByRole('alert');
    expect(alert.textContent).toContain('The database is not answering.');
    expect(within(alert).getByRole('button', { name: 'Try again' })).toBeTruthy();
  });
});

describe("contractor's desk", () => {
  it('when the organisation has no packages, then the empty state says where new ones will appear', async () => {
    stubFetch((url) => {
      if (url.pathname === '/api/me') return { status: 200, body: { user: makeUser('contractor') } };
      if (url.pathname === '/api/packages') return listReply([], { countsByStatus: {} });
    });
    renderApp('/packages');

    expect(await screen.findByRole('heading', { name: 'No lift packages yet' })).toBeTruthy();
    expect(screen.queryByRole('table')).toBeNull();
  });

  it('when a package was sent back for revision, then the desk says it is waiting on the contractor', async () => {
    stubFetch((url) => {
      if (url.pathname === '/api/me') return { status: 200, body: { user: makeUser('contractor') } };
      if (url.pathname === '/api/packages') {
        return listReply([
          makePackage(1, { status: 'returned', decision: 'revise_and_resubmit', revisionNumber: 2 }),
        ]);
      }
    });
    renderApp('/packages');

    const row = (await screen.findAllByRole('row'))[1];
    expect(within(row).getByText('You: revise and resubmit')).toBeTruthy();
    expect(within(row).getByText('Revise and resubmit')).toBeTruthy();
  });
});
