// What a stamped return is built from, read from the database once: the package, the revision,
// the decision it is issued for, the people, the markups with their findings' numbers and the
// calculation. The stamp job and the preview read it the same way, so the preview prints what the
// return will.
import path from 'node:path';
import type { DataSource } from 'typeorm';
import type { UnitSystem } from '@shared/schemas/common';
import type { Storage } from '../../lib/storage';
import { UploadedFile } from '../files/file.entity';
import { Organisation } from '../organisations/organisation.entity';
import { LiftPackage, Revision } from '../packages/package.entity';
import { DecisionRecord, Finding, Markup } from '../reviews/review.entity';
import { Site } from '../sites/site.entity';
import { User } from '../users/user.entity';
import { findingLabel, findingsByMarkup, markupPlace, markupReturnPage } from './finding-marks';
import { resultInUnits } from './result-in-units';
import type { StampInput } from './stamp-input';

export interface ReturnSubject {
  packageId: string;
  revisionId: string;
  decisionId: string;
  issuedById: string;
  unitSystem: UnitSystem;
  issuedAt: Date;
  verificationCode: string;
}

export async function readReturnInput(ds: DataSource, subject: ReturnSubject, appUrl: string) {
  const pkg = await ds.getRepository(LiftPackage).findOneByOrFail({ id: subject.packageId });
  const revision = await ds.getRepository(Revision).findOneByOrFail({ id: subject.revisionId });
  const decision = await ds.getRepository(DecisionRecord).findOneByOrFail({ id: subject.decisionId });
  const site = await ds.getRepository(Site).findOneByOrFail({ id: pkg.siteId });
  const contractor = await ds
    .getRepository(Organisation)
    .findOneByOrFail({ id: pkg.contractorOrganisationId });
  const engineer = await ds.getRepository(User).findOneByOrFail({ id: decision.engineerId });
  const reviewer = await ds.getRepository(User).findOneByOrFail({ id: subject.issuedById });
  const files = await ds
    .getRepository(UploadedFile)
    .find({ where: { revisionId: revision.id }, order: { kind: 'ASC', createdAt: 'ASC' } });
  const markups = await ds
    .getRepository(Markup)
    .find({ where: { revisionId: revision.id }, order: { createdAt: 'ASC' } });
  const findings = await ds
    .getRepository(Finding)
    .find({ where: { packageId: pkg.id }, order: { createdAt: 'ASC' } });
  const tags = findingsByMarkup(findings);
  const input: Omit<StampInput, 'documents'> = {
    placement: revision.stampPlacement ?? null,
    markups: markups.map((mk) => ({
      fileId: mk.fileId,
      pageNumber: mk.pageNumber,
      kind: mk.kind,
      geometry: mk.geometry as Record<string, number>,
      colour: mk.colour as 'rust',
      text: mk.text,
      number: mk.number,
      findings: tags.get(mk.id) ?? [],
    })),
    stamp: {
      decision: decision.decision,
      reference: pkg.reference,
      title: pkg.title,
      revision: revision.number,
      site: site.name,
      contractor: contractor.name,
      engineer: engineer.name,
      reviewer: reviewer.name,
      decidedAt: decision.createdAt.toISOString(),
      issuedAt: subject.issuedAt.toISOString(),
      timeZone: site.timeZone,
      conditions: decision.conditions,
      overrideReason: decision.overrideReason,
      overridden: decision.overridden ?? [],
      verificationCode: subject.verificationCode,
      verificationUrl: `${appUrl}/verify/${subject.verificationCode}`,
    },
    calculation: {
      inputs: revision.inputs,
      result: resultInUnits(revision, subject.unitSystem),
      units: subject.unitSystem,
      findings: findings.map((f, i) => ({
        label: findingLabel(i),
        markup: markupPlace(files, markups, f.markupId, findingLabel(i)),
        markupPage: markupReturnPage(files, markups, f.markupId),
        text: f.text,
        severity: f.severity,
        state: f.state,
        response: f.response,
        checkId: f.checkId,
        pageNumber: f.pageNumber,
      })),
      acceptedFigures: (revision.acceptedFigures ?? []).map((a) => ({
        figure: a.figure,
        reason: a.reason,
        engineer: a.engineer,
      })),
    },
  };
  return { input, files, pkg, revision, decision, site };
}

/** The revision's originals copied out of storage into `work`, as the builder reads them (files on disk). */
export async function fetchOriginals(
  storage: Storage,
  files: Pick<UploadedFile, 'id' | 'storageKey' | 'originalName'>[],
  work: string,
) {
  const documents = [];
  for (const [i, f] of files.entries()) {
    const file = path.join(work, `original-${i}.pdf`);
    await storage.getFile(f.storageKey, file);
    documents.push({ fileId: f.id, name: f.originalName, file });
  }
  return documents;
}
