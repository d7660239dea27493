// @vitest-environment jsdom
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { cleanup, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { callsTo, listReply, makePackage, makeUser, renderApp, stubFetch } from './support';

const SITE = {
  id: '3d9b6e4f-5a7c-4f1b-8d4e-6f8a0b2c4d6e',
  name: 'North Yard',
  code: 'NY',
  owner: 'Saltmarsh',
};
const ENGINEER = {
  id: '9a1b2c3d-4e5f-4a6b-8c7d-9e0f1a2b3c4d',
  name: 'Ruth Halvorsen',
  email: 'ruth@example.test',
  openPackages: 3,
};
const CONTRACTOR_ID = '4e0c7f5a-6b8d-4a2c-9e5f-7a9b1c3d5e7f';

beforeEach(() => window.localStorage.clear());
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

function reviewerDesk(role: 'reviewer' | 'engineer' = 'reviewer') {
  return stubFetch((url) => {
    if (url.pathname === '/api/me') return { status: 200, body: { user: makeUser(role) } };
    if (url.pathname === '/api/packages')
      return listReply([makePackage(1), makePackage(2, { openDiscrepancies: 2 })]);
    if (url.pathname === '/api/sites') return { status: 200, body: { items: [SITE] } };
    if (url.pathname === '/api/engineers') return { status: 200, body: { items: [ENGINEER] } };
  });
}

const select = (name: string) => screen.getByRole('combobox', { name }) as HTMLSelectElement;

describe('queue filters', () => {
  it('when the URL carries every queue filter, then the list request carries them in a fixed order and the controls show them', async () => {
    const fetchMock = reviewerDesk();
    renderApp(
      `/queue?revisionMin=2&engineerId=none&critical=true&discrepancies=true&liftWithinDays=7&siteId=${SITE.id}&contractorId=${CONTRACTOR_ID}`,
    );

    await screen.findByRole('table');
    expect(callsTo(fetchMock, '/api/packages')).toEqual([
      `/api/packages?siteId=${SITE.id}&contractorId=${CONTRACTOR_ID}&engineerId=none&critical=true&discrepancies=true&liftWithinDays=7&revisionMin=2&sort=plannedLiftDate&page=1&pageSize=25`,
    ]);
    await waitFor(() => expect(select('Site').value).toBe(SITE.id));
    expect(select('Engineer').value).toBe('none');
    expect(select('Critical lift').value).toBe('true');
    expect(select('Discrepancies').value).toBe('true');
    expect(select('Planned lift').value).toBe('7');
    expect(select('Revision').value).toBe('2');
    // The contractor comes from the rows seen (Fenwick Lifting Ltd in the fixture).
    expect(select('Contractor').selectedOptions[0].textContent).toBe('Fenwick Lifting Ltd');
  });

  it('when the filters are chosen, then the URL and the request ask for unassigned, critical, open discrepancies and lifts within 7 days from page 1', async () => {
    const fetchMock = reviewerDesk();
    const { router } = renderApp('/queue?page=2');
    const user = userEvent.setup();
    await screen.findByRole('table');
    await waitFor(() =>
      expect(within(select('Engineer')).getByRole('option', { name: 'Ruth Halvorsen' })).toBeTruthy(),
    );

    await user.selectOptions(select('Engineer'), 'Unassigned');
    await user.selectOptions(select('Critical lift'), 'Critical only');
    await user.selectOptions(select('Discrepancies'), 'None open');
    await user.selectOptions(select('Planned lift'), 'Within 7 days or late');

    await waitFor(() =>
      expect(router.state.location.search).toBe(
        '?engineerId=none&critical=true&discrepancies=false&liftWithinDays=7',
      ),
    );
    await waitFor(() =>
      expect(callsTo(fetchMock, '/api/packages').at(-1)).toBe(
        '/api/packages?engineerId=none&critical=true&discrepancies=false&liftWithinDays=7&sort=plannedLiftDate&page=1&pageSize=25',
      ),
    );

    await user.click(screen.getByRole('button', { name: 'Clear these filters' }));
    await waitFor(() => expect(router.state.location.search).toBe(''));
  });

  it('when the check header is pressed, then the list is asked for most open discrepancies first, and again for fewest first', async () => {
    const fetchMock = reviewerDesk();
    const { router } = renderApp('/queue');
    const user = userEvent.setup();

    await user.click(await screen.findByRole('button', { name: 'Check' }));
    await waitFor(() => expect(router.state.location.search).toBe('?sort=-openDiscrepancies'));
    await waitFor(() =>
      expect(callsTo(fetchMock, '/api/packages').at(-1)).toBe(
        '/api/packages?sort=-openDiscrepancies&page=1&pageSize=25',
      ),
    );
    await user.click(screen.getByRole('button', { name: 'Check' }));
    await waitFor(() => expect(router.state.location.search).toBe('?sort=openDiscrepancies'));
  });

  it('when a view is saved and picked again later, then the same filters come back and only filters are stored', async () => {
    reviewerDesk();
    const { router } = renderApp('/queue?critical=true&liftWithinDays=3&page=4');
    const user = userEvent.setup();
    await screen.findByRole('table');

    const views = screen.getByRole('group', { name: 'Saved views' });
    await user.click(within(views).getByRole('button', { name: '+ Save these filters' }));
    await user.type(within(views).getByRole('textbox', { name: 'Name of the view' }), 'Critical this week');
    await user.click(within(views).getByRole('button', { name: 'Save view' }));

    const stored = JSON.parse(
      window.localStorage.getItem(`counterpoise:saved-views:${makeUser('reviewer').id}:queue`) ?? '[]',
    );
    expect(stored).toEqual([{ name: 'Critical this week', search: 'critical=true&liftWithinDays=3' }]);

    await user.click(screen.getByRole('button', { name: 'Clear these filters' }));
    await waitFor(() => expect(router.state.location.search).toBe(''));
    await user.click(within(views).getByRole('button', { name: 'Critical this week' }));
    await waitFor(() => expect(router.state.location.search).toBe('?critical=true&liftWithinDays=3'));
    expect(
      within(views).getByRole('button', { name: 'Critical this week' }).getAttribute('aria-pressed'),
    ).toBe('true');
  });

  it('when an engineer opens their list, then there is no engineer filter and no engineer list is asked for', async () => {
    const fetchMock = reviewerDesk('engineer');
    renderApp('/assigned?critical=false');

    await screen.findByRole('table');
    expect(screen.queryByRole('combobox', { name: 'Engineer' })).toBeNull();
    expect(callsTo(fetchMock, '/api/engineers')).toEqual([]);
    expect(callsTo(fetchMock, '/api/packages')[0]).toBe(
      '/api/packages?critical=false&sort=plannedLiftDate&page=1&pageSize=25',
    );
  });
});
