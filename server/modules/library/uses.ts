// A package's use of the library: which version each crane slot of a revision uses, whether the
// chart was detached as a copy (and which cells the copy changed), and the desk's verifications.
import type { Actor } from '@shared/rules/actor';
import type { DataSource, EntityManager } from 'typeorm';
import type { z } from 'zod';
import type { LibraryUse, LibraryUseBody } from '@shared/schemas/library';
import { changedCells, craneLabel } from '@shared/library/to-lift-input';
import { AppError } from '../../lib/app-error';
import { Revision } from '../packages/package.entity';
import { findScopedPackage } from '../packages/package-scope';
import { Site } from '../sites/site.entity';
import { LibraryConfiguration, LibraryUseRow, LibraryVersion } from './library.entity';
import { audit } from './library-audit';
import { readableVersion } from './library-scope';
import { cellsOf, gridOf, names, verificationsFor } from './version-summaries';

type U = Actor;

type ChartRows = NonNullable<Parameters<typeof changedCells>[1]>;

/** Rows are read field by field by changedCells (a non-number reads as no value), so an array of objects is enough. */
const isRows = (x: unknown): x is ChartRows =>
  Array.isArray(x) && x.every((r) => typeof r === 'object' && r !== null);

function chartRowsOf(inputs: Record<string, unknown>, slot: number): ChartRows | undefined {
  const chart = (c: unknown) =>
    typeof c === 'object' && c !== null ? (c as { rows?: unknown }).rows : undefined;
  const rows =
    slot === 0
      ? chart(inputs.chart)
      : chart(
          (inputs.multiCrane as { others?: { chart?: unknown }[] } | undefined)?.others?.[slot - 1]?.chart,
        );
  return isRows(rows) ? rows : undefined;
}

export async function listUses(ds: DataSource, user: U, packageId: string): Promise<{ items: LibraryUse[] }> {
  const m = ds.manager;
  const pkg = await findScopedPackage(m, user, packageId);
  const revision = await m
    .getRepository(Revision)
    .findOneByOrFail({ packageId: pkg.id, number: pkg.currentRevision });
  const uses = await m
    .getRepository(LibraryUseRow)
    .find({ where: { revisionId: revision.id }, order: { slot: 'ASC' } });
  if (!uses.length) return { items: [] };
  // The desk of a package is the owner of its site: its verifications show, no other desk's.
  const site = await m.getRepository(Site).findOneByOrFail({ id: pkg.siteId });
  const ids = uses.map((u) => u.versionId);
  const versions = await m
    .getRepository(LibraryVersion)
    .createQueryBuilder('v')
    .where('v.id IN (:...ids)', { ids })
    .getMany();
  const configs = await m
    .getRepository(LibraryConfiguration)
    .createQueryBuilder('k')
    .where('k.id IN (:...ids)', { ids: versions.map((v) => v.configurationId) })
    .getMany();
  const cells = await cellsOf(m, ids);
  const verifications = await verificationsFor(m, ids, site.ownerOrganisationId);
  const who = await names(
    m,
    verifications.map((v) => v.engineerId),
  );
  return {
    items: uses.map((u) => {
      const v = versions.find((x) => x.id === u.versionId)!;
      const k = configs.find((x) => x.id === v.configurationId)!;
      const grid = gridOf(v, cells.get(v.id));
      return {
        slot: u.slot,
        version: {
          id: v.id,
          number: v.number,
          configurationId: k.id,
          configurationName: k.name,
          crane: craneLabel({ crane: { ...v.craneSnapshot, id: k.craneId } }),
        },
        detached: u.detached,
        changedCells: changedCells(grid, chartRowsOf(revision.inputs, u.slot)),
        units: v.chartUnits,
        verifications: verifications
          .filter((x) => x.versionId === v.id)
          .map((x) => ({
            id: x.id,
            engineer: { id: x.engineerId, name: who.get(x.engineerId) ?? 'unknown' },
            note: x.note,
            at: x.createdAt.toISOString(),
          })),
      };
    }),
  };
}

