// The contractor's fleet: cranes with their fixed data, searched by fleet number, make or model
// and filtered by capacity at a radius. A crane's configurations live in versions.ts.
import type { Actor } from '@shared/rules/actor';
import type { DataSource, EntityManager } from 'typeorm';
import type { z } from 'zod';
import type {
  CraneBody,
  CraneDetail,
  CraneListQuery,
  CranePatch,
  CraneSummary,
} from '@shared/schemas/library';
import { TO_SI } from '@shared/engineering/units';
import { capacityAtRadius } from '@shared/library/to-lift-input';
import { AppError } from '../../lib/app-error';
import { LibraryConfiguration, LibraryCrane, LibraryVersion } from './library.entity';
import { audit } from './library-audit';
import { ownCrane } from './library-scope';
import { cellsOf, gridOf, readerDesk, versionSummaries } from './version-summaries';

type U = Actor;

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
