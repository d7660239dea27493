// The scoped package list (reviewer's queue, contractor's desk, engineer's assignments), built to
// stay quick at 100,000 packages:
//   - the scope is a semi-join on the package row (package-scope.ts), never a join and a group;
//   - a page is a keyset range from the cursor over the sort's own index (list-cursor.ts), the
//     site, contractor and engineer names joined only for the rows of the page (many-to-one);
//   - the counts by status come from the counts a trigger keeps (package_status_counts) when the
//     filters are ones they answer (scope, site, contractor); otherwise from one pass over at most
//     COUNT_LIMIT + 1 matching packages: exact within it, lower bounds ("at least") beyond;
//   - the search runs on the trigram indexes of reference and title.
import { isReviewOverdue } from '@shared/rules/review-due';
import type { Actor } from '@shared/rules/actor';
import type { DataSource, EntityManager, SelectQueryBuilder } from 'typeorm';
import { PACKAGE_STATUSES, type PackageStatus } from '@shared/schemas/common';
import type { PackageListQuery, PackageListResponse, PackageSummary } from '@shared/schemas/packages';
import type { LiftPackage } from './package.entity';
import { preparedQuery } from '../../db/prepared';
import { scopedPackages, scopedStatusCounts } from './package-scope';
import { decodeCursor, encodeCursor, sortKey, type Cursor } from './list-cursor';

/** With filters the kept counts cannot answer, the packages counted at most (+ 1 to know there are more). */
export const COUNT_LIMIT = 1000;

/** The scope and every filter but the status (the counts are by status). */
function filteredPackages(manager: EntityManager, user: Actor, query: PackageListQuery) {
  const qb = scopedPackages(manager, user);
  if (query.siteId) qb.andWhere('p.site_id = :siteId', { siteId: query.siteId });
  if (query.contractorId)
    qb.andWhere('p.contractor_organisation_id = :contractorId', { contractorId: query.contractorId });
  if (query.engineerId === 'none') qb.andWhere('p.assigned_engineer_id IS NULL');
  else if (query.engineerId)
    qb.andWhere('p.assigned_engineer_id = :engineerId', { engineerId: query.engineerId });
  if (query.critical !== undefined) qb.andWhere('p.critical = :critical', { critical: query.critical });
  if (query.discrepancies === true) qb.andWhere('p.open_discrepancies > 0');
  if (query.discrepancies === false) qb.andWhere('p.open_discrepancies = 0');
  if (query.liftWithinDays !== undefined) {
    // Written on the ascending sort's index expression; a missing date (infinity) never qualifies.
    qb.andWhere(
      `coalesce(p.planned_lift_date, 'infinity'::date) <= current_date + make_interval(days => :within)`,
      { within: query.liftWithinDays },
    );
  }
  if (query.revisionMin)
    qb.andWhere('p.current_revision >= :revisionMin', { revisionMin: query.revisionMin });
  if (query.q) {
    qb.andWhere('(p.reference ILIKE :q OR p.title ILIKE :q)', {
      q: `%${query.q.replace(/[%_\\]/g, '\\$&')}%`,
    });
  }
  return qb;
}

interface Counts {
  counts: Record<string, number>;
  over: PackageStatus[];
}

/** Filters the kept counts cannot answer: with any of them on, the counts are bounded counts. */
const NOT_KEPT = ['engineerId', 'critical', 'discrepancies', 'liftWithinDays', 'revisionMin', 'q'] as const;

async function countsByStatus(dataSource: DataSource, user: Actor, query: PackageListQuery): Promise<Counts> {
  const manager = dataSource.manager;
  const kept = NOT_KEPT.some((k) => query[k] !== undefined) ? null : scopedStatusCounts(manager, user);
  if (kept) {
    if (query.siteId) kept.andWhere('c.site_id = :siteId', { siteId: query.siteId });
    if (query.contractorId)
      kept.andWhere('c.contractor_organisation_id = :contractorId', { contractorId: query.contractorId });
    const [sql, params] = kept
      .select('c.status', 'status')
      .addSelect('sum(c.n)::int', 'n')
      .groupBy('c.status')
      .getQueryAndParameters();
    const rows = await preparedQuery<{ status: string; n: number }>(dataSource, sql, params);
    return { counts: Object.fromEntries(rows.filter((r) => r.n > 0).map((r) => [r.status, r.n])), over: [] };
  }
  // One pass over at most COUNT_LIMIT + 1 matching packages, whatever the scope (a count per
  // status would repeat the filter's scan, the search's trigram bitmap, once per status). Within the
  // limit the counts are exact; beyond it every status's count is a lower bound ("at least").
  const [inner, params] = filteredPackages(manager, user, query)
    .select('p.status', 'status')
    .limit(COUNT_LIMIT + 1)
    .getQueryAndParameters();
  const rows = await preparedQuery<{ status: PackageStatus; n: number }>(
    dataSource,
    `SELECT status, count(*)::int AS n FROM (${inner}) x GROUP BY status`,
    params,
  );
  const counts = Object.fromEntries(rows.map((r) => [r.status, r.n]));
  const seen = rows.reduce((sum, r) => sum + r.n, 0);
  return { counts, over: seen > COUNT_LIMIT ? [...PACKAGE_STATUSES] : [] };
}

