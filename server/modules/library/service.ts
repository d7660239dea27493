// The fleet library's domain: a contractor keeps its cranes and configurations; each edit of a
// configuration writes a new version (the old ones never change); a version a package uses can
// be retired but not deleted. The owner side sees a version only through a package on its sites
// that uses it, and an owner desk's engineer verifies a version for that desk alone.
import type { DataSource, EntityManager } from 'typeorm';
import type { z } from 'zod';
import type {
  ConfigurationBody,
  ConfigurationDetail,
  CraneBody,
  CraneDetail,
  CraneListQuery,
  CranePatch,
  CraneSummary,
  LibraryUse,
  LibraryUseBody,
  VersionBody,
  VersionDetail,
} from '@shared/schemas/library';
import { TO_SI } from '@shared/engineering/units';
import { gridCells, gridFromCells, type ChartGrid } from '@shared/library/chart-grid';
import { capacityAtRadius, changedCells, craneLabel, gridDifference } from '@shared/library/to-lift-input';
import { AppError } from '../../lib/app-error';
import { sha256, type Storage } from '../../lib/storage';
import { AuditEvent } from '../audit/audit-event.entity';
import { checkFileName, inspectPdf } from '../files/pdf-check';
import { LiftPackage, Revision } from '../packages/package.entity';
import { findScopedPackage, scopedPackages } from '../packages/package-scope';
import { Site } from '../sites/site.entity';
import { User } from '../users/user.entity';
import {
  LibraryChartCell,
  LibraryConfiguration,
  LibraryCrane,
  LibraryUseRow,
  LibraryVerification,
  LibraryVersion,
} from './library.entity';

type U = Express.User;

async function audit(
  m: EntityManager,
  user: U,
  action: string,
  detail: Record<string, unknown>,
  packageId?: string,
) {
  await m.getRepository(AuditEvent).save({
    packageId: packageId ?? null,
    organisationId: user.organisationId,
    actorId: user.id,
    action,
    detail,
  });
}

// ---- scope ----------------------------------------------------------------------------------

async function ownCrane(m: EntityManager, user: U, id: string): Promise<LibraryCrane> {
  const crane = await m.getRepository(LibraryCrane).findOneBy({ id, organisationId: user.organisationId });
  if (!crane || user.role !== 'contractor') throw AppError.notFound('crane');
  return crane;
}

async function ownConfiguration(m: EntityManager, user: U, id: string) {
  const config = await m.getRepository(LibraryConfiguration).findOneBy({ id });
  if (!config) throw AppError.notFound('configuration');
  const crane = await ownCrane(m, user, config.craneId).catch(() => {
    throw AppError.notFound('configuration');
  });
  return { config, crane };
}

/** A version the user may read: the contractor's own, or one a package in the user's scope uses. */
async function readableVersion(m: EntityManager, user: U, id: string) {
  const version = await m.getRepository(LibraryVersion).findOneBy({ id });
  if (!version) throw AppError.notFound('configuration version');
  const config = await m.getRepository(LibraryConfiguration).findOneByOrFail({ id: version.configurationId });
  const crane = await m.getRepository(LibraryCrane).findOneByOrFail({ id: config.craneId });
  if (user.role === 'contractor') {
    if (crane.organisationId !== user.organisationId) throw AppError.notFound('configuration version');
  } else {
    const used = await scopedPackages(m, user)
      .innerJoin(LibraryUseRow, 'u', 'u.package_id = p.id')
      .andWhere('u.version_id = :vid', { vid: id })
      .getCount();
    if (!used) throw AppError.notFound('configuration version');
  }
  return { version, config, crane };
}

async function ownVersion(m: EntityManager, user: U, id: string) {
  const found = await readableVersion(m, user, id);
  if (user.role !== 'contractor')
    throw AppError.forbidden('Only the contractor that keeps the crane can change it.');
  return found;
}

// ---- reading --------------------------------------------------------------------------------