async function draftRevision(m: EntityManager, user: U, packageId: string) {
  const pkg = await findScopedPackage(m, user, packageId);
  const revision = await m
    .getRepository(Revision)
    .findOneByOrFail({ packageId: pkg.id, number: pkg.currentRevision });
  if (revision.state !== 'draft')
    throw new AppError(
      409,
      'already_submitted',
      `Revision ${revision.number} is submitted; the crane it used can no longer change.`,
    );
  return { pkg, revision };
}

export async function setUse(
  ds: DataSource,
  user: U,
  packageId: string,
  body: z.infer<typeof LibraryUseBody>,
) {
  await ds.transaction(async (m) => {
    const { pkg, revision } = await draftRevision(m, user, packageId);
    const { version, config } = await readableVersion(m, user, body.versionId);
    if (version.retiredAt)
      throw new AppError(
        409,
        'version_retired',
        `Version ${version.number} of ${config.name} is retired: pick the current version.`,
        [{ path: 'versionId', message: 'version is retired' }],
      );
    const existing = await m
      .getRepository(LibraryUseRow)
      .findOneBy({ revisionId: revision.id, slot: body.slot });
    if (existing) await m.getRepository(LibraryUseRow).delete(existing.id);
    await m.getRepository(LibraryUseRow).save({
      revisionId: revision.id,
      packageId: pkg.id,
      slot: body.slot,
      versionId: version.id,
      detached: body.detached,
    });
    await audit(
      m,
      user,
      body.detached ? 'library.copy_detached' : 'library.version_picked',
      { revision: revision.number, slot: body.slot, configuration: config.name, version: version.number },
      pkg.id,
    );
  });
  return listUses(ds, user, packageId);
}

export async function removeUse(ds: DataSource, user: U, packageId: string, slot: number) {
  await ds.transaction(async (m) => {
    const { pkg, revision } = await draftRevision(m, user, packageId);
    const existing = await m.getRepository(LibraryUseRow).findOneBy({ revisionId: revision.id, slot });
    if (!existing) throw AppError.notFound('library crane on this package');
    await m.getRepository(LibraryUseRow).delete(existing.id);
    await audit(m, user, 'library.use_removed', { revision: revision.number, slot }, pkg.id);
  });
}

/**
 * A crane of a lift with several cranes was removed from the draft (`slot` 1 to 3), or the lift went
 * back to one crane (`slot` null: every other crane). In one transaction, with the revision locked
 * so two removals cannot interleave: the removed crane's use goes, and the uses of the cranes after
 * it move up one slot with them (the lift input's `multiCrane.others` closes up the same way). The
 * lead crane's use (slot 0) never changes here.
 */
export async function craneRemoved(ds: DataSource, user: U, packageId: string, slot: number | null) {
  await ds.transaction(async (m) => {
    const { pkg, revision } = await draftRevision(m, user, packageId);
    await m
      .getRepository(Revision)
      .createQueryBuilder('r')
      .setLock('pessimistic_write')
      .where('r.id = :id', { id: revision.id })
      .getOne();
    const repo = m.getRepository(LibraryUseRow);
    const others = await repo
      .createQueryBuilder('u')
      .where('u.revision_id = :id AND u.slot > 0', { id: revision.id })
      .orderBy('u.slot', 'ASC')
      .getMany();
    const removed = others.filter((u) => slot === null || u.slot === slot);
    if (removed.length) await repo.delete(removed.map((u) => u.id));
    // Upwards in slot order: each row moves into a slot already emptied, so (revision, slot) stays unique.
    const moved: { from: number; to: number }[] = [];
    for (const u of others)
      if (slot !== null && u.slot > slot) {
        await repo.update(u.id, { slot: u.slot - 1 });
        moved.push({ from: u.slot, to: u.slot - 1 });
      }
    await audit(
      m,
      user,
      'library.crane_removed',
      { revision: revision.number, slot, removed: removed.map((u) => u.slot), moved },
      pkg.id,
    );
  });
  return listUses(ds, user, packageId);
}

/** A new revision starts from the previous one's inputs: it keeps the library versions it used. */
export async function carryLibraryUses(m: EntityManager, fromRevisionId: string, toRevisionId: string) {
  await m.query(
    `INSERT INTO library_uses (revision_id, package_id, slot, version_id, detached)
     SELECT $2, package_id, slot, version_id, detached FROM library_uses WHERE revision_id = $1`,
    [fromRevisionId, toRevisionId],
  );
}
