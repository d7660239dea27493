// The demo week's packages as data: which example lift, where, by whom, and how far each
// has gone (status, decision, findings). Invented for the demo scenario; packages.ts lays them down.
import type { Decision, PackageStatus } from '@shared/schemas/common';

export interface DemoPackage {
  site: 'refinery' | 'wharf';
  contractor: 'brackwater' | 'selsdon';
  title: string;
  example: string;
  loadDescription: string;
  /** The crane as the plan names it; a package built from the library takes the library's name */
  craneName?: string;
  daysToLift: number;
  status: PackageStatus;
  engineer?: 'dev' | 'ines';
  decision?: Decision;
  conditions?: string;
  findings?: Array<{
    checkId: string | null;
    text: string;
    severity: 'note' | 'minor' | 'major' | 'blocking';
    page?: number;
  }>;
  /** A second revision in draft after a "Revise and resubmit". */
  revisingAfter?: boolean;
  /** Breaks the inputs so the check run refuses them (shows the check_failed state). */
  breakInputs?: boolean;
  /**
   * Built from the contractor's fleet library (server/db/seed/library.ts): the crane, chart, hook
   * block and deductions come from version 1 of that configuration; the planner's boom length and
   * radius stay as given (or the example's).
   */
  library?: {
    fleetNumber: string;
    /** index of the configuration in the crane's list */
    configuration: number;
    boomLength?: { value: number; unit: 'm' | 'ft' };
    radius?: { value: number; unit: 'm' | 'ft' };
    /** A detached copy with one cell edited (chart units): the engineer sees it flagged */
    editedCell?: { boomLength: number; radius: number; capacity: number };
    /** The owner desk's engineer who verified that version's chart, on this package */
    verifiedBy?: 'dev' | 'ines';
  };
}

export function isoDay(offsetDays: number): string {
  const d = new Date();
  d.setUTCHours(12, 0, 0, 0);
  d.setUTCDate(d.getUTCDate() + offsetDays);
  return d.toISOString().slice(0, 10);
}

