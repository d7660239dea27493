// @vitest-environment jsdom
import { afterEach, describe, expect, it, vi } from 'vitest';
import { cleanup, render, screen, within } from '@testing-library/react';
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

function show(items: LibraryUse[]) {
  stubFetch((url) =>
    url.pathname === `/api/packages/${PKG}/library-uses` ? { status: 200, body: { items } } : undefined,
  );
  const qc = createQueryClient({ defaultOptions: { queries: { retry: false } } });
  render(
    <QueryClientProvider client={qc}>
      <MemoryRouter>
        <LibraryUsesPanel packageId={PKG} />
      </MemoryRouter>
    </QueryClientProvider>,
  );
}

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
});
