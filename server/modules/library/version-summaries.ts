// Reading the fleet library in bulk: the cells of versions, who made them, how many packages use
// them and one owner desk's verifications, folded into the summaries the cranes and versions show.
import type { Actor } from '@shared/rules/actor';
import type { EntityManager } from 'typeorm';
import { gridFromCells, type ChartGrid } from '@shared/library/chart-grid';
import { gridDifference } from '@shared/library/to-lift-input';
import { User } from '../users/user.entity';
import { LibraryChartCell, LibraryVerification, LibraryVersion } from './library.entity';

type U = Actor;

export async function cellsOf(
  m: EntityManager,
  versionIds: string[],
): Promise<Map<string, LibraryChartCell[]>> {
  const out = new Map<string, LibraryChartCell[]>();
  if (!versionIds.length) return out;
  const rows = await m
    .getRepository(LibraryChartCell)
    .createQueryBuilder('c')
    .where('c.version_id IN (:...ids)', { ids: versionIds })
    .getMany();
  for (const r of rows) {
    const list = out.get(r.versionId) ?? [];
    list.push(r);
    out.set(r.versionId, list);
  }
  return out;
}

export const gridOf = (v: LibraryVersion, cells: LibraryChartCell[] | undefined): ChartGrid =>
  gridFromCells(v.chartUnits, cells ?? []);

export async function names(m: EntityManager, ids: string[]): Promise<Map<string, string>> {
  const unique = [...new Set(ids.filter(Boolean))];
  if (!unique.length) return new Map();
  const users = await m
    .getRepository(User)
    .createQueryBuilder('u')
    .where('u.id IN (:...ids)', { ids: unique })
    .getMany();
  return new Map(users.map((u) => [u.id, u.name]));
}

export async function useCounts(m: EntityManager, versionIds: string[]): Promise<Map<string, number>> {
  if (!versionIds.length) return new Map();
  const rows: { version_id: string; n: string }[] = await m.query(
    `SELECT version_id, count(DISTINCT package_id) AS n FROM library_uses WHERE version_id = ANY($1) GROUP BY version_id`,
    [versionIds],
  );
  return new Map(rows.map((r) => [r.version_id, Number(r.n)]));
}

/** Verifications of one owner desk (never another's). */
export async function verificationsFor(m: EntityManager, versionIds: string[], deskId: string | null) {
  if (!versionIds.length || !deskId) return [];
  return m
    .getRepository(LibraryVerification)
    .createQueryBuilder('v')
    .where('v.version_id IN (:...ids) AND v.owner_organisation_id = :desk', { ids: versionIds, desk: deskId })
    .getMany();
}

/** The owner desk whose verifications a reader sees outside a package: the owner side's own. */
export const readerDesk = (user: U) => (user.organisationKind === 'owner' ? user.organisationId : null);

export async function versionSummaries(m: EntityManager, versions: LibraryVersion[], deskId: string | null) {
  const ids = versions.map((v) => v.id);
  const [cells, counts, who, verified] = await Promise.all([
    cellsOf(m, ids),
    useCounts(m, ids),
    names(
      m,
      versions.map((v) => v.createdById),
    ),
    verificationsFor(m, ids, deskId),
  ]);
  const sorted = [...versions].sort((a, b) => a.number - b.number);
  return sorted.map((v, i) => {
    const before = sorted[i - 1];
    return {
      id: v.id,
      number: v.number,
      createdAt: v.createdAt.toISOString(),
      createdBy: { id: v.createdById, name: who.get(v.createdById) ?? 'unknown' },
      changeNote: v.changeNote,
      retiredAt: v.retiredAt?.toISOString() ?? null,
      usedBy: counts.get(v.id) ?? 0,
      cellsChanged: before
        ? gridDifference(gridOf(before, cells.get(before.id)), gridOf(v, cells.get(v.id))).length
        : null,
      verified: verified.some((x) => x.versionId === v.id),
    };
  });
}
