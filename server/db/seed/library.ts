// The demo fleets (invented): Brackwater Lifting keeps two cranes in metric units, Selsdon &
// Hale two in US units, each with a few configurations. Every chart here is invented for the
// demo and says so in its document title; none is any manufacturer's.
import type { EntityManager } from 'typeorm';
import type { ChartGrid } from '@shared/library/chart-grid';
import { gridCells } from '@shared/library/chart-grid';
import type {
  ChartNotes,
  ConfigurationDetails,
  CraneFixedData,
  VersionDetail,
} from '@shared/schemas/library';
import type { Organisation } from '../../modules/organisations/organisation.entity';
import type { User } from '../../modules/users/user.entity';
import {
  LibraryChartCell,
  LibraryConfiguration,
  LibraryCrane,
  LibraryVersion,
} from '../../modules/library/library.entity';

/** An invented chart falling with radius and boom length; blank past the boom's reach. */
function demoChart(
  units: ChartGrid['units'],
  booms: number[],
  radii: number[],
  k: number,
  round: number,
): ChartGrid {
  return {
    units,
    boomLengths: booms,
    radii,
    capacities: radii.map((r) =>
      booms.map((b) => {
        if (r > b * 0.88) return null;
        const c = k / (r + 2 + b * 0.12) - b * 0.02 * (k / 400);
        return c > 0 ? Math.round(c * round) / round : null;
      }),
    ),
  };
}

interface DemoConfig {
  name: string;
  details: ConfigurationDetails;
  chart: ChartGrid;
  page: string;
}

interface DemoCrane {
  fleetNumber: string;
  make: string;
  model: string;
  type: LibraryCrane['type'];
  fixed: CraneFixedData;
  configs: DemoConfig[];
}

const m = (value: number) => ({ value, unit: 'm' as const });
const t = (value: number) => ({ value, unit: 't' as const });
const ft = (value: number) => ({ value, unit: 'ft' as const });
const kip = (value: number) => ({ value, unit: 'kip' as const });
const METRIC = { radius: 'm', boomLength: 'm', capacity: 't' } as const;
const US = { radius: 'ft', boomLength: 'ft', capacity: 'kip' } as const;

