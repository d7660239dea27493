// @vitest-environment jsdom
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import type { PackageDetail } from '@shared/schemas/packages';
import { callsTo, makeUser, renderApp, stubFetch } from './support';
import { makeDetail } from './package-fixtures';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const SHA = 'c0ffee00' + '1234abcd'.repeat(7);
const CODE = 'ABCDEFGHJKMNPQRSTVWXYZ23';

function decided(status: 'decided' | 'returned' = 'decided'): PackageDetail {
  return makeDetail({
    pkg: { status, decision: 'accepted', worstStatus: 'pass' },
    current: { state: 'submitted', submittedAt: '2030-03-01T09:00:00.000Z' },
  });
}

function returnRow(overrides: Record<string, unknown>) {
  return {
    id: '8c4a1d2e-3f5b-4c6d-9e7f-0a1b2c3d4e5f',
    revisionId: decided().current.id,
    state: 'pending',
    progress: 5,
    error: null,
    sha256: null,
    pages: null,
    verificationCode: CODE,
    createdAt: '2030-03-02T09:00:00.000Z',
    readyAt: null,
    ...overrides,
  };
}

describe('stamped return', () => {
  it('when the coordinator issues the return, then its steps show while it is built and the download link when it is ready', async () => {
    const detail = decided();
    const id = detail.package.id;
    let issued = false;
    let polls = 0;
    const fetchMock = stubFetch((url, init) => {
      if (url.pathname === '/api/me') return { status: 200, body: { user: makeUser('reviewer') } };
      if (url.pathname === `/api/packages/${id}`)
        return {
          status: 200,
          body: polls >= 2 ? { ...detail, package: { ...detail.package, status: 'returned' } } : detail,
        };
      if (url.pathname === `/api/packages/${id}/returns` && init?.method === 'POST') {
        issued = true;
        return { status: 202, body: returnRow({ progress: 5 }) };
      }
      if (url.pathname === `/api/packages/${id}/returns`) {
        if (!issued) return { status: 200, body: { items: [] } };
        polls += 1;
        const row =
          polls === 1
            ? returnRow({ progress: 40 })
            : returnRow({
                state: 'ready',
                progress: 100,
                sha256: SHA,
                pages: 9,
                readyAt: '2030-03-02T09:00:05.000Z',
              });
        return { status: 200, body: { items: [row] } };
      }
    });
    renderApp(`/packages/${id}`);
    const user = userEvent.setup();

    const panel = await screen.findByRole('region', { name: 'Stamped return' }, { timeout: 8000 });
    await user.click(within(panel).getByRole('button', { name: 'Issue stamped return' }));
    expect(callsTo(fetchMock, `/api/packages/${id}/returns`).length).toBeGreaterThanOrEqual(2);

    const progress = await within(panel).findByRole('progressbar', { name: 'Stamped return' });
    await waitFor(() => expect(progress.getAttribute('aria-valuenow')).toBe('40'), { timeout: 3000 });
    expect(within(panel).getByText('Burning in the markups and the stamp')).toBeTruthy();

    const link = await within(panel).findByRole('link', { name: /Open the stamped PDF/ }, { timeout: 4000 });
    expect(link.getAttribute('href')).toBe(
      `/api/packages/${id}/returns/8c4a1d2e-3f5b-4c6d-9e7f-0a1b2c3d4e5f/file`,
    );
    expect(link.textContent).toContain('9 pages');
    expect(within(panel).getByText('c0ffee001234…abcd')).toBeTruthy();
    expect(
      within(panel)
        .getByRole('link', { name: `/verify/${CODE}` })
        .getAttribute('href'),
    ).toBe(`/verify/${CODE}`);
    // The package is read again and now shows as returned.
    await waitFor(() => expect(screen.getAllByText('Returned').length).toBeGreaterThan(0));
    expect(within(panel).queryByRole('progressbar')).toBeNull();
  });

  it('when a contractor opens a returned package, then the ready return is there to download and nothing can be issued', async () => {
    const detail = decided('returned');
    const id = detail.package.id;
    stubFetch((url) => {
      if (url.pathname === '/api/me') return { status: 200, body: { user: makeUser('contractor') } };
      if (url.pathname === `/api/packages/${id}`) return { status: 200, body: detail };
      if (url.pathname === `/api/packages/${id}/returns`)
        return {
          status: 200,
          body: { items: [returnRow({ state: 'ready', progress: 100, sha256: SHA, pages: 4 })] },
        };
    });
    renderApp(`/packages/${id}`);

    const panel = await screen.findByRole('region', { name: 'Stamped return' }, { timeout: 8000 });
    expect(await within(panel).findByRole('link', { name: /Open the stamped PDF/ })).toBeTruthy();
    expect(within(panel).queryByRole('button', { name: /Issue/ })).toBeNull();
  });

  it('when the server says no decision is recorded, then the coordinator reads why nothing can be stamped', async () => {
    const detail = decided();
    const id = detail.package.id;
    stubFetch((url, init) => {
      if (url.pathname === '/api/me') return { status: 200, body: { user: makeUser('reviewer') } };
      if (url.pathname === `/api/packages/${id}`) return { status: 200, body: detail };
      if (url.pathname === `/api/packages/${id}/returns` && init?.method === 'POST')
        return { status: 409, body: { error: { code: 'no_decision', message: 'No decision.' } } };
      if (url.pathname === `/api/packages/${id}/returns`) return { status: 200, body: { items: [] } };
    });
    renderApp(`/packages/${id}`);
    const user = userEvent.setup();

    const panel = await screen.findByRole('region', { name: 'Stamped return' }, { timeout: 8000 });
    await user.click(within(panel).getByRole('button', { name: 'Issue stamped return' }));
    expect((await within(panel).findByRole('alert')).textContent).toContain('nothing to stamp');
  });
});
