// @vitest-environment jsdom
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { QueryClientProvider } from '@tanstack/react-query';
import { MemoryRouter } from 'react-router-dom';
import type { LibraryUse } from '@shared/schemas/library';
import { createQueryClient } from '@/lib/query-client';
import { LibraryUsesPanel } from '@/features/library/components/library-uses-panel';
import { stubFetch } from './support';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const PKG = '5b0c7a52-6a55-4a8e-8b8f-1f0e8c3f2a01';

function use(overrides: Partial<LibraryUse> = {}): LibraryUse {
  return {
    slot: 0,
    version: {
      id: '9d7a0e1c-3b4f-4e6a-8c2d-5f1a3b7c9e0d',
      number: 3,
      configurationId: '3c1d2e4f-5a6b-4c7d-8e9f-0a1b2c3d4e5f',
      configurationName: 'Main boom, 18 t',
      crane: 'BW-07 — Kestrel AT-60',
    },
    detached: false,
    changedCells: [],
    units: { radius: 'm', boomLength: 'm', capacity: 't' },
    verifications: [],
    ...overrides,
  };
}

function versionDetail(id: string, verification: LibraryUse['verifications'][number]) {
  return {
    id,
    number: 1,
    createdAt: '2026-11-02T09:00:00.000Z',
    createdBy: { id: '00000000-0000-4000-8000-000000000002', name: 'Lena Brisk' },
    changeNote: null,
    retiredAt: null,
    usedBy: 1,
    cellsChanged: null,
    verified: true,
    configurationId: '00000000-0000-4000-8000-000000000003',
    configurationName: 'Main boom, 18 t',
    crane: {
      id: '00000000-0000-4000-8000-000000000004',
      fleetNumber: 'BW-14',
      make: 'Kestrel',
      model: 'AT-60',
      type: 'mobile_outriggers',
      fixed: {},
    },
    details: { workingArea: 'full_circle' },
    notes: { deductions: [], blockIncluded: false, interpolationAllowed: false },
    document: { title: 'Demo chart (invented)', file: null },
    chart: {
      units: { radius: 'm', boomLength: 'm', capacity: 't' },
      boomLengths: [30],
      radii: [10],
      capacities: [[20]],
    },
    verifications: [{ ...verification, note: 'checked' }],
  };
}

function show(
  items: LibraryUse[],
  props: { canVerify?: boolean; showEmpty?: boolean; ownFleet?: boolean } = {},
  more?: Stub,
) {
  const fetchMock = stubFetch(
    (url, init) =>
      more?.(url, init) ??
      (url.pathname === `/api/packages/${PKG}/library-uses` ? { status: 200, body: { items } } : undefined),
  );
  const qc = createQueryClient({ defaultOptions: { queries: { retry: false } } });
  render(
    <QueryClientProvider client={qc}>
      <MemoryRouter>
        <LibraryUsesPanel packageId={PKG} {...props} />
      </MemoryRouter>
    </QueryClientProvider>,
  );
  return fetchMock;
}
type Stub = Parameters<typeof stubFetch>[0];

