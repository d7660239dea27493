// @vitest-environment jsdom
// The package page's engineer of record for the coordinator: choose, add a note, confirm in a
// dialog that says who is told, and the history of who held the package.
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { makePackage, makeUser, renderApp, stubFetch } from './support';
import { makeDetail } from './package-fixtures';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const ENGINEERS = [
  { id: makePackage(21).id, name: 'Ruth Halvorsen', email: 'ruth@example.test', openPackages: 4 },
  { id: makePackage(22).id, name: 'Kofi Lindqvist', email: 'kofi@example.test', openPackages: 1 },
];

describe('assignment from the package page', () => {
  it('when the coordinator reassigns with a note, then a confirmation names who is told and the note is sent', async () => {
    const detail = makeDetail({
      pkg: { status: 'with_engineer', engineer: { id: ENGINEERS[0].id, name: 'Ruth Halvorsen' } },
      current: { state: 'submitted', submittedAt: '2030-03-01T09:00:00.000Z' },
    });
    const id = detail.package.id;
    const posted: unknown[] = [];
    stubFetch((url, init) => {
      if (url.pathname === '/api/me') return { status: 200, body: { user: makeUser('reviewer') } };
      if (url.pathname === `/api/packages/${id}`) return { status: 200, body: detail };
      if (url.pathname === '/api/engineers') return { status: 200, body: { items: ENGINEERS } };
      if (url.pathname === `/api/packages/${id}/assignments`)
        return {
          status: 200,
          body: {
            items: [
              {
                id: makePackage(30).id,
                engineer: 'Ruth Halvorsen',
                assignedBy: 'Tomas Ekwueme',
                assignedAt: '2030-03-01T10:00:00.000Z',
                endedAt: null,
                note: 'Check the mats first.',
              },
            ],
          },
        };
      if (url.pathname === '/api/assignments' && init?.method === 'POST') {
        posted.push(JSON.parse(String(init.body)));
        return {
          status: 200,
          body: {
            assigned: 1,
            engineer: { id: ENGINEERS[1].id, name: 'Kofi Lindqvist', email: 'kofi@example.test' },
          },
        };
      }
    });
    renderApp(`/packages/${id}`);
    const user = userEvent.setup();

    const panel = await screen.findByRole('region', { name: 'Engineer of record' }, { timeout: 8000 });
    expect(await within(panel).findByText('“Check the mats first.”')).toBeTruthy();
    const select = within(panel).getByLabelText('Reassign to');
    await within(panel).findByRole('option', { name: 'Kofi Lindqvist — 1 open package' });
    // The engineer who holds it is not offered again.
    expect(within(panel).queryByRole('option', { name: /Ruth Halvorsen/ })).toBeNull();
    await user.selectOptions(select, ENGINEERS[1].id);
    await user.type(within(panel).getByLabelText(/Note to the engineer/), 'Rigging drawing rev C attached.');
    await user.click(within(panel).getByRole('button', { name: 'Reassign…' }));

    const dialog = await screen.findByRole('dialog', {
      name: `Reassign ${detail.package.reference} to Kofi Lindqvist?`,
    });
    expect(dialog.textContent).toContain('Ruth Halvorsen stops being the engineer of record');
    expect(dialog.textContent).toContain('Rigging drawing rev C attached.');
    expect(posted).toEqual([]);
    await user.click(within(dialog).getByRole('button', { name: 'Reassign to Kofi Lindqvist' }));
    expect(await within(panel).findByText(/Kofi Lindqvist is now the engineer of record/)).toBeTruthy();
    expect(posted).toEqual([
      { packageIds: [id], engineerId: ENGINEERS[1].id, note: 'Rigging drawing rev C attached.' },
    ]);
  });
});
