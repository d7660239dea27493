// The demo week's lift packages: invented lifts at the refinery and the wharf, built from
// the engine's example inputs, each with a generated lift plan PDF. Submitted revisions
// are checked by the same check-run service the worker uses; decisions, assignments and
// findings are then laid on top so the queue shows every status.
import { REVIEW_TIMES_DEFAULT, reviewDueOn } from '@shared/rules/review-due';
import { randomUUID } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import type { DataSource, EntityManager } from 'typeorm';
import { fillFromVersion } from '@shared/library/to-lift-input';
import type { VersionDetail } from '@shared/schemas/library';
import { sha256, type Storage } from '../../lib/storage';
import { AuditEvent } from '../../modules/audit/audit-event.entity';
import { recordAudit } from '../../modules/audit/service';
import { InvalidLiftData, runCheckRun } from '../../modules/check-runs/service';
import { UploadedFile } from '../../modules/files/file.entity';
import { LibraryUseRow, LibraryVerification } from '../../modules/library/library.entity';
import { carryLibraryUses } from '../../modules/library/uses';
import type { Organisation } from '../../modules/organisations/organisation.entity';
import { LiftPackage, Revision } from '../../modules/packages/package.entity';
import { buildReturn, newVerificationCode } from '../../modules/returns/service';
import { Assignment, DecisionRecord, Finding, Markup } from '../../modules/reviews/review.entity';
import type { Site } from '../../modules/sites/site.entity';
import type { User } from '../../modules/users/user.entity';
import { DEMO, isoDay, type DemoPackage } from './demo-packages';
import { drawPlanPdf } from './plan-pdf';
import { planSections, sketchOf } from './plan-content';
import { versionKey } from './library';

const EXAMPLES = path.resolve(
  path.dirname(fileURLToPath(import.meta.url)),
  '../../../shared/engineering/examples',
);

interface Seeded {
  spec: DemoPackage;
  packageId: string;
  submittedRevisionId: string | null;
}

