// @vitest-environment jsdom
// The package page's check run: "check could not run" with its reason and a button to run
// it again, and a submission stored while the job queue is away.
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import type { CheckRunStatus } from '@shared/schemas/check-runs';
import type { PackageDetail } from '@shared/schemas/packages';
import { callsTo, makeUser, renderApp, stubFetch } from './support';
import { makeDetail } from './package-fixtures';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const REASON = 'It did not finish after 5 attempts. Last error: the database did not answer';

function withCheck(status: PackageDetail['current']['check']['status'], error: string | null = null) {
  return makeDetail({
    pkg: { status: status === 'failed' ? 'check_failed' : 'checking' },
    current: {
      state: 'submitted',
      submittedAt: '2030-03-01T09:00:00.000Z',
      check: { status, progress: 0, error, resultVersion: null, checkedAt: null },
    },
  });
}

function run(detail: PackageDetail, over: Partial<CheckRunStatus>): CheckRunStatus {
  return {
    revisionId: detail.current.id,
    revisionNumber: 1,
    status: detail.current.check.status,
    progress: 0,
    error: detail.current.check.error,
    handOff: 'finished',
    failedAttempts: 0,
    canRetry: false,
    ...over,
  };
}

describe('the check run on the package page', () => {
  it('when the check could not run, then the reason shows and the contractor runs it again', async () => {
    const failed = withCheck('failed', REASON);
    const id = failed.package.id;
    let retried = false;
    const fetchMock = stubFetch((url, init) => {
      if (url.pathname === '/api/me') return { status: 200, body: { user: makeUser('contractor') } };
      if (url.pathname === `/api/packages/${id}/check-run/retry` && init?.method === 'POST') {
        retried = true;
        return { status: 202, body: withCheck('queued') };
      }
      if (url.pathname === `/api/packages/${id}/check-run`)
        return {
          status: 200,
          body: retried ? run(withCheck('queued'), { handOff: 'queued' }) : run(failed, { canRetry: true }),
        };
      if (url.pathname === `/api/packages/${id}`)
        return { status: 200, body: retried ? withCheck('queued') : failed };
    });
    renderApp(`/packages/${id}`);
    const section = await screen.findByRole('alert', { name: 'Independent check' }, { timeout: 8000 });
    expect(within(section).getByRole('heading', { name: 'Check could not run' })).toBeTruthy();
    expect(within(section).getByText(REASON)).toBeTruthy();
    await userEvent
      .setup()
      .click(await within(section).findByRole('button', { name: 'Run the check again' }));
    await waitFor(() => expect(callsTo(fetchMock, `/api/packages/${id}/check-run/retry`)).toHaveLength(1));
    expect(await screen.findByText('Independent check queued — waiting for a worker')).toBeTruthy();
  });

  it('when the engineer opens a check that could not run, then there is no button and it says who can run it', async () => {
    const failed = withCheck('failed', REASON);
    const id = failed.package.id;
    stubFetch((url) => {
      if (url.pathname === '/api/me') return { status: 200, body: { user: makeUser('engineer') } };
      if (url.pathname === `/api/packages/${id}/check-run`) return { status: 200, body: run(failed, {}) };
      if (url.pathname === `/api/packages/${id}`) return { status: 200, body: failed };
    });
    renderApp(`/packages/${id}`);
    expect(
      await screen.findByText('The contractor or a reviewer can run the check again.', undefined, {
        timeout: 8000,
      }),
    ).toBeTruthy();
    expect(screen.queryByRole('button', { name: 'Run the check again' })).toBeNull();
  });

  it('when the submission waits for the job queue, then the page says it is stored and starts on its own', async () => {
    const queued = withCheck('queued');
    const id = queued.package.id;
    stubFetch((url) => {
      if (url.pathname === '/api/me') return { status: 200, body: { user: makeUser('contractor') } };
      if (url.pathname === `/api/packages/${id}/check-run`)
        return { status: 200, body: run(queued, { handOff: 'waiting_for_queue' }) };
      if (url.pathname === `/api/packages/${id}`) return { status: 200, body: queued };
    });
    renderApp(`/packages/${id}`);
    expect(
      await screen.findByText(
        'Submission stored — waiting for the job queue, which is not answering right now',
        undefined,
        { timeout: 8000 },
      ),
    ).toBeTruthy();
    expect(screen.getByText(/Nothing is lost: the check starts on its own/)).toBeTruthy();
  });
});
