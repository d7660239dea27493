// @vitest-environment jsdom
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import type { Finding } from '@shared/schemas/reviews';
import { makeUser, renderApp, stubFetch } from './support';
import { makeDetail } from './package-fixtures';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

function finding(n: number, overrides: Partial<Finding> = {}): Finding {
  return {
    id: `9b2c3d4e-5f6a-4b7c-8d9e-0f1a2b3c4d${String(n).padStart(2, '0')}`,
    revisionNumber: 1,
    text: `Finding ${n}`,
    severity: 'major',
    state: 'open',
    response: null,
    checkId: null,
    markupId: null,
    fileId: null,
    pageNumber: null,
    createdBy: 'Ruth Halvorsen',
    createdAt: '2030-03-01T10:00:00.000Z',
    updatedAt: '2030-03-01T10:00:00.000Z',
    ...overrides,
  };
}

const returned = {
  ...makeDetail({
    pkg: { status: 'returned', decision: 'revise_and_resubmit', worstStatus: 'caution' },
    current: { state: 'submitted', submittedAt: '2030-03-01T09:00:00.000Z' },
  }),
  decision: {
    decision: 'revise_and_resubmit' as const,
    conditions: 'Provide larger mats under the rear outriggers.',
    engineer: 'Ruth Halvorsen',
    revisionNumber: 1,
    at: '2030-03-01T11:00:00.000Z',
  },
};
const id = returned.package.id;

function contractorDesk(findings: Finding[]) {
  const patched: unknown[] = [];
  const posted: string[] = [];
  let list = findings;
  const fetchMock = stubFetch((url, init) => {
    if (url.pathname === '/api/me') return { status: 200, body: { user: makeUser('contractor') } };
    if (url.pathname === `/api/packages/${id}`) return { status: 200, body: returned };
    if (url.pathname === `/api/packages/${id}/returns`)
      return {
        status: 200,
        body: {
          items: [
            {
              id: '8c4a1d2e-3f5b-4c6d-9e7f-0a1b2c3d4e5f',
              revisionId: returned.current.id,
              state: 'ready',
              progress: 100,
              error: null,
              sha256: 'ab'.repeat(32),
              pages: 5,
              verificationCode: 'ABCDEFGHJKMNPQRSTVWXYZ23',
              unitSystem: 'metric',
              createdAt: '2030-03-02T09:00:00.000Z',
              readyAt: '2030-03-02T09:00:05.000Z',
            },
          ],
        },
      };
    if (url.pathname === `/api/packages/${id}/findings`) return { status: 200, body: { items: list } };
    if (url.pathname.startsWith(`/api/packages/${id}/findings/`) && init?.method === 'PATCH') {
      const body = JSON.parse(String(init.body)) as { response: string };
      patched.push({ path: url.pathname, body });
      list = list.map((f) =>
        url.pathname.endsWith(f.id) ? { ...f, response: body.response, state: 'answered' as const } : f,
      );
      return { status: 200, body: { items: list } };
    }
    if (url.pathname === `/api/packages/${id}/revisions` && init?.method === 'POST') {
      posted.push(url.pathname);
      const next = makeDetail({ pkg: { id, status: 'draft', revisionNumber: 2 }, current: { number: 2 } });
      return { status: 201, body: next };
    }
  });
  return { fetchMock, patched, posted };
}

describe('contractor resubmission', () => {
  it('when the contractor answers a finding, then the conditions are in view, the answer is sent and the finding reads as answered', async () => {
    const findings = [
      finding(1, { severity: 'minor', pageNumber: 3 }),
      finding(2, { severity: 'blocking', text: 'Mat size does not carry the outrigger load' }),
    ];
    const { patched } = contractorDesk(findings);
    renderApp(`/packages/${id}`);
    const user = userEvent.setup();

    const panel = await screen.findByRole(
      'region',
      { name: /came back: Revise and resubmit/ },
      { timeout: 8000 },
    );
    expect(await within(panel).findByText('2 findings waiting for your answer.')).toBeTruthy();
    expect(within(panel).getByText('Provide larger mats under the rear outriggers.')).toBeTruthy();
    // Most serious first: the blocking finding leads.
    const items = within(panel).getAllByRole('listitem');
    expect(items[0].textContent).toContain('Blocking');
    expect(within(items[1]).getByRole('link', { name: 'page 3' }).getAttribute('href')).toContain(
      '/returns/8c4a1d2e-3f5b-4c6d-9e7f-0a1b2c3d4e5f/file#page=3',
    );

    await user.type(
      within(items[0]).getByRole('textbox', { name: 'Your answer' }),
      'Mats enlarged to 2.4 m square.',
    );
    await user.click(within(items[0]).getByRole('button', { name: 'Send answer' }));

    await waitFor(() =>
      expect(patched).toEqual([
        {
          path: `/api/packages/${id}/findings/${findings[1].id}`,
          body: { response: 'Mats enlarged to 2.4 m square.' },
        },
      ]),
    );
    expect(await within(panel).findByText('Mats enlarged to 2.4 m square.')).toBeTruthy();
    expect(within(panel).getByText('1 finding waiting for your answer.')).toBeTruthy();
    expect(within(panel).getByText('Answered')).toBeTruthy();
  });

  it('when the contractor starts the next revision, then it is created and the editor opens', async () => {
    const { posted } = contractorDesk([finding(1, { state: 'answered', response: 'Done.' })]);
    const { router } = renderApp(`/packages/${id}`);
    const user = userEvent.setup();

    const start = await screen.findByRole('button', { name: 'Start revision 2' }, { timeout: 8000 });
    await user.click(start);

    await waitFor(() => expect(posted).toEqual([`/api/packages/${id}/revisions`]));
    await waitFor(() => expect(router.state.location.pathname).toBe(`/packages/${id}/edit`));
  });

  it('when a package was accepted, then no resubmission panel is offered', async () => {
    const accepted = { ...returned, package: { ...returned.package, decision: 'accepted' as const } };
    stubFetch((url) => {
      if (url.pathname === '/api/me') return { status: 200, body: { user: makeUser('contractor') } };
      if (url.pathname === `/api/packages/${id}`) return { status: 200, body: accepted };
      if (url.pathname === `/api/packages/${id}/returns`) return { status: 200, body: { items: [] } };
    });
    renderApp(`/packages/${id}`);

    await screen.findByRole('heading', { level: 1 }, { timeout: 8000 });
    expect(screen.queryByRole('button', { name: /Start revision/ })).toBeNull();
  });
});
