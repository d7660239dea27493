// @vitest-environment jsdom
// The package page of a lift with several cranes: each crane's share and gross load, and one side
// view per crane drawn from that crane's own configuration and figures.
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, screen, within } from '@testing-library/react';
import { evaluateLift } from '@shared/engineering/evaluate';
import { LiftInput } from '@shared/schemas/lift-input';
import threeCranes from '@shared/engineering/examples/caution-three-cranes.json';
import { makeUser, renderApp, stubFetch } from './support';
import { makeDetail, makeFile } from './package-fixtures';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

describe('package page with several cranes', () => {
  it('when a three-crane lift has its results, then each crane has its share row and its own side view', async () => {
    const results = evaluateLift(LiftInput.parse(threeCranes), null, { units: 'metric' });
    const detail = makeDetail({
      pkg: { status: 'ready_for_review', worstStatus: results.overallStatus },
      inputs: threeCranes,
      current: {
        state: 'submitted',
        submittedAt: '2030-03-01T10:00:00.000Z',
        check: {
          status: 'done',
          progress: 100,
          error: null,
          resultVersion: 2,
          checkedAt: '2030-03-01T10:00:05.000Z',
        },
        results: results as unknown as Record<string, unknown>,
        files: [makeFile()],
      },
    });
    stubFetch((url) => {
      if (url.pathname === '/api/me') return { status: 200, body: { user: makeUser('reviewer') } };
      if (url.pathname === `/api/packages/${detail.package.id}`) return { status: 200, body: detail };
    });
    renderApp(`/packages/${detail.package.id}`);

    const shares = await screen.findByRole('region', { name: 'Shares of the cranes' }, { timeout: 8000 });
    expect(within(shares).getAllByTestId('crane-share')).toHaveLength(3);
    expect(within(shares).getByText(/3 cranes · margin 33% on each share/)).toBeTruthy();
    for (const crane of results.cranes!) {
      const heading = screen.getByRole('heading', {
        name: `Side view of crane ${crane.index} (${crane.name}) for its share`,
      });
      const section = heading.closest('section')!;
      // a drawing, not the "cannot draw" note: each crane has its own configuration
      expect(section.querySelector('svg')).not.toBeNull();
    }
  });
});
