/* eslint-disable @typescript-eslint/no-explicit-any -- the demo inputs are plain JSON read from the example files */
// The demo week's lift packages: invented lifts at the refinery and the wharf, built from
// the engine's example inputs, each with a generated lift plan PDF. Submitted revisions
// are checked by the same check-run service the worker uses; decisions, assignments and
// findings are then laid on top so the queue shows every status.
import { randomUUID } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import type { DataSource, EntityManager } from 'typeorm';
import type { Decision, PackageStatus } from '@shared/schemas/common';
import { LocalFolderStorage, sha256 } from '../../lib/storage';
import { recordAudit } from '../../modules/audit/service';
import { InvalidLiftData, runCheckRun } from '../../modules/check-runs/service';
import { UploadedFile } from '../../modules/files/file.entity';
import type { Organisation } from '../../modules/organisations/organisation.entity';
import { LiftPackage, Revision } from '../../modules/packages/package.entity';
import { buildReturn, newVerificationCode } from '../../modules/returns/service';
import { Assignment, DecisionRecord, Finding, Markup } from '../../modules/reviews/review.entity';
import type { Site } from '../../modules/sites/site.entity';
import type { User } from '../../modules/users/user.entity';
import { drawPlanPdf, type PlanSection } from './plan-pdf';

const EXAMPLES = path.resolve(
  path.dirname(fileURLToPath(import.meta.url)),
  '../../../shared/engineering/examples',
);

interface DemoPackage {
  site: 'refinery' | 'wharf';
  contractor: 'brackwater' | 'selsdon';
  title: string;
  example: string;
  loadDescription: string;
  craneName: string;
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
}

const DEMO: DemoPackage[] = [
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
];

function isoDay(offsetDays: number): string {
  const d = new Date();
  d.setUTCHours(12, 0, 0, 0);
  d.setUTCDate(d.getUTCDate() + offsetDays);
  return d.toISOString().slice(0, 10);
}

function q(v: unknown): string {
  if (v && typeof v === 'object' && 'value' in v && 'unit' in v) {
    const { value, unit } = v as { value: number; unit: string };
    return `${value} ${unit.replace('m2', 'm²').replace('ft2', 'ft²').replace('deg', '°')}`;
  }
  return String(v);
}

function planSections(input: Record<string, any>): PlanSection[] {
  const crane = input.crane ?? {};
  const sections: PlanSection[] = [
    {
      heading: 'Crane and configuration',
      rows: [
        ['Crane', String(crane.name ?? '')],
        ['Type', String(crane.type ?? '').replace(/_/g, ' ')],
        ...(crane.boomLength ? ([['Boom length', q(crane.boomLength)]] as [string, string][]) : []),
        ...(crane.radius ? ([['Working radius', q(crane.radius)]] as [string, string][]) : []),
        ...(crane.boomAngle ? ([['Boom angle', q(crane.boomAngle)]] as [string, string][]) : []),
        ...(crane.counterweight
          ? ([['Counterweight', q(crane.counterweight.weight)]] as [string, string][])
          : []),
        ['Load chart used', String(input.chart?.name ?? '')],
      ],
    },
    {
      heading: 'Load and rigging',
      rows: [
        ['Load', String(input.load?.description ?? '')],
        ['Load weight', q(input.load?.weight)],
        ...(input.hookBlock ? ([['Hook block', q(input.hookBlock.weight)]] as [string, string][]) : []),
        ...(input.rigging?.slings
          ? ([
              [
                'Slings',
                `${input.rigging.slings.name ?? ''} (${input.rigging.slings.hitch}, ${input.rigging.slings.material})`,
              ],
              ['Sling rated load (vertical, per leg)', q(input.rigging.slings.ratedLoadVertical)],
            ] as [string, string][])
          : []),
        ...((input.rigging?.hardware ?? []) as Array<{ name?: string; wll: unknown }>).map(
          (h) => [String(h.name ?? 'Hardware'), `WLL ${q(h.wll)}`] as [string, string],
        ),
      ],
    },
  ];
  if (input.ground) {
    sections.push({
      heading: 'Ground and mats',
      rows: [
        ...(input.ground.mat
          ? ([['Mat', `${q(input.ground.mat.length)} × ${q(input.ground.mat.width)}`]] as [string, string][])
          : []),
        ...(input.ground.allowableBearing
          ? ([['Allowable bearing', q(input.ground.allowableBearing)]] as [string, string][])
          : []),
        ...(input.ground.soilClass
          ? ([['Soil class', String(input.ground.soilClass).replace(/_/g, ' ')]] as [string, string][])
          : []),
      ],
    });
  }
  const stated = input.stated ?? {};
  const statedRows = Object.entries(stated).map(
    ([k, v]) => [k.replace(/([A-Z])/g, ' $1').toLowerCase(), q(v)] as [string, string],
  );
  if (statedRows.length) sections.push({ heading: 'Figures stated in this plan', rows: statedRows });
  sections.push({
    heading: 'Sequence',
    rows: [
      ['1', 'Pre-lift meeting; permit and exclusion zone in place'],
      ['2', 'Set up on mats; level the crane; check radius with a tape'],
      ['3', 'Trial lift 100 mm clear; hold 5 minutes; check rigging'],
      ['4', 'Lift, slew and land under the lift director’s signals'],
    ],
  });
  return sections;
}

