// @vitest-environment jsdom
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, fireEvent, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { callsTo, listReply, makePackage, makeUser, renderApp, stubFetch, type Reply } from './support';

const ENGINEER = {
  id: '9a1b2c3d-4e5f-4a6b-8c7d-9e0f1a2b3c4d',
  name: 'Ruth Halvorsen',
  email: 'ruth@example.test',
  openPackages: 3,
};
const rows = [1, 2, 3, 4].map((i) => makePackage(i));

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

function desk(assignReply: Reply) {
  const posted: unknown[] = [];
  const fetchMock = stubFetch((url, init) => {
    if (url.pathname === '/api/me') return { status: 200, body: { user: makeUser('reviewer') } };
    if (url.pathname === '/api/packages') return listReply(rows);
    if (url.pathname === '/api/sites') return { status: 200, body: { items: [] } };
    if (url.pathname === '/api/engineers') return { status: 200, body: { items: [ENGINEER] } };
    if (url.pathname === '/api/assignments' && init?.method === 'POST') {
      posted.push(JSON.parse(String(init.body)));
      return assignReply;
    }
  });
  return { fetchMock, posted };
}

const OK: Reply = {
  status: 200,
  body: { assigned: 3, engineer: { id: ENGINEER.id, name: ENGINEER.name, email: ENGINEER.email } },
};

async function chooseEngineer(user: ReturnType<typeof userEvent.setup>) {
  const bar = screen.getByRole('region', { name: 'Selected packages' });
  const picker = within(bar).getByRole('combobox', { name: /Assign to/ });
  await waitFor(() => expect(within(picker).getByRole('option', { name: /Ruth Halvorsen/ })).toBeTruthy());
  await user.selectOptions(picker, ENGINEER.id);
  await user.click(within(bar).getByRole('button', { name: 'Assign' }));
}

describe('queue assignment', () => {
  it('when rows are ticked by click, shift-click and the x key and assigned, then the selected ids are posted and the list is asked for again', async () => {
    const { fetchMock, posted } = desk(OK);
    renderApp('/queue');
    const user = userEvent.setup();
    await screen.findByRole('table');

    // Row 1 by click, rows 1–3 by shift-click on row 3, then row 3 untoggled and row 4 added by x.
    await user.click(screen.getByRole('checkbox', { name: `Select ${rows[0].reference}` }));
    fireEvent.click(screen.getByRole('checkbox', { name: `Select ${rows[2].reference}` }), {
      shiftKey: true,
    });
    const tableRows = within(screen.getByRole('table')).getAllByRole('row').slice(1);
    tableRows[3].focus();
    await user.keyboard('x');

    expect(screen.getByText('4 packages selected')).toBeTruthy();
    await user.click(screen.getByRole('checkbox', { name: `Select ${rows[2].reference}` }));
    expect(screen.getByText('3 packages selected')).toBeTruthy();

    const listCallsBefore = callsTo(fetchMock, '/api/packages').length;
    await chooseEngineer(user);

    await waitFor(() => expect(posted).toHaveLength(1));
    expect(posted[0]).toEqual({
      packageIds: [rows[0].id, rows[1].id, rows[3].id],
      engineerId: ENGINEER.id,
    });
    expect(
      await screen.findByText('Ruth Halvorsen is now the engineer of record for 3 packages.', {
        exact: false,
      }),
    ).toBeTruthy();
    await waitFor(() => expect(callsTo(fetchMock, '/api/packages').length).toBeGreaterThan(listCallsBefore));
    // The selection is cleared once the assignment is made.
    expect(screen.queryByText(/packages? selected/)).toBeNull();
  });

  it('when the server refuses because a package already has a decision, then the coordinator is told which and that nothing was assigned', async () => {
    desk({
      status: 409,
      body: {
        error: {
          code: 'not_assignable',
          message: `${rows[1].reference}: a decision is already recorded or the package is a draft; it cannot be reassigned.`,
        },
      },
    });
    renderApp('/queue');
    const user = userEvent.setup();
    await screen.findByRole('table');

    await user.click(screen.getByRole('checkbox', { name: 'Select every package on this page' }));
    expect(screen.getByText('4 packages selected')).toBeTruthy();
    await chooseEngineer(user);

    const alert = await screen.findByRole('alert');
    expect(alert.textContent).toContain('Nothing was assigned.');
    expect(alert.textContent).toContain(rows[1].reference);
    expect(alert.textContent).toContain('Untick those packages');
    // The selection stays, so the coordinator can untick the refused one.
    expect(screen.getByText('4 packages selected')).toBeTruthy();
  });

  it('when a package has left the queue, then the 404 names it by its reference', async () => {
    desk({
      status: 404,
      body: { error: { code: 'not_found', message: `lift package ${rows[2].id} not found` } },
    });
    renderApp('/queue');
    const user = userEvent.setup();
    await screen.findByRole('table');

    await user.click(screen.getByRole('checkbox', { name: `Select ${rows[2].reference}` }));
    await chooseEngineer(user);

    const alert = await screen.findByRole('alert');
    expect(alert.textContent).toContain(`${rows[2].reference} is no longer in your queue`);
  });

  it('when an engineer is picked in one row, then only that package is posted and the row does not open', async () => {
    const { posted } = desk({ ...OK, body: { ...(OK.body as object), assigned: 1 } });
    const { router } = renderApp('/queue');
    const user = userEvent.setup();
    await screen.findByRole('table');

    const picker = screen.getByRole('combobox', { name: `Engineer of record for ${rows[1].reference}` });
    await waitFor(() => expect(within(picker).getByRole('option', { name: 'Ruth Halvorsen' })).toBeTruthy());
    await user.selectOptions(picker, ENGINEER.id);

    await waitFor(() => expect(posted).toEqual([{ packageIds: [rows[1].id], engineerId: ENGINEER.id }]));
    expect(router.state.location.pathname).toBe('/queue');
  });
});