const FLEETS: Record<string, DemoCrane[]> = {
  'Brackwater Lifting Ltd': [
    {
      fleetNumber: 'BW-07',
      make: 'Kestrel',
      model: 'AT-60 (demo, invented)',
      type: 'mobile_outriggers',
      fixed: {
        carrier: { weight: t(30), cgRearOfRotation: m(-0.5) },
        upperWorks: { weight: t(22), cgBehindRotation: m(0.8) },
        boom: { weight: t(6), cgFromFoot: m(13) },
        pivotOffset: m(1.2),
        pivotHeight: m(2.8),
        outriggerSpreads: [
          { name: 'full', longitudinalSpread: m(7.2), transverseSpread: m(7) },
          { name: 'mid', longitudinalSpread: m(7.2), transverseSpread: m(5.2) },
        ],
      },
      configs: [
        {
          name: 'Main boom, 18 t counterweight, full spread, 360°',
          details: {
            workingArea: 'full_circle',
            outriggerSpread: 'full',
            counterweight: { arrangement: '18 t (slabs A–D)', weight: t(18), cgBehindRotation: m(4.2) },
            hookBlock: { name: '4-sheave 50 t block', weight: t(0.45) },
            boomLengthMin: m(11.6),
            boomLengthMax: m(42.3),
          },
          chart: demoChart(
            METRIC,
            [11.6, 18.3, 24.4, 30.5, 36.6, 42.3],
            [3, 4, 5, 6, 8, 10, 12, 14, 16, 18, 20, 24, 28, 32, 36],
            420,
            10,
          ),
          page: '14',
        },
        {
          name: 'Main boom, 8 t counterweight, mid spread, over the rear',
          details: {
            workingArea: 'over_rear',
            outriggerSpread: 'mid',
            counterweight: { arrangement: '8 t (slabs A–B)', weight: t(8), cgBehindRotation: m(4.0) },
            hookBlock: { name: '4-sheave 50 t block', weight: t(0.45) },
          },
          chart: demoChart(
            METRIC,
            [11.6, 18.3, 24.4, 30.5],
            [3, 4, 5, 6, 8, 10, 12, 14, 16, 20, 24],
            260,
            10,
          ),
          page: '22',
        },
      ],
    },
    {
      fleetNumber: 'BW-12',
      make: 'Kestrel',
      model: 'CC-110 crawler (demo, invented)',
      type: 'mobile_crawler',
      fixed: {
        carrier: { weight: t(48), cgRearOfRotation: m(0) },
        upperWorks: { weight: t(38), cgBehindRotation: m(1.1) },
        boom: { weight: t(11), cgFromFoot: m(20) },
        pivotOffset: m(1.4),
        pivotHeight: m(2.6),
        tracks: { length: m(6.8), shoeWidth: m(0.9), gauge: m(5.2) },
      },
      configs: [
        {
          name: 'Lattice boom, 40 t counterweight, 360°',
          details: {
            workingArea: 'full_circle',
            counterweight: {
              arrangement: '40 t superstructure ballast',
              weight: t(40),
              cgBehindRotation: m(5.1),
            },
            hookBlock: { name: '6-sheave 110 t block', weight: t(1.2) },
          },
          chart: demoChart(
            METRIC,
            [18, 30, 42, 54],
            [5, 6, 8, 10, 12, 14, 16, 20, 24, 28, 32, 36, 40, 44],
            900,
            10,
          ),
          page: '8',
        },
      ],
    },
  ],
  'Selsdon & Hale Crane Hire': [
    {
      fleetNumber: 'SH-3',
      make: 'Norbury',
      model: 'RT-45 (demo, invented)',
      type: 'mobile_outriggers',
      fixed: {
        carrier: { weight: kip(62), cgRearOfRotation: ft(-1.5) },
        upperWorks: { weight: kip(38), cgBehindRotation: ft(2.5) },
        boom: { weight: kip(12), cgFromFoot: ft(40) },
        pivotOffset: ft(4),
        pivotHeight: ft(8.5),
        outriggerSpreads: [{ name: 'full', longitudinalSpread: ft(22), transverseSpread: ft(21) }],
      },
      configs: [
        {
          name: 'Main boom, 12.5 kip counterweight, full spread, 360°',
          details: {
            workingArea: 'full_circle',
            outriggerSpread: 'full',
            counterweight: { arrangement: '12.5 kip fixed', weight: kip(12.5), cgBehindRotation: ft(12) },
            hookBlock: { name: '3-sheave block', weight: kip(1.1) },
          },
          chart: demoChart(
            US,
            [35, 50, 65, 80, 95],
            [10, 12, 15, 20, 25, 30, 35, 40, 50, 60, 70, 80],
            2400,
            1,
          ),
          page: '5',
        },
      ],
    },
    {
      fleetNumber: 'SH-9',
      make: 'Norbury',
      model: 'AT-90 (demo, invented)',
      type: 'mobile_outriggers',
      fixed: {
        carrier: { weight: kip(96), cgRearOfRotation: ft(-2) },
        upperWorks: { weight: kip(70), cgBehindRotation: ft(3) },
        boom: { weight: kip(20), cgFromFoot: ft(50) },
        pivotOffset: ft(4.5),
        pivotHeight: ft(9.5),
        outriggerSpreads: [
          { name: 'full', longitudinalSpread: ft(26), transverseSpread: ft(25) },
          { name: 'half', longitudinalSpread: ft(26), transverseSpread: ft(16) },
        ],
      },
      configs: [
        {
          name: 'Main boom, 40 kip counterweight, full spread, 360°',
          details: {
            workingArea: 'full_circle',
            outriggerSpread: 'full',
            counterweight: { arrangement: '40 kip (4 slabs)', weight: kip(40), cgBehindRotation: ft(14) },
            hookBlock: { name: '5-sheave block', weight: kip(2.2) },
          },
          chart: demoChart(
            US,
            [40, 60, 80, 100, 120],
            [10, 12, 15, 20, 25, 30, 40, 50, 60, 70, 80, 90, 100],
            5200,
            1,
          ),
          page: '11',
        },
        {
          name: 'Main boom, 40 kip counterweight, half spread, over the side',
          details: {
            workingArea: 'over_side',
            outriggerSpread: 'half',
            counterweight: { arrangement: '40 kip (4 slabs)', weight: kip(40), cgBehindRotation: ft(14) },
            hookBlock: { name: '5-sheave block', weight: kip(2.2) },
          },
          chart: demoChart(US, [40, 60, 80, 100], [10, 12, 15, 20, 25, 30, 40, 50, 60, 70], 3100, 1),
          page: '17',
        },
      ],
    },
  ],
};

