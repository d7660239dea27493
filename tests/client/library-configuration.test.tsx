// @vitest-environment jsdom
// The contractor's configuration page opened from a package (`?package=…`): the version the
// package uses is shown first with the package's lift point on the capacity chart; another version
// says where the lift point is and offers to show it; a package that uses none of it says so.
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import passOutriggers from '@shared/engineering/examples/pass-outriggers.json';
import { evaluateLift } from '@shared/engineering/evaluate';
import { LiftInput } from '@shared/schemas/lift-input';
import type { ConfigurationDetail, LibraryUse, VersionDetail } from '@shared/schemas/library';
import { makeUser, renderApp, stubFetch } from './support';
import { makeDetail } from './package-fixtures';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const CONFIG = '3c1d2e4f-5a6b-4c7d-8e9f-0a1b2c3d4e5f';
const V1 = '9d7a0e1c-3b4f-4e6a-8c2d-5f1a3b7c9e0d';
const V2 = '8e6b1f2d-4c5a-4f7b-9d3e-6a2b4c8d0f1e';
const lena = { id: '00000000-0000-4000-8000-000000000002', name: 'Lena Brisk' };

const summary = (id: string, number: number) => ({
  id,
  number,
  createdAt: '2026-11-02T09:00:00.000Z',
  createdBy: lena,
  changeNote: number === 2 ? 'Corrected 8 m row' : null,
  retiredAt: null,
  usedBy: number === 1 ? 1 : 0,
  cellsChanged: number === 2 ? 1 : null,
  verified: false,
});
const config: ConfigurationDetail = {
  id: CONFIG,
  craneId: '00000000-0000-4000-8000-000000000004',
  name: 'Main boom, 18 t, full spread, 360°',
  retiredAt: null,
  versions: [summary(V1, 1), summary(V2, 2)],
};
const version = (id: string, number: number): VersionDetail => ({
  ...summary(id, number),
  configurationId: CONFIG,
  configurationName: config.name,
  crane: {
    id: config.craneId,
    fleetNumber: 'BW-07',
    make: 'Kestrel',
    model: 'AT-60',
    type: 'mobile_outriggers',
    fixed: { pivotOffset: { value: 1.2, unit: 'm' }, pivotHeight: { value: 2.8, unit: 'm' } },
  },
  details: { workingArea: 'full_circle' },
  notes: { deductions: [], blockIncluded: false, interpolationAllowed: false },
  document: { title: 'Demo chart (invented)', file: null },
  chart: {
    units: { radius: 'm', boomLength: 'm', capacity: 't' },
    boomLengths: [30.5],
    radii: [8, 10, 12, 14],
    capacities: [[number === 2 ? 27.5 : 28], [22.5], [18.2], [15.1]],
  },
  verifications: [],
});
const use = (versionId: string, number: number): LibraryUse => ({
  slot: 0,
  version: {
    id: versionId,
    number,
    configurationId: CONFIG,
    configurationName: config.name,
    crane: 'BW-07 — Kestrel AT-60',
  },
  detached: false,
  changedCells: [],
  units: { radius: 'm', boomLength: 'm', capacity: 't' },
  verifications: [],
});

function open(uses: LibraryUse[]) {
  const result = evaluateLift(LiftInput.parse(passOutriggers));
  const detail = makeDetail({
    inputs: passOutriggers as Record<string, unknown>,
    current: { state: 'submitted', results: result as unknown as Record<string, unknown> },
  });
  stubFetch((url) => {
    if (url.pathname === '/api/me') return { status: 200, body: { user: makeUser('contractor') } };
    if (url.pathname === `/api/library/configurations/${CONFIG}`) return { status: 200, body: config };
    if (url.pathname === `/api/library/versions/${V1}`) return { status: 200, body: version(V1, 1) };
    if (url.pathname === `/api/library/versions/${V2}`) return { status: 200, body: version(V2, 2) };
    if (url.pathname === `/api/packages/${detail.package.id}`) return { status: 200, body: detail };
    if (url.pathname === `/api/packages/${detail.package.id}/library-uses`)
      return { status: 200, body: { items: uses } };
  });
  renderApp(`/library/configurations/${CONFIG}?package=${detail.package.id}`);
  return { detail, result };
}

const capacityFigure = () =>
  screen
    .getAllByRole('figure')
    .find((f) => within(f).queryByRole('img', { name: 'Rated capacity against radius' }))!;

describe('a configuration opened from a package', () => {
  it('when the package uses version 1 of two, then version 1 is shown with its lift point, and version 2 offers to go back', async () => {
    const { detail, result } = open([use(V1, 1)]);
    const note = await screen.findByTestId('from-package', {}, { timeout: 8000 });
    await within(note).findByText(/its crane uses version 1\./);
    expect(within(note).getByRole('link', { name: detail.package.reference }).getAttribute('href')).toBe(
      `/packages/${detail.package.id}`,
    );
    expect(await screen.findByRole('heading', { name: /^Version 1/ })).toBeTruthy();
    const gross = (result.figures.grossLoad! / 9806.65).toPrecision(3);
    const mark = await within(capacityFigure()).findByTestId('plot-mark');
    expect(mark.textContent).toBe(`${detail.package.reference}: ${gross} t at 12 m`);
    expect(screen.getByRole('button', { name: /Version 1/ }).textContent).toContain(
      `used by ${detail.package.reference}`,
    );

    const user = userEvent.setup();
    await user.click(screen.getByRole('button', { name: /^Version 2/ }));
    await screen.findByRole('heading', { name: /^Version 2/ });
    expect(within(capacityFigure()).queryByTestId('plot-mark')).toBeNull();
    expect(screen.getByTestId('from-package').textContent).toContain(
      "Version 1 carries the package's lift point; this page shows version 2.",
    );
    await user.click(screen.getByRole('button', { name: 'Show version 1' }));
    await screen.findByRole('heading', { name: /^Version 1/ });
    expect(await within(capacityFigure()).findByTestId('plot-mark')).toBeTruthy();
  }, 60_000);

  it('when the package uses no version of this configuration, then the page says nothing of it is drawn', async () => {
    open([use('7e7a0e1c-3b4f-4e6a-8c2d-5f1a3b7c9e0d', 3)]);
    const note = await screen.findByTestId('from-package', {}, { timeout: 8000 });
    expect(note.textContent).toMatch(/does not use this configuration: nothing of it is drawn/);
    await screen.findByRole('heading', { name: /^Version 2/ });
    expect(within(capacityFigure()).queryByTestId('plot-mark')).toBeNull();
  }, 60_000);
});