interface Seeded {
  spec: DemoPackage;
  packageId: string;
  submittedRevisionId: string | null;
}

export async function seedPackages(
  m: EntityManager,
  filesDir: string,
  ctx: { orgs: Map<string, Organisation>; people: Map<string, User>; sites: { refinery: Site; wharf: Site } },
): Promise<Seeded[]> {
  const storage = new LocalFolderStorage(filesDir);
  const contractors = {
    brackwater: {
      org: ctx.orgs.get('Brackwater Lifting Ltd')!,
      person: ctx.people.get('lena.brisk@brackwater-lifting.example')!,
    },
    selsdon: {
      org: ctx.orgs.get('Selsdon & Hale Crane Hire')!,
      person: ctx.people.get('tomas.hale@selsdon-hale.example')!,
    },
  };
  const counters = { refinery: 0, wharf: 0 };
  const seeded: Seeded[] = [];
  for (const spec of DEMO) {
    const site = ctx.sites[spec.site];
    const { org, person } = contractors[spec.contractor];
    const reference = `${site.code}-${String(++counters[spec.site]).padStart(4, '0')}`;
    const input = JSON.parse(fs.readFileSync(path.join(EXAMPLES, `${spec.example}.json`), 'utf8'));
    input.title = `${site.name} — ${spec.title}`;
    input.crane.name = spec.craneName;
    input.load.description = spec.loadDescription;
    if (spec.breakInputs) delete input.chart;
    const pkg = await m.getRepository(LiftPackage).save({
      reference,
      title: spec.title,
      contractorOrganisationId: org.id,
      siteId: site.id,
      createdById: person.id,
      status: spec.status === 'draft' && !spec.revisingAfter ? 'draft' : 'checking',
      plannedLiftDate: isoDay(spec.daysToLift),
      currentRevision: 1,
    });
    await recordAudit(m, {
      action: 'package.created',
      actor: { id: person.id, organisationId: org.id },
      packageId: pkg.id,
      detail: { reference, revision: 1 },
    });
    const submitted = spec.status !== 'draft' || spec.revisingAfter === true;
    const revision = await m.getRepository(Revision).save({
      packageId: pkg.id,
      number: 1,
      state: 'draft',
      inputs: input,
    });
    const pdf = await drawPlanPdf({
      contractor: org.name,
      reference,
      title: spec.title,
      site: site.name,
      plannedDate: isoDay(spec.daysToLift),
      revision: 1,
      preparedBy: person.name,
      sections: planSections(input),
      sketch: sketchOf(input),
    });
    const fileId = randomUUID();
    const storageKey = `revisions/${revision.id}/${fileId}.pdf`;
    await storage.put(storageKey, pdf);
    await m.getRepository(UploadedFile).save({
      id: fileId,
      revisionId: revision.id,
      kind: 'lift_plan',
      originalName: `${reference}-lift-plan-rev1.pdf`,
      sha256: sha256(pdf),
      sizeBytes: String(pdf.byteLength),
      pages: await pageCount(pdf),
      storageKey,
      uploadedById: person.id,
    });
    if (submitted) {
      await m.getRepository(Revision).update(revision.id, {
        state: 'submitted',
        submittedAt: new Date(Date.now() - (3 + Math.abs(spec.daysToLift)) * 86_400_000),
        submittedById: person.id,
        checkStatus: 'queued',
      });
      await recordAudit(m, {
        action: 'revision.submitted',
        actor: { id: person.id, organisationId: org.id },
        packageId: pkg.id,
        detail: { revision: 1 },
      });
    }
    seeded.push({ spec, packageId: pkg.id, submittedRevisionId: submitted ? revision.id : null });
  }
  return seeded;
}