const DEMO_NOTES: ChartNotes = {
  deductions: [],
  blockIncluded: false,
  interpolationAllowed: false,
  text: 'Demo chart, invented: not for use.',
};

/** Key of a seeded version: the crane's fleet number and the configuration's index in its list. */
export const versionKey = (fleetNumber: string, configuration: number) => `${fleetNumber}#${configuration}`;

/** Seeds the fleets; returns version 1 of every configuration as the API reads it, by versionKey. */
export async function seedLibrary(
  tx: EntityManager,
  ctx: { orgs: Map<string, Organisation>; people: Map<string, User> },
): Promise<Map<string, VersionDetail>> {
  const seeded = new Map<string, VersionDetail>();
  for (const [orgName, cranes] of Object.entries(FLEETS)) {
    const org = ctx.orgs.get(orgName);
    const author = [...ctx.people.values()].find(
      (p) => p.organisationId === org?.id && p.role === 'contractor',
    );
    if (!org || !author) continue;
    for (const c of cranes) {
      const crane = await tx.getRepository(LibraryCrane).save({
        organisationId: org.id,
        fleetNumber: c.fleetNumber,
        make: c.make,
        model: c.model,
        type: c.type,
        fixed: c.fixed,
        createdById: author.id,
      });
      for (const [index, k] of c.configs.entries()) {
        const config = await tx
          .getRepository(LibraryConfiguration)
          .save({ craneId: crane.id, name: k.name, currentVersion: 1 });
        const version = await tx.getRepository(LibraryVersion).save({
          configurationId: config.id,
          number: 1,
          craneSnapshot: {
            fleetNumber: c.fleetNumber,
            make: c.make,
            model: c.model,
            type: c.type,
            fixed: c.fixed,
          },
          details: k.details,
          notes: DEMO_NOTES,
          document: {
            title: `${c.make} ${c.model} load chart — demo, invented`,
            edition: 'demo',
            page: k.page,
          },
          chartUnits: k.chart.units,
          changeNote: null,
          createdById: author.id,
        });
        await tx
          .createQueryBuilder()
          .insert()
          .into(LibraryChartCell)
          .values(gridCells(k.chart).map((cell) => ({ versionId: version.id, ...cell })))
          .execute();
        seeded.set(versionKey(c.fleetNumber, index), {
          id: version.id,
          number: 1,
          createdAt: version.createdAt.toISOString(),
          createdBy: { id: author.id, name: author.name },
          changeNote: null,
          retiredAt: null,
          usedBy: 0,
          cellsChanged: null,
          verified: false,
          configurationId: config.id,
          configurationName: k.name,
          crane: {
            id: crane.id,
            fleetNumber: c.fleetNumber,
            make: c.make,
            model: c.model,
            type: c.type,
            fixed: c.fixed,
          },
          details: k.details,
          notes: DEMO_NOTES,
          document: { ...version.document, file: null },
          chart: k.chart,
          verifications: [],
        });
      }
    }
  }
  return seeded;
}

export const DEMO_FLEETS = FLEETS;
