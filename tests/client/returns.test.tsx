// @vitest-environment jsdom
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import type { PackageDetail } from '@shared/schemas/packages';
import { callsTo, makeUser, renderApp, stubFetch } from './support';
import { makeDetail } from './package-fixtures';

// jsdom has no canvas: the preview's drawing is replaced, and says which address it drew.
const preview = vi.hoisted(() => ({ urls: [] as string[], fail: null as string | null }));
vi.mock('@/lib/pdf-first-page', () => ({
  renderFirstPage: (url: string) => {
    preview.urls.push(url);
    return {
      promise: preview.fail ? Promise.reject(new Error(preview.fail)) : Promise.resolve(),
      cancel: () => undefined,
    };
  },
}));

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
  preview.urls = [];
  preview.fail = null;
});

const SHA = 'c0ffee00' + '1234abcd'.repeat(7);
const CODE = 'ABCDEFGHJKMNPQRSTVWXYZ23';

/** How many POSTs went to a path. */
function posts(fetchMock: ReturnType<typeof stubFetch>, pathname: string): number {
  return fetchMock.mock.calls.filter(
    ([input, init]) =>
      new URL(String(input), 'http://localhost').pathname === pathname &&
      (init as RequestInit | undefined)?.method === 'POST',
  ).length;
}

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
    unitSystem: 'metric',
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
    // First the preview of page 1, then the coordinator issues it as shown.
    const dialog = await screen.findByRole('dialog', { name: 'Check the stamped return before issuing' });
    expect(preview.urls).toEqual([`/api/packages/${id}/returns/preview`]);
    expect(within(dialog).getByText(/Page 1 as it will print/).textContent).toContain('Accepted');
    expect(posts(fetchMock, `/api/packages/${id}/returns`)).toBe(0);
    const confirm = within(dialog).getByRole('button', { name: 'Issue as shown' });
    await waitFor(() => expect((confirm as HTMLButtonElement).disabled).toBe(false));
    await user.click(confirm);
    expect(screen.queryByRole('dialog')).toBeNull();
    expect(posts(fetchMock, `/api/packages/${id}/returns`)).toBe(1);
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
    await user.click(await screen.findByRole('button', { name: 'Issue as shown' }));
    expect((await within(panel).findByRole('alert')).textContent).toContain('nothing to stamp');
  });

  it('when the preview cannot be made, then the dialog says why and the return cannot be issued from it', async () => {
    preview.fail = 'The engineer of record has not recorded a decision on this revision yet.';
    const detail = decided();
    const id = detail.package.id;
    const fetchMock = stubFetch((url) => {
      if (url.pathname === '/api/me') return { status: 200, body: { user: makeUser('reviewer') } };
      if (url.pathname === `/api/packages/${id}`) return { status: 200, body: detail };
      if (url.pathname === `/api/packages/${id}/returns`) return { status: 200, body: { items: [] } };
    });
    renderApp(`/packages/${id}`);
    const user = userEvent.setup();

    const panel = await screen.findByRole('region', { name: 'Stamped return' }, { timeout: 8000 });
    await user.click(within(panel).getByRole('button', { name: 'Issue stamped return' }));
    const dialog = await screen.findByRole('dialog', { name: 'Check the stamped return before issuing' });
    expect((await within(dialog).findByRole('alert')).textContent).toContain('has not recorded a decision');
    expect(
      (within(dialog).getByRole('button', { name: 'Issue as shown' }) as HTMLButtonElement).disabled,
    ).toBe(true);
    await user.click(within(dialog).getByRole('button', { name: 'Cancel' }));
    expect(posts(fetchMock, `/api/packages/${id}/returns`)).toBe(0);
  });
});