export const DEMO: DemoPackage[] = [
  {
    site: 'refinery',
    contractor: 'brackwater',
    title: 'Set charge heater convection module',
    example: 'pass-outriggers',
    loadDescription: 'Convection module CM-2',
    craneName: 'Brackwater BL-60 all-terrain (fleet no. 14)',
    daysToLift: -5,
    status: 'returned',
    engineer: 'dev',
    decision: 'accepted',
  },
  {
    site: 'refinery',
    contractor: 'brackwater',
    title: 'Lift reactor head onto R-301',
    example: 'caution-capacity-critical',
    loadDescription: 'Reactor head R-301',
    craneName: 'Brackwater BL-60 all-terrain (fleet no. 9)',
    daysToLift: 3,
    status: 'with_engineer',
    engineer: 'dev',
    findings: [
      {
        checkId: 'capacity',
        text: 'Chart use over 75%: confirm the load weight from the fabricator’s weigh ticket, not the drawing.',
        severity: 'major',
        page: 1,
      },
    ],
  },
  {
    site: 'refinery',
    contractor: 'selsdon',
    title: 'Replace cooling tower fan gearbox',
    example: 'caution-discrepancies',
    loadDescription: 'Fan gearbox CT-4',
    craneName: 'S&H Titan 55 all-terrain',
    daysToLift: 6,
    status: 'ready_for_review',
  },
  {
    site: 'refinery',
    contractor: 'brackwater',
    title: 'Pipe rack spool beside the 132 kV line',
    example: 'fail-power-line',
    loadDescription: 'Pipe spool PR-7-12',
    craneName: 'Brackwater BL-60 all-terrain (fleet no. 14)',
    daysToLift: 9,
    status: 'draft',
    engineer: 'ines',
    decision: 'revise_and_resubmit',
    revisingAfter: true,
    conditions:
      'Move the crane or the pick point so the boom stays outside the minimum approach distance, or get the line de-energised and say so in the plan.',
    findings: [
      {
        checkId: 'power-line',
        text: 'Boom tip passes inside the minimum approach distance of the 132 kV line.',
        severity: 'blocking',
        page: 1,
      },
      { checkId: null, text: 'Add the spotter’s position to the site plan.', severity: 'minor', page: 2 },
    ],
  },
  {
    site: 'refinery',
    contractor: 'selsdon',
    title: 'Tandem set of column section C-12',
    example: 'caution-tandem',
    loadDescription: 'Column section C-12',
    craneName: 'S&H Titan 55 all-terrain',
    daysToLift: 12,
    status: 'with_engineer',
    engineer: 'ines',
  },
  {
    site: 'refinery',
    contractor: 'selsdon',
    title: 'Personnel platform for flare tip inspection',
    example: 'fail-personnel',
    loadDescription: 'Personnel platform, 2 occupants',
    craneName: 'S&H Titan 55 all-terrain',
    daysToLift: 2,
    status: 'ready_for_review',
  },
  {
    site: 'refinery',
    contractor: 'brackwater',
    title: 'Heat exchanger bundle pull, E-210',
    example: 'fail-ground-bearing',
    loadDescription: 'Tube bundle E-210',
    craneName: 'Brackwater BL-60 all-terrain (fleet no. 9)',
    daysToLift: 15,
    status: 'draft',
  },
  {
    site: 'wharf',
    contractor: 'brackwater',
    title: 'Unload transformer from the barge',
    example: 'pass-crawler',
    loadDescription: 'Transformer T-3',
    craneName: 'Brackwater BC-150 crawler',
    daysToLift: 1,
    status: 'decided',
    engineer: 'dev',
    decision: 'accepted_as_noted',
    conditions:
      'Lift director to confirm the barge is ballasted level before the pick; hold the lift if wind exceeds 9 m/s.',
  },
  {
    site: 'wharf',
    contractor: 'selsdon',
    title: 'Lift loading arm onto berth 3',
    example: 'fail-stability',
    loadDescription: 'Loading arm LA-3',
    craneName: 'S&H Titan 55 all-terrain',
    daysToLift: 4,
    status: 'returned',
    engineer: 'ines',
    decision: 'rejected',
    conditions:
      'The crane as configured cannot make this lift. Resubmit with the full counterweight or a larger crane.',
    findings: [
      {
        checkId: 'stability',
        text: 'Stability ratio below the site minimum with the reduced counterweight entered.',
        severity: 'blocking',
        page: 1,
      },
    ],
  },
  {
    site: 'wharf',
    contractor: 'brackwater',
    title: 'Lower pump set through the pump house roof',
    example: 'pass-gantry-a-frame',
    loadDescription: 'Pump set P-2',
    craneName: 'Brackwater 25 t A-frame',
    daysToLift: 8,
    status: 'ready_for_review',
  },
  {
    site: 'wharf',
    contractor: 'selsdon',
    title: 'Swap mooring winch on berth 2',
    example: 'pass-imperial-units',
    loadDescription: 'Mooring winch MW-2',
    craneName: 'S&H Titan 55 all-terrain',
    daysToLift: 5,
    status: 'with_engineer',
    engineer: 'dev',
  },
  {
    site: 'wharf',
    contractor: 'brackwater',
    title: 'Replace fender panels, berth 1',
    example: 'fail-rigging',
    loadDescription: 'Fender panel',
    craneName: 'Brackwater BL-60 all-terrain (fleet no. 14)',
    daysToLift: 10,
    status: 'checking',
  },
  {
    site: 'wharf',
    contractor: 'selsdon',
    title: 'Gangway tower section, afternoon window',
    example: 'fail-wind',
    loadDescription: 'Gangway tower section',
    craneName: 'S&H Titan 55 all-terrain',
    daysToLift: 7,
    status: 'check_failed',
    breakInputs: true,
  },
  {
    site: 'wharf',
    contractor: 'selsdon',
    title: 'Shore power cable reel',
    example: 'pass-outriggers',
    loadDescription: 'Cable reel',
    craneName: 'S&H Titan 55 all-terrain',
    daysToLift: 20,
    status: 'draft',
  },
  // Packages built from the fleet library: no crane data typed, the chart picked, not pasted.
  {
    site: 'refinery',
    contractor: 'brackwater',
    title: 'Set air cooler fan deck, bay 4',
    example: 'pass-outriggers',
    loadDescription: 'Fan deck module AC-4',
    daysToLift: 6,
    status: 'with_engineer',
    engineer: 'dev',
    library: {
      fleetNumber: 'BW-07',
      configuration: 0,
      verifiedBy: 'dev',
    },
  },
  {
    site: 'wharf',
    contractor: 'brackwater',
    title: 'Lift gangway landing platform, berth 2',
    example: 'pass-outriggers',
    loadDescription: 'Landing platform LP-2',
    daysToLift: 11,
    status: 'ready_for_review',
    library: {
      fleetNumber: 'BW-07',
      configuration: 0,
      radius: { value: 14, unit: 'm' },
    },
  },
  {
    site: 'refinery',
    contractor: 'selsdon',
    title: 'Replace compressor lube oil cooler',
    example: 'pass-imperial-units',
    loadDescription: 'Lube oil cooler K-101',
    daysToLift: 9,
    status: 'with_engineer',
    engineer: 'ines',
    library: {
      fleetNumber: 'SH-9',
      configuration: 0,
      boomLength: { value: 100, unit: 'ft' },
      radius: { value: 40, unit: 'ft' },
      editedCell: { boomLength: 100, radius: 40, capacity: 68 },
    },
  },
];
