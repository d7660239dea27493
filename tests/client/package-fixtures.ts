// Package detail answers for client tests, in the shape GET /api/packages/:id returns.
import type { FileSummary, PackageDetail, PackageSummary } from '@shared/schemas/packages';
import { makePackage } from './support';

export const UPDATED_AT = '2030-03-01T09:00:00.000Z';

export function makeFile(overrides: Partial<FileSummary> = {}): FileSummary {
  return {
    id: '5f1d8a6b-7c9e-4b3d-8f6a-9b1c3d5e7f90',
    kind: 'lift_plan',
    originalName: 'lift-plan-rev1.pdf',
    sha256: 'ab12cd34ef56ab12cd34ef56ab12cd34ef56ab12cd34ef56ab12cd34ef56ab12',
    sizeBytes: 482_113,
    pages: 6,
    carriedFromRevision: null,
    createdAt: UPDATED_AT,
    contents: null,
    notCarried: null,
    ...overrides,
  };
}

export function makeDetail(
  options: {
    pkg?: Partial<PackageSummary>;
    current?: Partial<PackageDetail['current']>;
    inputs?: Record<string, unknown>;
  } = {},
): PackageDetail {
  const pkg = { ...makePackage(4, { status: 'draft', worstStatus: null, ...options.pkg }), version: 1 };
  const current: PackageDetail['current'] = {
    id: '6a2e9b7c-8d0f-4c4e-9a7b-0c2d4e6f8a1b',
    number: 1,
    state: 'draft',
    inputs: options.inputs ?? {},
    submittedAt: null,
    updatedAt: UPDATED_AT,
    check: { status: 'none', progress: 0, error: null, resultVersion: null, checkedAt: null },
    results: null,
    files: [],
    acceptedFigures: [],
    returnRequestedAt: null,
    ...options.current,
  };
  return {
    package: pkg,
    sitePolicy: {},
    documentUnits: { system: 'metric', source: 'package' },
    decision: null,
    revisions: [
      {
        id: current.id,
        number: current.number,
        state: current.state,
        submittedAt: current.submittedAt,
        checkStatus: current.check.status,
      },
    ],
    current,
    events: [
      {
        id: '7b3f0c8d-9e1a-4d5f-8b8c-1d3e5f7a9b2c',
        action: 'package.created',
        actor: 'Ines Marlowe',
        at: '2030-02-28T08:00:00.000Z',
        detail: {},
      },
    ],
  };
}
