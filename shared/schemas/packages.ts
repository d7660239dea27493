// Lift package payloads: the list the queue and the contractor's desk show, and one package.
import { z } from 'zod';
import { Decision, PackageStatus, PACKAGE_STATUSES } from './common';

export const CheckStatus = z.enum(['pass', 'caution', 'fail', 'not_applicable']);
export type CheckStatus = z.infer<typeof CheckStatus>;

export const PACKAGE_SORTS = ['plannedLiftDate', '-plannedLiftDate', 'updatedAt', '-updatedAt', 'reference', '-reference'] as const;

export const PackageListQuery = z.object({
  status: z.enum(PACKAGE_STATUSES).optional(),
  siteId: z.uuid().optional(),
  q: z.string().trim().max(100, 'q must be at most 100 characters').optional(),
  sort: z.enum(PACKAGE_SORTS).default('plannedLiftDate'),
  page: z.coerce.number().int().min(1, 'page must be 1 or more').max(10_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(100, 'pageSize must be at most 100').default(25),
});
export type PackageListQuery = z.infer<typeof PackageListQuery>;

export const PackageSummary = z.object({
  id: z.uuid(),
  reference: z.string(),
  title: z.string(),
  status: PackageStatus,
  site: z.object({ id: z.uuid(), name: z.string() }),
  contractor: z.object({ id: z.uuid(), name: z.string() }),
  plannedLiftDate: z.string().nullable(),
  revisionNumber: z.number().int(),
  engineer: z.object({ id: z.uuid(), name: z.string() }).nullable(),
  critical: z.boolean(),
  worstStatus: CheckStatus.nullable(),
  openDiscrepancies: z.number().int(),
  decision: Decision.nullable(),
  updatedAt: z.string(),
});
export type PackageSummary = z.infer<typeof PackageSummary>;

export const PackageListResponse = z.object({
  items: z.array(PackageSummary),
  total: z.number().int(),
  page: z.number().int(),
  pageSize: z.number().int(),
  countsByStatus: z.record(z.string(), z.number().int()),
});
export type PackageListResponse = z.infer<typeof PackageListResponse>;
