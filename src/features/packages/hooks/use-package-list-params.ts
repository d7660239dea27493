// The list's filters live in the URL (?status=&siteId=&contractorId=&engineerId=&critical=
// &discrepancies=&liftWithinDays=&revisionMin=&q=&sort=&cursor=&page=&pageSize=), so a filtered
// queue can be bookmarked, shared and restored with the back button. Values that the
// server would refuse are dropped here rather than sent.
import { useCallback, useMemo } from 'react';
import { useSearchParams } from 'react-router-dom';
import { PACKAGE_STATUSES, type PackageStatus } from '@shared/schemas/common';
import { PACKAGE_SORTS } from '@shared/schemas/packages';
import { NARROWING_FILTERS, type PackageListFilters } from '@/lib/query-keys';

export type PackageSort = PackageListFilters['sort'];
export const DEFAULT_SORT: PackageSort = 'plannedLiftDate';
export const PAGE_SIZES = [25, 50, 100] as const;
export const DEFAULT_PAGE_SIZE = 25;

function isStatus(value: string | null): value is PackageStatus {
  return value !== null && (PACKAGE_STATUSES as readonly string[]).includes(value);
}

function isSort(value: string | null): value is PackageSort {
  return value !== null && (PACKAGE_SORTS as readonly string[]).includes(value);
}

const CURSOR = /^[A-Za-z0-9_-]{1,600}$/;
const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

function uuid(value: string | null): string | undefined {
  return value && UUID.test(value) ? value : undefined;
}

function flag(value: string | null): boolean | undefined {
  return value === 'true' ? true : value === 'false' ? false : undefined;
}

function boundedInt(value: string | null, min: number, max: number): number | undefined {
  if (value === null || value === '') return undefined;
  const number = Number(value);
  return Number.isInteger(number) && number >= min && number <= max ? number : undefined;
}

function positiveInt(value: string | null, fallback: number, max: number): number {
  const number = Number(value);
  return Number.isInteger(number) && number >= 1 && number <= max ? number : fallback;
}

export function readPackageListParams(params: URLSearchParams): PackageListFilters {
  const status = params.get('status');
  const sort = params.get('sort');
  const q = params.get('q')?.trim().slice(0, 100);
  const engineerId = params.get('engineerId');
  const pageSize = positiveInt(params.get('pageSize'), DEFAULT_PAGE_SIZE, 100);
  return {
    status: isStatus(status) ? status : undefined,
    siteId: uuid(params.get('siteId')),
    contractorId: uuid(params.get('contractorId')),
    engineerId: engineerId === 'none' ? 'none' : uuid(engineerId),
    critical: flag(params.get('critical')),
    discrepancies: flag(params.get('discrepancies')),
    liftWithinDays: boundedInt(params.get('liftWithinDays'), 0, 365),
    revisionMin: boundedInt(params.get('revisionMin'), 1, 1000),
    q: q ? q : undefined,
    sort: isSort(sort) ? sort : DEFAULT_SORT,
    cursor: CURSOR.test(params.get('cursor') ?? '') ? params.get('cursor')! : undefined,
    page: positiveInt(params.get('page'), 1, 10_000),
    pageSize,
  };
}

export type ListChanges = Partial<{ [K in keyof PackageListFilters]: PackageListFilters[K] | undefined }>;

export function usePackageListParams() {
  const [params, setParams] = useSearchParams();
  const filters = useMemo(() => readPackageListParams(params), [params]);

  /** Changing anything but the page goes back to page 1 (no cursor); defaults are left out of the URL. */
  const update = useCallback(
    (changes: ListChanges, options: { replace?: boolean } = {}) => {
      setParams(
        (current) => {
          const next = new URLSearchParams(current);
          for (const [key, value] of Object.entries(changes)) {
            if (value === undefined || value === '' || value === null) next.delete(key);
            else next.set(key, String(value));
          }
          if (!('page' in changes)) next.delete('page');
          if (!('cursor' in changes)) next.delete('cursor');
          if (next.get('page') === '1') next.delete('page');
          if (next.get('sort') === DEFAULT_SORT) next.delete('sort');
          if (next.get('pageSize') === String(DEFAULT_PAGE_SIZE)) next.delete('pageSize');
          return next;
        },
        { replace: options.replace },
      );
    },
    [setParams],
  );

  return { filters, update };
}

export function isFiltered(filters: PackageListFilters): boolean {
  return NARROWING_FILTERS.some((key) => filters[key] !== undefined);
}

/** Every narrowing filter off, for "clear the filters". */
export const NO_FILTERS = Object.fromEntries(NARROWING_FILTERS.map((key) => [key, undefined])) as ListChanges;