export async function seedPackages(
  m: EntityManager,
  storage: Storage,
  ctx: {
    orgs: Map<string, Organisation>;
    people: Map<string, User>;
    sites: { refinery: Site; wharf: Site };
    /** Version 1 of every demo configuration (seedLibrary), for the packages built from the library */
    library: Map<string, VersionDetail>;
  },
): Promise<Seeded[]> {
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
    if (spec.craneName) input.crane.name = spec.craneName;
    input.load.description = spec.loadDescription;
    const version = spec.library
      ? ctx.library.get(versionKey(spec.library.fleetNumber, spec.library.configuration))
      : undefined;
    if (spec.library && !version)
      throw new Error(`demo package "${spec.title}": no library configuration ${spec.library.fleetNumber}`);
    if (spec.library && version) fromLibrary(input, version, spec.library);
    if (spec.breakInputs) delete input.chart;
    const pkg = await m.getRepository(LiftPackage).save({
      reference,
      title: spec.title,
      contractorOrganisationId: org.id,
      siteId: site.id,
      createdById: person.id,
      unitSystem: person.unitSystem,
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
    if (spec.library && version) {
      await m.getRepository(LibraryUseRow).save({
        revisionId: revision.id,
        packageId: pkg.id,
        slot: 0,
        versionId: version.id,
        detached: !!spec.library.editedCell,
      });
      // The library's own audit events (as library-audit.ts writes them), against the contractor.
      await m.getRepository(AuditEvent).save({
        packageId: pkg.id,
        organisationId: org.id,
        actorId: person.id,
        action: spec.library.editedCell ? 'library.copy_detached' : 'library.version_picked',
        detail: { revision: 1, slot: 0, configuration: version.configurationName, version: version.number },
      });
    }
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
      const submittedAt = new Date(Date.now() - (3 + Math.abs(spec.daysToLift)) * 86_400_000);
      await m.getRepository(Revision).update(revision.id, {
        state: 'submitted',
        submittedAt,
        submittedById: person.id,
        checkStatus: 'queued',
      });
      await m.getRepository(LiftPackage).update(pkg.id, {
        reviewDueOn: reviewDueOn(submittedAt.toISOString().slice(0, 10), pkg.plannedLiftDate, {
          turnaroundDays: site.reviewTurnaroundDays ?? REVIEW_TIMES_DEFAULT.turnaroundDays,
          marginDays: site.reviewMarginDays ?? REVIEW_TIMES_DEFAULT.marginDays,
        }),
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

/**
 * The planner's lift with the crane taken from a library version, as the editor's pick fills it:
 * the crane, chart, hook block weight and deductions from the version; boom length, radius and
 * slew are the planner's own (the spec's, or the example's), as is the hook block height.
 */
function fromLibrary(
  input: Record<string, Record<string, unknown>>,
  version: VersionDetail,
  lib: NonNullable<DemoPackage['library']>,
) {
  const fill = fillFromVersion(version);
  const planned = input.crane;
  input.crane = {
    ...fill.crane,
    boomLength: lib.boomLength ?? planned.boomLength,
    radius: lib.radius ?? planned.radius,
    ...(planned.slewAngle ? { slewAngle: planned.slewAngle } : {}),
  };
  input.chart = fill.chart;
  if (lib.editedCell) {
    const e = lib.editedCell;
    const row = fill.chart.rows?.find(
      (r) => r.radius?.value === e.radius && r.boomLength?.value === e.boomLength,
    );
    if (!row)
      throw new Error(
        `demo edited cell ${e.boomLength} / ${e.radius} is not in ${version.configurationName}`,
      );
    row.capacity = { value: e.capacity, unit: version.chart.units.capacity };
  }
  if (fill.hookBlock) input.hookBlock = { ...input.hookBlock, ...fill.hookBlock };
  if (fill.chartDeductions)
    input.chartDeductions = fill.chartDeductions as unknown as Record<string, unknown>;
}

/** After the packages are committed: run their checks, then lay the review state on top. */
export async function finishSeededPackages(
  ds: DataSource,
  seeded: Seeded[],
  people: Map<string, User>,
  reviewer: User,
  opts: { storage: Storage; appUrl: string },
) {
  const storage = opts.storage;
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
      if (spec.library?.verifiedBy && submittedRevisionId) {
        // The desk's engineer checked this version's chart against the manufacturer's document once.
        const by = engineers[spec.library.verifiedBy];
        const [use] = await m
          .getRepository(LibraryUseRow)
          .findBy({ revisionId: submittedRevisionId, slot: 0 });
        const note = 'Every cell against the demo chart document, edition "demo" (invented).';
        await m.getRepository(LibraryVerification).save({
          versionId: use.versionId,
          ownerOrganisationId: by.organisationId,
          engineerId: by.id,
          packageId,
          note,
        });
        await m.getRepository(AuditEvent).save({
          packageId,
          organisationId: by.organisationId,
          actorId: by.id,
          action: 'library.chart_verified',
          detail: { version: use.versionId, number: 1, note },
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
        `INSERT INTO stamped_returns (decision_id, package_id, revision_id, verification_code, issued_by_id, unit_system)
         VALUES ($1, $2, $3, $4, $5, (SELECT unit_system FROM lift_packages WHERE id = $2)) RETURNING id`,
        [decision.id, packageId, submittedRevisionId, newVerificationCode(), reviewer.id],
      );
      await buildReturn(ds, storage, row.id, appUrl);
    }
    if (spec.revisingAfter) {
      await ds.transaction(async (m) => {
        const first = await m.getRepository(Revision).findOneByOrFail({ id: submittedRevisionId! });
        const next = await m
          .getRepository(Revision)
          .save({ packageId, number: 2, state: 'draft', inputs: first.inputs });
        await carryLibraryUses(m, first.id, next.id);
        await m
          .getRepository(LiftPackage)
          .update(packageId, { currentRevision: 2, status: 'draft', decision: null });
        await recordAudit(m, { action: 'revision.started', actor: null, packageId, detail: { revision: 2 } });
      });
    }
  }
}

async function pageCount(pdf: Uint8Array) {
  const { PDFDocument } = await import('pdf-lib');
  return (await PDFDocument.load(pdf)).getPageCount();
}