async function cellsOf(m: EntityManager, versionIds: string[]): Promise<Map<string, LibraryChartCell[]>> {
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

const gridOf = (v: LibraryVersion, cells: LibraryChartCell[] | undefined): ChartGrid =>
  gridFromCells(v.chartUnits, cells ?? []);

async function names(m: EntityManager, ids: string[]): Promise<Map<string, string>> {
  const unique = [...new Set(ids.filter(Boolean))];
  if (!unique.length) return new Map();
  const users = await m
    .getRepository(User)
    .createQueryBuilder('u')
    .where('u.id IN (:...ids)', { ids: unique })
    .getMany();
  return new Map(users.map((u) => [u.id, u.name]));
}

async function useCounts(m: EntityManager, versionIds: string[]): Promise<Map<string, number>> {
  if (!versionIds.length) return new Map();
  const rows: { version_id: string; n: string }[] = await m.query(
    `SELECT version_id, count(DISTINCT package_id) AS n FROM library_uses WHERE version_id = ANY($1) GROUP BY version_id`,
    [versionIds],
  );
  return new Map(rows.map((r) => [r.version_id, Number(r.n)]));
}

/** Verifications of one owner desk (never another's). */
async function verificationsFor(m: EntityManager, versionIds: string[], deskId: string | null) {
  if (!versionIds.length || !deskId) return [];
  return m
    .getRepository(LibraryVerification)
    .createQueryBuilder('v')
    .where('v.version_id IN (:...ids) AND v.owner_organisation_id = :desk', { ids: versionIds, desk: deskId })
    .getMany();
}

/** The owner desk whose verifications a reader sees outside a package: the owner side's own. */
const readerDesk = (user: U) => (user.organisation.kind === 'owner' ? user.organisationId : null);

async function versionSummaries(m: EntityManager, versions: LibraryVersion[], deskId: string | null) {
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

export async function listCranes(ds: DataSource, user: U, query: z.infer<typeof CraneListQuery>) {
  const m = ds.manager;
  const qb = m.getRepository(LibraryCrane).createQueryBuilder('c').where('c.organisation_id = :org', {
    org: user.organisationId,
  });
  if (query.includeRetired !== 'true') qb.andWhere('c.retired_at IS NULL');
  if (query.q) {
    // Search words match the fleet number, make or model (parameters, never SQL text).
    qb.andWhere(
      `(c.fleet_number ILIKE :q OR c.make ILIKE :q OR c.model ILIKE :q OR (c.make || ' ' || c.model) ILIKE :q)`,
      {
        q: `%${query.q.replace(/[\\%_]/g, (x) => `\\${x}`)}%`,
      },
    );
  }
  const cranes = await qb.orderBy('c.fleet_number', 'ASC').getMany();
  const items: CraneSummary[] = [];
  for (const crane of cranes) {
    const summary = await craneSummary(m, user, crane, query);
    if (query.capacity !== undefined && query.radius !== undefined && summary.configurations.length === 0)
      continue;
    items.push(summary);
  }
  return { items };
}

async function craneSummary(
  m: EntityManager,
  user: U,
  crane: LibraryCrane,
  query?: Pick<
    z.infer<typeof CraneListQuery>,
    'radius' | 'radiusUnit' | 'capacity' | 'capacityUnit' | 'includeRetired'
  >,
): Promise<CraneSummary> {
  const configs = await m
    .getRepository(LibraryConfiguration)
    .find({ where: { craneId: crane.id }, order: { name: 'ASC' } });
  const current = configs.length
    ? await m
        .getRepository(LibraryVersion)
        .createQueryBuilder('v')
        .innerJoin(LibraryConfiguration, 'k', 'k.id = v.configuration_id AND k.current_version = v.number')
        .where('k.crane_id = :id', { id: crane.id })
        .getMany()
    : [];
  const summaries = await versionSummaries(m, current, readerDesk(user));
  const cells =
    query?.radius !== undefined
      ? await cellsOf(
          m,
          current.map((v) => v.id),
        )
      : new Map();
  const configurations = [];
  for (const k of configs) {
    if (k.retiredAt && query?.includeRetired !== 'true') continue;
    const v = current.find((x) => x.configurationId === k.id);
    if (!v) continue;
    let capacityAt: number | null = null;
    if (query?.radius !== undefined) {
      const si = capacityAtRadius(
        gridOf(v, cells.get(v.id)),
        query.radius * TO_SI[query.radiusUnit],
        v.notes.interpolationAllowed,
      );
      capacityAt = si === null ? null : si / TO_SI[v.chartUnits.capacity];
      if (
        query.capacity !== undefined &&
        (si === null || si < query.capacity * TO_SI[query.capacityUnit] * (1 - 1e-9))
      )
        continue;
    }
    configurations.push({
      id: k.id,
      name: k.name,
      retiredAt: k.retiredAt?.toISOString() ?? null,
      current: summaries.find((s) => s.id === v.id)!,
      workingArea: v.details.workingArea,
      capacityAtRadius: capacityAt,
      capacityUnit: v.chartUnits.capacity,
    });
  }
  return {
    id: crane.id,
    fleetNumber: crane.fleetNumber,
    make: crane.make,
    model: crane.model,
    type: crane.type,
    retiredAt: crane.retiredAt?.toISOString() ?? null,
    configurations,
  };
}

export async function getCrane(ds: DataSource, user: U, id: string): Promise<CraneDetail> {
  const crane = await ownCrane(ds.manager, user, id);
  return {
    ...(await craneSummary(ds.manager, user, crane, {
      radiusUnit: 'm',
      capacityUnit: 't',
      includeRetired: 'true',
    })),
    fixed: crane.fixed,
  };
}

export async function createCrane(ds: DataSource, user: U, body: CraneBody): Promise<CraneDetail> {
  const id = await ds.transaction(async (m) => {
    const clash = await m
      .getRepository(LibraryCrane)
      .findOneBy({ organisationId: user.organisationId, fleetNumber: body.fleetNumber });
    if (clash)
      throw new AppError(
        409,
        'fleet_number_taken',
        `Fleet number ${body.fleetNumber} is already in your library.`,
        [{ path: 'fleetNumber', message: 'fleetNumber must be unique in your fleet' }],
      );
    const crane = await m
      .getRepository(LibraryCrane)
      .save({ ...body, organisationId: user.organisationId, createdById: user.id });
    await audit(m, user, 'library.crane_added', { crane: crane.id, fleetNumber: crane.fleetNumber });
    return crane.id;
  });
  return getCrane(ds, user, id);
}

export async function patchCrane(ds: DataSource, user: U, id: string, patch: z.infer<typeof CranePatch>) {
  await ds.transaction(async (m) => {
    const crane = await ownCrane(m, user, id);
    if (patch.fleetNumber && patch.fleetNumber !== crane.fleetNumber) {
      const clash = await m
        .getRepository(LibraryCrane)
        .findOneBy({ organisationId: user.organisationId, fleetNumber: patch.fleetNumber });
      if (clash)
        throw new AppError(
          409,
          'fleet_number_taken',
          `Fleet number ${patch.fleetNumber} is already in your library.`,
          [{ path: 'fleetNumber', message: 'fleetNumber must be unique in your fleet' }],
        );
    }
    const changed = Object.keys(patch).filter(
      (k) =>
        JSON.stringify(patch[k as keyof typeof patch]) !== JSON.stringify(crane[k as keyof LibraryCrane]),
    );
    Object.assign(crane, patch);
    await m.getRepository(LibraryCrane).save(crane);
    // Versions already written keep the crane data they were made with; the next version takes this.
    await audit(m, user, 'library.crane_changed', {
      crane: crane.id,
      fleetNumber: crane.fleetNumber,
      changed,
    });
  });
  return getCrane(ds, user, id);
}

export async function retireCrane(ds: DataSource, user: U, id: string) {
  await ds.transaction(async (m) => {
    const crane = await ownCrane(m, user, id);
    crane.retiredAt = new Date();
    await m.getRepository(LibraryCrane).save(crane);
    await audit(m, user, 'library.crane_retired', { crane: crane.id, fleetNumber: crane.fleetNumber });
  });
  return getCrane(ds, user, id);
}

async function writeVersion(
  m: EntityManager,
  user: U,
  crane: LibraryCrane,
  configId: string,
  number: number,
  body: VersionBody,
) {
  const version = await m.getRepository(LibraryVersion).save({
    configurationId: configId,
    number,
    craneSnapshot: {
      fleetNumber: crane.fleetNumber,
      make: crane.make,
      model: crane.model,
      type: crane.type,
      fixed: crane.fixed,
    },
    details: body.details,
    notes: body.notes,
    document: body.document,
    chartUnits: body.chart.units,
    changeNote: body.changeNote ?? null,
    createdById: user.id,
  });
  const cells = gridCells(body.chart);
  if (cells.length)
    await m
      .createQueryBuilder()
      .insert()
      .into(LibraryChartCell)
      .values(cells.map((c) => ({ versionId: version.id, ...c })))
      .execute();
  return version;
}

export async function createConfiguration(
  ds: DataSource,
  user: U,
  craneId: string,
  body: z.infer<typeof ConfigurationBody>,
) {
  const id = await ds.transaction(async (m) => {
    const crane = await ownCrane(m, user, craneId);
    const config = await m
      .getRepository(LibraryConfiguration)
      .save({ craneId: crane.id, name: body.name, currentVersion: 1 });
    const v = await writeVersion(m, user, crane, config.id, 1, body.version);
    await audit(m, user, 'library.configuration_added', {
      crane: crane.id,
      configuration: config.id,
      name: config.name,
      version: v.number,
      cells: gridCells(body.version.chart).length,
    });
    return config.id;
  });
  return getConfiguration(ds, user, id);
}

export async function getConfiguration(ds: DataSource, user: U, id: string): Promise<ConfigurationDetail> {
  const { config } = await ownConfiguration(ds.manager, user, id);
  const versions = await ds.getRepository(LibraryVersion).find({ where: { configurationId: id } });
  return {
    id: config.id,
    craneId: config.craneId,
    name: config.name,
    retiredAt: config.retiredAt?.toISOString() ?? null,
    versions: await versionSummaries(ds.manager, versions, readerDesk(user)),
  };
}

export async function addVersion(ds: DataSource, user: U, configId: string, body: VersionBody) {
  const versionId = await ds.transaction(async (m) => {
    const { config, crane } = await ownConfiguration(m, user, configId);
    // Lock the configuration so two edits at once get numbers one after the other.
    await m.query('SELECT id FROM library_configurations WHERE id = $1 FOR UPDATE', [config.id]);
    const last: { n: number | null }[] = await m.query(
      'SELECT max(number) AS n FROM library_versions WHERE configuration_id = $1',
      [config.id],
    );
    const number = (last[0]?.n ?? 0) + 1;
    const before = await m
      .getRepository(LibraryVersion)
      .findOneBy({ configurationId: config.id, number: config.currentVersion });
    const v = await writeVersion(m, user, crane, config.id, number, body);
    await m
      .getRepository(LibraryConfiguration)
      .update(config.id, { currentVersion: number, retiredAt: null });
    const changes = before
      ? gridDifference(gridOf(before, (await cellsOf(m, [before.id])).get(before.id)), body.chart)
      : [];
    await audit(m, user, 'library.version_added', {
      configuration: config.id,
      name: config.name,
      version: number,
      from: before?.number ?? null,
      changeNote: body.changeNote ?? null,
      cellsChanged: changes.length,
      changes: changes.slice(0, 50),
    });
    return v.id;
  });
  return getVersion(ds, user, versionId);
}

export async function getVersion(
  ds: DataSource,
  user: U,
  id: string,
  deskId?: string | null,
): Promise<VersionDetail> {
  const m = ds.manager;
  const { version, config } = await readableVersion(m, user, id);
  const desk = deskId === undefined ? readerDesk(user) : deskId;
  const [summary] = await versionSummaries(m, [version], desk);
  // The history's cell count needs the version before.
  const before = await m
    .getRepository(LibraryVersion)
    .findOneBy({ configurationId: config.id, number: version.number - 1 });
  let cellsChanged: number | null = null;
  const cells = await cellsOf(m, before ? [before.id, version.id] : [version.id]);
  if (before)
    cellsChanged = gridDifference(
      gridOf(before, cells.get(before.id)),
      gridOf(version, cells.get(version.id)),
    ).length;
  const verifications = await verificationsFor(m, [version.id], desk);
  const who = await names(
    m,
    verifications.map((v) => v.engineerId),
  );
  const s = version.craneSnapshot;
  return {
    ...summary,
    cellsChanged,
    configurationId: config.id,
    configurationName: config.name,
    crane: {
      id: config.craneId,
      fleetNumber: s.fleetNumber,
      make: s.make,
      model: s.model,
      type: s.type,
      fixed: s.fixed,
    },
    details: version.details,
    notes: version.notes,
    document: {
      ...version.document,
      file: version.documentFile
        ? {
            name: version.documentFile.name,
            sizeBytes: version.documentFile.sizeBytes,
            pages: version.documentFile.pages,
          }
        : null,
    },
    chart: gridOf(version, cells.get(version.id)),
    verifications: verifications.map((v) => ({
      id: v.id,
      engineer: { id: v.engineerId, name: who.get(v.engineerId) ?? 'unknown' },
      note: v.note,
      at: v.createdAt.toISOString(),
    })),
  };
}

export async function retireVersion(ds: DataSource, user: U, id: string) {
  await ds.transaction(async (m) => {
    const { version, config } = await ownVersion(m, user, id);
    if (version.retiredAt) return;
    await m.getRepository(LibraryVersion).update(version.id, { retiredAt: new Date(), retiredById: user.id });
    await audit(m, user, 'library.version_retired', {
      configuration: config.id,
      name: config.name,
      version: version.number,
    });
  });
  return getVersion(ds, user, id);
}

export async function deleteVersion(ds: DataSource, storage: Storage, user: U, id: string) {
  const file = await ds.transaction(async (m) => {
    const { version, config } = await ownVersion(m, user, id);
    const used = (await useCounts(m, [version.id])).get(version.id) ?? 0;
    if (used)
      throw new AppError(
        409,
        'version_in_use',
        `Version ${version.number} of ${config.name} is used by ${used} package${used === 1 ? '' : 's'}: it cannot be deleted. Retire it instead.`,
      );
    const verified = await m.getRepository(LibraryVerification).countBy({ versionId: version.id });
    if (verified)
      throw new AppError(
        409,
        'version_verified',
        `Version ${version.number} of ${config.name} has been verified by an owner's engineer: retire it instead.`,
      );
    await m.getRepository(LibraryVersion).delete(version.id);
    const left = await m
      .getRepository(LibraryVersion)
      .find({ where: { configurationId: config.id }, order: { number: 'DESC' } });
    if (!left.length) await m.getRepository(LibraryConfiguration).delete(config.id);
    else if (config.currentVersion === version.number)
      await m.getRepository(LibraryConfiguration).update(config.id, { currentVersion: left[0].number });
    await audit(m, user, 'library.version_deleted', {
      configuration: config.id,
      name: config.name,
      version: version.number,
    });
    return version.documentFile;
  });
  // The document goes once the version is gone for good.
  if (file) await storage.delete(file.storageKey).catch(() => undefined);
}

export async function attachDocument(
  ds: DataSource,
  storage: Storage,
  user: U,
  id: string,
  upload: { originalName: string; bytes: Uint8Array },
  limits: { maxPages: number },
) {
  const { version, config } = await ownVersion(ds.manager, user, id);
  if (version.documentFile)
    throw AppError.conflict(
      `Version ${version.number} already has its document attached; make a new version to change it.`,
    );
  const used = (await useCounts(ds.manager, [version.id])).get(version.id) ?? 0;
  if (used)
    throw AppError.conflict(
      `Version ${version.number} is in use by packages; make a new version to attach another document.`,
    );
  const name = checkFileName(upload.originalName);
  const { pages } = await inspectPdf(upload.bytes, limits);
  const storageKey = `library/${version.id}/document.pdf`;
  await storage.put(storageKey, upload.bytes);
  try {
    await ds.transaction(async (m) => {
      await m.getRepository(LibraryVersion).update(version.id, {
        documentFile: {
          storageKey,
          name,
          sha256: sha256(upload.bytes),
          sizeBytes: upload.bytes.byteLength,
          pages,
        },
      });
      await audit(m, user, 'library.document_attached', {
        configuration: config.id,
        version: version.number,
        name,
        pages,
      });
    });
  } catch (error) {
    await storage.delete(storageKey).catch(() => undefined);
    throw error;
  }
  return getVersion(ds, user, id);
}

export async function readDocument(ds: DataSource, user: U, id: string) {
  const { version } = await readableVersion(ds.manager, user, id);
  if (!version.documentFile) throw AppError.notFound("manufacturer's document");
  return version.documentFile;
}

export async function chartOf(ds: DataSource, user: U, id: string) {
  const v = await getVersion(ds, user, id);
  return { grid: v.chart, name: `${v.crane.fleetNumber} ${v.configurationName} v${v.number}` };
}

// ---- owner desk verification ------------------------------------------------------------------

export async function verifyVersion(ds: DataSource, user: U, id: string, note: string, packageId?: string) {
  if (user.organisation.kind !== 'owner')
    throw AppError.forbidden("Only an owner desk's engineer verifies a chart.");
  await ds.transaction(async (m) => {
    const { version, config } = await readableVersion(m, user, id);
    const existing = await m
      .getRepository(LibraryVerification)
      .findOneBy({ versionId: version.id, ownerOrganisationId: user.organisationId });
    if (existing) {
      const who = (await names(m, [existing.engineerId])).get(existing.engineerId);
      throw AppError.conflict(
        `Version ${version.number} of ${config.name} was verified for your desk by ${who} already.`,
      );
    }
    let pkg: LiftPackage | null = null;
    if (packageId) pkg = await findScopedPackage(m, user, packageId);
    await m.getRepository(LibraryVerification).save({
      versionId: version.id,
      ownerOrganisationId: user.organisationId,
      engineerId: user.id,
      packageId: pkg?.id ?? null,
      note,
    });
    await audit(
      m,
      user,
      'library.chart_verified',
      { version: version.id, configuration: config.name, number: version.number, note },
      pkg?.id,
    );
  });
  return getVersion(ds, user, id);
}

// ---- a package's use of the library --------------------------------------------------------------

type ChartRows = { rows?: unknown[] } | undefined;

function chartRowsOf(inputs: Record<string, unknown>, slot: number) {
  if (slot === 0) return (inputs.chart as ChartRows)?.rows;
  const others = (inputs.multiCrane as { others?: { chart?: ChartRows }[] } | undefined)?.others;
  return others?.[slot - 1]?.chart?.rows;
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
          configurationName: k.name,
          crane: craneLabel({ crane: { ...v.craneSnapshot, id: k.craneId } }),
        },
        detached: u.detached,
        changedCells: changedCells(grid, chartRowsOf(revision.inputs, u.slot) as never),
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

/** A new revision starts from the previous one's inputs: it keeps the library versions it used. */
export async function carryLibraryUses(m: EntityManager, fromRevisionId: string, toRevisionId: string) {
  await m.query(
    `INSERT INTO library_uses (revision_id, package_id, slot, version_id, detached)
     SELECT $2, package_id, slot, version_id, detached FROM library_uses WHERE revision_id = $1`,
    [fromRevisionId, toRevisionId],
  );
}