interface Row {
  id: string;
  reference: string;
  title: string;
  status: PackageSummary['status'];
  planned_lift_date: string | null;
  review_due_on: string | null;
  current_revision: number;
  critical: boolean;
  worst_status: PackageSummary['worstStatus'];
  open_discrepancies: number;
  decision: PackageSummary['decision'];
  updated_at: Date;
  site_id: string;
  site_name: string;
  contractor_id: string;
  contractor_name: string;
  engineer_id: string | null;
  engineer_name: string | null;
  sort_key: string;
}

function pageOf(qb: SelectQueryBuilder<LiftPackage>, query: PackageListQuery, cursor: Cursor | null) {
  const key = sortKey(query.sort);
  const before = cursor?.direction === 'before';
  // Walking back reads the index the other way and turns the rows round afterwards.
  const descending = key.desc !== before;
  if (cursor) {
    qb.andWhere(
      `(${key.expr}, p.reference) ${descending ? '<' : '>'} (CAST(:cursorKey AS ${key.type}), :cursorRef)`,
      {
        cursorKey: cursor.key,
        cursorRef: cursor.reference,
      },
    );
  } else if (query.page > 1) qb.offset((query.page - 1) * query.pageSize);
  const dir = descending ? 'DESC' : 'ASC';
  return qb
    .innerJoin('p.site', 'site')
    .innerJoin('p.contractor', 'contractor')
    .leftJoin('p.assignedEngineer', 'engineer')
    .select([
      'p.id AS id',
      'p.reference AS reference',
      'p.title AS title',
      'p.status AS status',
      'p.planned_lift_date::text AS planned_lift_date',
      'p.review_due_on::text AS review_due_on',
      'p.current_revision AS current_revision',
      'p.critical AS critical',
      'p.worst_status AS worst_status',
      'p.open_discrepancies AS open_discrepancies',
      'p.decision AS decision',
      'p.updated_at AS updated_at',
      'site.id AS site_id',
      'site.name AS site_name',
      'contractor.id AS contractor_id',
      'contractor.name AS contractor_name',
      'engineer.id AS engineer_id',
      'engineer.name AS engineer_name',
      `(${key.expr})::text AS sort_key`,
    ])
    .orderBy(key.expr, dir)
    .addOrderBy('p.reference', dir)
    .limit(query.pageSize + 1);
}

const todayIso = () => new Date().toISOString().slice(0, 10);

const toItem = (r: Row): PackageSummary => ({
  id: r.id,
  reference: r.reference,
  title: r.title,
  status: r.status,
  site: { id: r.site_id, name: r.site_name },
  contractor: { id: r.contractor_id, name: r.contractor_name },
  plannedLiftDate: r.planned_lift_date,
  reviewDueOn: r.review_due_on,
  reviewOverdue: isReviewOverdue(r.review_due_on, r.status, todayIso()),
  revisionNumber: r.current_revision,
  engineer: r.engineer_id ? { id: r.engineer_id, name: r.engineer_name ?? '' } : null,
  critical: r.critical,
  worstStatus: r.worst_status,
  openDiscrepancies: r.open_discrepancies,
  decision: r.decision,
  updatedAt: r.updated_at.toISOString(),
});

export async function listPackages(
  dataSource: DataSource,
  user: Actor,
  query: PackageListQuery,
): Promise<PackageListResponse> {
  const manager = dataSource.manager;
  const cursor = query.cursor ? decodeCursor(query.cursor, query.sort) : null;
  const qb = filteredPackages(manager, user, query);
  if (query.status) qb.andWhere('p.status = :status', { status: query.status });
  const [fetched, { counts, over }] = await Promise.all([
    preparedQuery<Row>(dataSource, ...pageOf(qb, query, cursor).getQueryAndParameters()),
    countsByStatus(dataSource, user, query),
  ]);
  const more = fetched.length > query.pageSize;
  const rows = fetched.slice(0, query.pageSize);
  const before = cursor?.direction === 'before';
  if (before) rows.reverse();
  const at = (r: Row | undefined, direction: Cursor['direction']) =>
    r ? encodeCursor({ sort: query.sort, key: r.sort_key, reference: r.reference, direction }) : null;
  // Forward: a next page when a row beyond this one came back, a previous one unless this is the
  // start. Backward: the rows we came from follow, and a previous page when a row before came back.
  const hasNext = before || more;
  const hasPrevious = before ? more : cursor !== null || query.page > 1;
  const counted: readonly PackageStatus[] = query.status ? [query.status] : PACKAGE_STATUSES;
  return {
    items: rows.map(toItem),
    total: counted.reduce((sum, s) => sum + (counts[s] ?? 0), 0),
    page: query.page,
    pageSize: query.pageSize,
    countsByStatus: counts,
    countLimit: COUNT_LIMIT,
    countsOverLimit: over,
    totalOverLimit: counted.some((s) => over.includes(s)),
    nextCursor: hasNext ? at(rows.at(-1), 'after') : null,
    previousCursor: hasPrevious ? at(rows[0], 'before') : null,
  };
}
