// A crane's configurations and their versions: each edit of a configuration writes a new version
// (the old ones never change); a version a package uses can be retired but not deleted.
import type { Actor } from '@shared/rules/actor';
import type { DataSource, EntityManager } from 'typeorm';
import type { z } from 'zod';
import type {
  ConfigurationBody,
  ConfigurationDetail,
  VersionBody,
  VersionDetail,
} from '@shared/schemas/library';
import { gridCells } from '@shared/library/chart-grid';
import { gridDifference } from '@shared/library/to-lift-input';
import { AppError } from '../../lib/app-error';
import type { Storage } from '../../lib/storage';
import {
  LibraryChartCell,
  LibraryConfiguration,
  LibraryCrane,
  LibraryVerification,
  LibraryVersion,
} from './library.entity';
import { audit } from './library-audit';
import { ownConfiguration, ownCrane, ownVersion, readableVersion } from './library-scope';
import {
  cellsOf,
  gridOf,
  names,
  readerDesk,
  useCounts,
  verificationsFor,
  versionSummaries,
} from './version-summaries';

type U = Actor;

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

export async function chartOf(ds: DataSource, user: U, id: string) {
  const v = await getVersion(ds, user, id);
  return { grid: v.chart, name: `${v.crane.fleetNumber} ${v.configurationName} v${v.number}` };
}
