// @vitest-environment jsdom
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, screen, within } from '@testing-library/react';
import { evaluateLift } from '@shared/engineering/evaluate';
import { LiftInput } from '@shared/schemas/lift-input';
import discrepancies from '@shared/engineering/examples/caution-discrepancies.json';
import { callsTo, makePackage, makeUser, renderApp, stubFetch } from './support';
import { makeDetail, makeFile } from './package-fixtures';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

describe('package page', () => {
  it('when a package opens, then its reference, lift, status and planned date are shown', async () => {
    const detail = makeDetail({
      pkg: {
        title: 'Boiler drum set',
        status: 'with_engineer',
        engineer: { id: makePackage(9).id, name: 'Ruth Halvorsen' },
      },
    });
    const fetchMock = stubFetch((url) => {
      if (url.pathname === '/api/me') return { status: 200, body: { user: makeUser('engineer') } };
      if (url.pathname === `/api/packages/${detail.package.id}`) return { status: 200, body: detail };
    });
    renderApp(`/packages/${detail.package.id}`);

    expect(
      await screen.findByRole('heading', { level: 1, name: 'Boiler drum set' }, { timeout: 8000 }),
    ).toBeTruthy();
    const summary = screen.getByRole('region', { name: 'Package summary' });
    expect(within(summary).getByText(detail.package.reference)).toBeTruthy();
    expect(within(summary).getByText('With engineer')).toBeTruthy();
    expect(within(summary).getByText('14 Mar 2030')).toBeTruthy();
    expect(within(summary).getByText('Ruth Halvorsen')).toBeTruthy();
    expect(screen.queryByRole('button', { name: /Duplicate/ })).toBeNull();
    expect(callsTo(fetchMock, `/api/packages/${detail.package.id}`)).toHaveLength(1);
  });

  it("when the server answers 404, then the page says the package is not in this person's list", async () => {
    stubFetch((url) => {
      if (url.pathname === '/api/me') return { status: 200, body: { user: makeUser('contractor') } };
      if (url.pathname.startsWith('/api/packages/'))
        return { status: 404, body: { error: { code: 'not_found', message: 'Package not found.' } } };
    });
    renderApp(`/packages/${makePackage(3).id}`);

    const alert = await screen.findByRole('alert', {}, { timeout: 8000 });
    expect(within(alert).getByText('No such package in your list')).toBeTruthy();
    expect(within(alert).getByRole('link', { name: 'Back to your list' }).getAttribute('href')).toBe(
      '/packages',
    );
  });

  it('when the check is running, then the page polls until the results arrive and shows disagreements first', async () => {
    const inputs = LiftInput.parse(discrepancies);
    const results = evaluateLift(inputs, null, { units: 'metric' });
    const running = makeDetail({
      pkg: { status: 'checking' },
      inputs: discrepancies,
      current: {
        state: 'submitted',
        submittedAt: '2030-03-01T10:00:00.000Z',
        check: { status: 'running', progress: 40, error: null, resultVersion: null, checkedAt: null },
        files: [makeFile()],
      },
    });
    const done = makeDetail({
      pkg: { status: 'ready_for_review', worstStatus: results.overallStatus },
      inputs: discrepancies,
      current: {
        ...running.current,
        check: {
          status: 'done',
          progress: 100,
          error: null,
          resultVersion: 1,
          checkedAt: '2030-03-01T10:00:05.000Z',
        },
        results: results as unknown as Record<string, unknown>,
      },
    });
    let calls = 0;
    const fetchMock = stubFetch((url) => {
      if (url.pathname === '/api/me') return { status: 200, body: { user: makeUser('reviewer') } };
      if (url.pathname === `/api/packages/${running.package.id}`) {
        calls += 1;
        return { status: 200, body: calls < 2 ? running : done };
      }
    });
    renderApp(`/packages/${running.package.id}`);

    const progress = await screen.findByRole(
      'progressbar',
      { name: 'Independent check progress' },
      { timeout: 8000 },
    );
    expect(progress.getAttribute('aria-valuenow')).toBe('40');
    expect(screen.getByText('Independent check running — 40%')).toBeTruthy();

    const discrepancyRows = await screen.findAllByTestId('discrepancy-row', {}, { timeout: 5000 });
    expect(callsTo(fetchMock, `/api/packages/${running.package.id}`).length).toBeGreaterThanOrEqual(2);
    expect(screen.queryByRole('progressbar', { name: 'Independent check progress' })).toBeNull();
    const outcomes = discrepancyRows.map((row) => /Disagrees/.test(row.textContent ?? ''));
    expect(outcomes[0]).toBe(true);
    expect(outcomes.indexOf(false) === -1 || outcomes.slice(outcomes.indexOf(false)).every((o) => !o)).toBe(
      true,
    );
    const checkRows = screen.getAllByTestId('check-row');
    const rank = (text: string) =>
      /Fail/.test(text) ? 0 : /Caution/.test(text) ? 1 : /Pass/.test(text) ? 2 : 3;
    const ranks = checkRows.map((row) =>
      rank(within(row).getAllByText(/^(Fail|Caution|Pass|Not applicable)$/)[0].textContent ?? ''),
    );
    expect([...ranks].sort((a, b) => a - b)).toEqual(ranks);
    expect(screen.getByRole('link', { name: 'lift-plan-rev1.pdf' }).getAttribute('href')).toBe(
      `/api/packages/${running.package.id}/files/${makeFile().id}`,
    );
    expect(screen.getAllByText(/does not replace the crane manufacturer/).length).toBeGreaterThan(0);
  });

  it("when the site sets US customary units, then the package page names them as the return's units, whatever the reader's own", async () => {
    const detail = {
      ...makeDetail({ pkg: { status: 'with_engineer' } }),
      documentUnits: { system: 'imperial' as const, source: 'site' as const },
    };
    stubFetch((url) => {
      if (url.pathname === '/api/me')
        return { status: 200, body: { user: makeUser('reviewer', { unitSystem: 'metric' }) } };
      if (url.pathname === `/api/packages/${detail.package.id}`) return { status: 200, body: detail };
    });
    renderApp(`/packages/${detail.package.id}`);

    const panel = await screen.findByRole(
      'region',
      { name: 'Units of the stamped return' },
      { timeout: 8000 },
    );
    expect(panel.textContent).toContain(
      'US customary (ft, lb, kip, psf), set for every package of this site.',
    );
  });

  it("when the package keeps its contractor's units, then the page says so", async () => {
    const detail = makeDetail({ pkg: { status: 'with_engineer' } });
    stubFetch((url) => {
      if (url.pathname === '/api/me')
        return { status: 200, body: { user: makeUser('engineer', { unitSystem: 'imperial' }) } };
      if (url.pathname === `/api/packages/${detail.package.id}`) return { status: 200, body: detail };
    });
    renderApp(`/packages/${detail.package.id}`);

    const panel = await screen.findByRole(
      'region',
      { name: 'Units of the stamped return' },
      { timeout: 8000 },
    );
    expect(panel.textContent).toContain(
      "Metric (m, t, kN, kPa), the contractor's when the package was created.",
    );
  });
});