describe('library uses on a package', () => {
  it('when the version was verified by the desk, then who and when is shown with a link to the chart', async () => {
    show([
      use({
        verifications: [
          {
            id: '1c2d3e4f-5a6b-4c7d-8e9f-0a1b2c3d4e5f',
            engineer: { id: '2c2d3e4f-5a6b-4c7d-8e9f-0a1b2c3d4e5f', name: 'Dev Marsh, PE' },
            note: 'every cell',
            at: '2026-12-01T10:00:00.000Z',
          },
        ],
      }),
    ]);
    const text = await screen.findByText(
      /Chart verified against the manufacturer's document by Dev Marsh, PE on 1 Dec 2026/,
    );
    expect(text).toBeTruthy();
    const link = screen.getByRole('link', { name: /BW-07 — Kestrel AT-60, Main boom, 18 t/ });
    expect(link.getAttribute('href')).toBe(
      `/library/versions/9d7a0e1c-3b4f-4e6a-8c2d-5f1a3b7c9e0d?package=${PKG}`,
    );
    expect(screen.queryByText(/Chart edited from library version/)).toBeNull();
  });

  it('when the contractor who keeps the fleet reads it, then the crane links to its configuration opened from the package', async () => {
    show([use()], { ownFleet: true });
    const link = await screen.findByRole('link', { name: /BW-07 — Kestrel AT-60, Main boom, 18 t/ });
    expect(link.getAttribute('href')).toBe(
      `/library/configurations/3c1d2e4f-5a6b-4c7d-8e9f-0a1b2c3d4e5f?package=${PKG}`,
    );
  });

  it('when the package uses a detached, edited copy, then every changed cell is listed with both values', async () => {
    show([
      use({
        detached: true,
        changedCells: [
          { boomLength: 30.5, radius: 12, library: 18.2, package: 19 },
          { boomLength: 30.5, radius: 24, library: 6.1, package: null },
        ],
      }),
    ]);
    const flag = await screen.findByText(/Chart edited from library version 3: 2 cells changed/);
    const table = within(flag.parentElement!).getByRole('table');
    const rows = within(table)
      .getAllByRole('row')
      .slice(1)
      .map((r) => r.textContent);
    expect(rows).toEqual(['30.51218.219', '30.5246.1removed']);
    expect(screen.getByText('Not yet verified by this desk.')).toBeTruthy();
  });

  it('when an engineer of the desk reads two cranes of which one is unverified, then a verify form is offered for that crane only and posts with the package', async () => {
    const verified = {
      id: '1c2d3e4f-5a6b-4c7d-8e9f-0a1b2c3d4e5f',
      engineer: { id: '2c2d3e4f-5a6b-4c7d-8e9f-0a1b2c3d4e5f', name: 'Dev Marsh, PE' },
      note: 'every cell against page 14',
      at: '2026-12-01T10:00:00.000Z',
    };
    const east = '7e7a0e1c-3b4f-4e6a-8c2d-5f1a3b7c9e0d';
    let items = [
      use({ verifications: [verified] }),
      use({
        slot: 1,
        version: {
          id: east,
          number: 1,
          configurationId: '4d2e3f5a-6b7c-4d8e-9f0a-1b2c3d4e5f6a',
          configurationName: 'Main boom, 18 t',
          crane: 'BW-14 — Kestrel AT-60',
        },
      }),
    ];
    const fetchMock = show(items, { canVerify: true }, (url, init) => {
      if (url.pathname === `/api/library/versions/${east}/verifications` && init?.method === 'POST') {
        items = [items[0], { ...items[1], verifications: [{ ...verified, note: 'checked' }] }];
        return { status: 201, body: versionDetail(east, verified) };
      }
      if (url.pathname === `/api/packages/${PKG}/library-uses`) return { status: 200, body: { items } };
    });
    expect(await screen.findByText('Crane 1:')).toBeTruthy();
    expect(screen.getByText('Crane 2:')).toBeTruthy();
    expect(screen.getByText('“every cell against page 14”')).toBeTruthy();
    expect(screen.queryByRole('form', { name: 'Verify the chart of crane 1' })).toBeNull();
    const form = screen.getByRole('form', { name: 'Verify the chart of crane 2' });
    const button = within(form).getByRole('button', { name: /Mark the chart verified/ });
    expect(button.hasAttribute('disabled')).toBe(true);
    const user = userEvent.setup();
    await user.type(within(form).getByRole('textbox'), 'checked');
    await user.click(button);
    await waitFor(() => {
      const post = fetchMock.mock.calls.find(([, init]) => init?.method === 'POST');
      expect(JSON.parse(String(post?.[1]?.body))).toEqual({ note: 'checked', packageId: PKG });
    });
    // the uses are read again: crane 2 now shows who verified it, and the form is gone
    await waitFor(() =>
      expect(screen.queryByRole('form', { name: 'Verify the chart of crane 2' })).toBeNull(),
    );
    expect(
      screen.getAllByText(/Chart verified against the manufacturer's document by Dev Marsh, PE/),
    ).toHaveLength(2);
    expect(screen.getByText('“checked”')).toBeTruthy();
  });

  it('when the review workspace asks and no crane is from the library, then it says the data was typed in', async () => {
    show([], { showEmpty: true });
    expect(await screen.findByText(/No crane of this package comes from the fleet library/)).toBeTruthy();
  });
});