/** After the packages are committed: run their checks, then lay the review state on top. */
export async function finishSeededPackages(
  ds: DataSource,
  seeded: Seeded[],
  people: Map<string, User>,
  reviewer: User,
  opts: { filesDir: string; appUrl: string },
) {
  const storage = new LocalFolderStorage(opts.filesDir);
  const appUrl = opts.appUrl;
  const engineers = {
    dev: people.get('dev.marsh@tamsin-ridge.example')!,
    ines: people.get('ines.varga@tamsin-ridge.example')!,
  };
  for (const { spec, packageId, submittedRevisionId } of seeded) {
    // 'checking' packages stay queued: the worker picks them up when it starts.
    if (submittedRevisionId && spec.status !== 'checking') {
      try {
        await runCheckRun(ds, submittedRevisionId);
      } catch (error) {
        if (!(error instanceof InvalidLiftData)) throw error;
      }
    }
    await ds.transaction(async (m) => {
      const engineer = spec.engineer ? engineers[spec.engineer] : null;
      if (engineer) {
        await m
          .getRepository(Assignment)
          .save({ packageId, engineerId: engineer.id, assignedById: reviewer.id });
        await m.getRepository(LiftPackage).update(packageId, { assignedEngineerId: engineer.id });
        await recordAudit(m, {
          action: 'engineer.assigned',
          actor: { id: reviewer.id },
          packageId: packageId,
          detail: { engineer: engineer.name },
        });
      }
      const plan = submittedRevisionId
        ? await m
            .getRepository(UploadedFile)
            .findOneBy({ revisionId: submittedRevisionId, kind: 'lift_plan' })
        : null;
      for (const [i, f] of (spec.findings ?? []).entries()) {
        // Each finding on a page gets a cloud around the part of the plan it is about.
        const markup =
          plan && f.page
            ? await m.getRepository(Markup).save({
                revisionId: submittedRevisionId!,
                fileId: plan.id,
                pageNumber: Math.min(f.page, plan.pages),
                kind: 'cloud',
                geometry: { x: 290, y: 520 - i * 120, width: 240, height: 70 },
                colour: 'rust',
                text: f.text.slice(0, 60),
                number: null,
                createdById: engineer!.id,
              })
            : null;
        await m.getRepository(Finding).save({
          packageId,
          revisionId: submittedRevisionId!,
          checkId: f.checkId,
          markupId: markup?.id ?? null,
          fileId: markup ? plan!.id : null,
          pageNumber: markup ? markup.pageNumber : null,
          text: f.text,
          severity: f.severity,
          createdById: engineer!.id,
        });
      }
      if (spec.decision && engineer) {
        await m.getRepository(DecisionRecord).save({
          packageId,
          revisionId: submittedRevisionId!,
          decision: spec.decision,
          conditions: spec.conditions ?? '',
          engineerId: engineer.id,
        });
        await m.getRepository(LiftPackage).update(packageId, { decision: spec.decision });
        await recordAudit(m, {
          action: 'decision.recorded',
          actor: { id: engineer.id },
          packageId: packageId,
          detail: { decision: spec.decision, revision: 1 },
        });
      }
      const returned = spec.status === 'returned' || spec.revisingAfter === true;
      if (returned) {
        await m.getRepository(LiftPackage).update(packageId, { status: 'decided' });
      } else if (spec.status !== 'checking' && spec.status !== 'check_failed') {
        await m.getRepository(LiftPackage).update(packageId, { status: spec.status });
      }
    });
    if (spec.status === 'returned' || spec.revisingAfter) {
      // The same job code as the product: the return is built, stored and the package returned.
      const decision = await ds.getRepository(DecisionRecord).findOneByOrFail({ packageId });
      const [row] = await ds.query(
        `INSERT INTO stamped_returns (decision_id, package_id, revision_id, verification_code, issued_by_id)
         VALUES ($1, $2, $3, $4, $5) RETURNING id`,
        [decision.id, packageId, submittedRevisionId, newVerificationCode(), reviewer.id],
      );
      await buildReturn(ds, storage, row.id, appUrl);
    }
    if (spec.revisingAfter) {
      await ds.transaction(async (m) => {
        const first = await m.getRepository(Revision).findOneByOrFail({ id: submittedRevisionId! });
        await m.getRepository(Revision).save({ packageId, number: 2, state: 'draft', inputs: first.inputs });
        await m
          .getRepository(LiftPackage)
          .update(packageId, { currentRevision: 2, status: 'draft', decision: null });
        await recordAudit(m, { action: 'revision.started', actor: null, packageId, detail: { revision: 2 } });
      });
    }
  }
}

function sketchOf(input: Record<string, any>) {
  const c = input.crane ?? {};
  const toM = (x: { value: number; unit: string } | undefined) =>
    x
      ? x.unit === 'ft'
        ? x.value * 0.3048
        : x.unit === 'in'
          ? x.value * 0.0254
          : x.unit === 'mm'
            ? x.value / 1000
            : x.value
      : undefined;
  const boom = toM(c.boomLength);
  const radius = toM(c.radius);
  if (!boom || !radius) return undefined;
  const offset = toM(c.pivotOffset) ?? 0;
  const angle = (Math.acos(Math.min(1, Math.max(0, (radius - offset) / boom))) * 180) / Math.PI;
  return {
    boomLengthM: boom,
    boomAngleDeg: angle,
    radiusM: radius,
    counterweightArmM: toM(c.counterweight?.cgBehindRotation) ?? 3,
  };
}

async function pageCount(pdf: Uint8Array) {
  const { PDFDocument } = await import('pdf-lib');
  return (await PDFDocument.load(pdf)).getPageCount();
}
