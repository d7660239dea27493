// Shared set-up for client tests: the app's real routes in a memory router, a fresh
// QueryClient with retries off, and a stubbed fetch that answers from a small table.
import { render } from '@testing-library/react';
import { createMemoryRouter, RouterProvider } from 'react-router-dom';
import { vi } from 'vitest';
import type { CurrentUser } from '@shared/schemas/auth';
import type { Role } from '@shared/schemas/common';
import type { PackageListResponse, PackageSummary } from '@shared/schemas/packages';
import { routes } from '@/app/router';
import { AppProvider } from '@/app/provider';
import { createQueryClient } from '@/lib/query-client';

// jsdom does no layout and has no ResizeObserver; the split pane registers one. An observer
// that never reports is what a browser without layout would give.
if (typeof globalThis.ResizeObserver === 'undefined') {
  globalThis.ResizeObserver = class {
    observe() {}
    unobserve() {}
    disconnect() {}
  };
}

export type Reply = { status: number; body?: unknown };
export type Handler = (url: URL, init: RequestInit | undefined) => Reply | undefined;

export function stubFetch(handler: Handler) {
  const fetchMock = vi.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
    const url = new URL(String(input), 'http://localhost');
    const reply = handler(url, init) ?? {
      status: 404,
      body: { error: { code: 'not_found', message: 'No stub' } },
    };
    return new Response(reply.body === undefined ? null : JSON.stringify(reply.body), {
      status: reply.status,
      headers: { 'Content-Type': 'application/json' },
    });
  });
  vi.stubGlobal('fetch', fetchMock);
  return fetchMock;
}

/** The path and query of every call to one endpoint, in order. */
export function callsTo(fetchMock: ReturnType<typeof stubFetch>, pathname: string): string[] {
  return fetchMock.mock.calls
    .map(([input]) => new URL(String(input), 'http://localhost'))
    .filter((url) => url.pathname === pathname)
    .map((url) => `${url.pathname}${url.search}`);
}

export function makeUser(role: Role, overrides: Partial<CurrentUser> = {}): CurrentUser {
  return {
    id: '0a6e3b1c-2f4d-4c8e-9a1b-3c5d7e9f1a2b',
    email: `${role}@example.test`,
    name: {
      contractor: 'Ines Marlowe',
      reviewer: 'Tomas Ekwueme',
      engineer: 'Ruth Halvorsen',
      admin: 'Dev Anand',
    }[role],
    role,
    unitSystem: 'metric',
    organisation: {
      id: '1b7f4c2d-3e5a-4d9f-8b2c-4d6e8f0a2b3c',
      name: role === 'contractor' ? 'Fenwick Lifting Ltd' : 'Saltmarsh Utilities',
      kind: role === 'contractor' ? 'contractor' : 'owner',
    },
    ...overrides,
  };
}

export function makePackage(index: number, overrides: Partial<PackageSummary> = {}): PackageSummary {
  const n = String(index).padStart(2, '0');
  return {
    id: `2c8a5d3e-4f6b-4e0a-9c3d-5e7f9a1b3c${n}`,
    reference: `CP-TEST-0${n}`,
    title: `Test lift ${index}`,
    status: 'ready_for_review',
    site: { id: '3d9b6e4f-5a7c-4f1b-8d4e-6f8a0b2c4d6e', name: 'North Yard' },
    contractor: { id: '4e0c7f5a-6b8d-4a2c-9e5f-7a9b1c3d5e7f', name: 'Fenwick Lifting Ltd' },
    plannedLiftDate: '2030-03-14',
    reviewDueOn: '2030-03-08',
    reviewOverdue: false,
    revisionNumber: 1,
    engineer: null,
    critical: true,
    worstStatus: 'pass',
    openDiscrepancies: 0,
    decision: null,
    updatedAt: '2030-03-01T09:00:00.000Z',
    ...overrides,
  };
}

export function listReply(items: PackageSummary[], extra: Partial<PackageListResponse> = {}): Reply {
  return {
    status: 200,
    body: {
      items,
      total: items.length,
      page: 1,
      pageSize: 25,
      countsByStatus: { ready_for_review: items.length },
      ...extra,
    },
  };
}

export function renderApp(path: string) {
  const queryClient = createQueryClient({
    defaultOptions: { queries: { retry: false }, mutations: { retry: false } },
  });
  const router = createMemoryRouter(routes, { initialEntries: [path] });
  const view = render(
    <AppProvider queryClient={queryClient}>
      <RouterProvider router={router} />
    </AppProvider>,
  );
  return { ...view, router, queryClient };
}
