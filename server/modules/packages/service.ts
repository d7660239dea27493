// Reading lift packages: the list behind the contractor's desk, the reviewer's queue and
// the engineer's assignments (server-side filter, sort and paging), and one package.
import type { DataSource } from 'typeorm';
import type { PackageListQuery, PackageListResponse, PackageSummary } from '@shared/schemas/packages';
import { Revision, type LiftPackage } from './package.entity';
import { findScopedPackage, scopedPackages } from './package-scope';

const SORT_COLUMNS: Record<string, string> = {
  plannedLiftDate: 'p.planned_lift_date',
  updatedAt: 'p.updated_at',
  reference: 'p.reference',
};

export function toSummary(p: LiftPackage): PackageSummary {
  return {
    id: p.id,
    reference: p.reference,
    title: p.title,
    status: p.status,
    site: { id: p.site!.id, name: p.site!.name },
    contractor: { id: p.contractor!.id, name: p.contractor!.name },
    plannedLiftDate: p.plannedLiftDate,
    revisionNumber: p.currentRevision,
    engineer: p.assignedEngineer ? { id: p.assignedEngineer.id, name: p.assignedEngineer.name } : null,
    critical: p.critical,
    worstStatus: p.worstStatus,
    openDiscrepancies: p.openDiscrepancies,
    decision: p.decision,
    updatedAt: p.updatedAt.toISOString(),
  };
}

export async function listPackages(
  dataSource: DataSource,
  user: Express.User,
  query: PackageListQuery,
): Promise<PackageListResponse> {
  const manager = dataSource.manager;
  const filtered = scopedPackages(manager, user)
    .leftJoinAndSelect('p.site', 'site')
    .leftJoinAndSelect('p.contractor', 'contractor')
    .leftJoinAndSelect('p.assignedEngineer', 'engineer');
  if (query.siteId) filtered.andWhere('p.site_id = :siteId', { siteId: query.siteId });
  if (query.q) {
    filtered.andWhere('(p.reference ILIKE :q OR p.title ILIKE :q)', { q: `%${query.q.replace(/[%_\\]/g, '\\$&')}%` });
  }
  const counts = await filtered
    .clone()
    .select('p.status', 'status')
    .addSelect('count(*)::int', 'n')
    .groupBy('p.status')
    .orderBy()
    .getRawMany<{ status: string; n: number }>();
  if (query.status) filtered.andWhere('p.status = :status', { status: query.status });
  const desc = query.sort.startsWith('-');
  const column = SORT_COLUMNS[query.sort.replace(/^-/, '')];
  filtered
    .orderBy(column, desc ? 'DESC' : 'ASC', desc ? 'NULLS LAST' : 'NULLS LAST')
    .addOrderBy('p.reference', 'ASC')
    .skip((query.page - 1) * query.pageSize)
    .take(query.pageSize);
  const [rows, total] = await filtered.getManyAndCount();
  return {
    items: rows.map(toSummary),
    total,
    page: query.page,
    pageSize: query.pageSize,
    countsByStatus: Object.fromEntries(counts.map((c) => [c.status, Number(c.n)])),
  };
}

export async function getPackage(dataSource: DataSource, user: Express.User, id: string) {
  const found = await findScopedPackage(dataSource.manager, user, id);
  const full = await dataSource.getRepository(found.constructor as typeof LiftPackage).findOneOrFail({
    where: { id: found.id },
    relations: { site: true, contractor: true, assignedEngineer: true },
  });
  const revisions = await dataSource.getRepository(Revision).find({
    where: { packageId: id },
    order: { number: 'DESC' },
  });
  return {
    package: toSummary(full),
    revisions: revisions.map((r) => ({
      id: r.id,
      number: r.number,
      state: r.state,
      submittedAt: r.submittedAt?.toISOString() ?? null,
      checkStatus: r.checkStatus,
      checkProgress: r.checkProgress,
      checkError: r.checkError,
      resultVersion: r.resultVersion,
    })),
    latestResults: revisions.find((r) => r.results)?.results ?? null,
  };
}
