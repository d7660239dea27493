// The engineer's placement of the stamp block on page 1 of the current revision's plan: where it
// will land (read by the workspace's outline and answered after every change), placing it and
// handing the choice back to the desk. A placement must lie on the page (400 naming x or y and
// its limits) and over nothing: a block placed over the plan's content, a markup or the footer
// is refused (422 `stamp_over_content`) rather than drawn there or moved without a word, since
// the return never hides plan content and the engineer is the one who can choose another
// spot. Like the decision it is fixed once the revision's return is requested (409
// `return_issued`, underReview).
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { DataSource } from 'typeorm';
import type { Actor } from '@shared/rules/actor';
import { placementOutside, STAMP_SIZE } from '@shared/drawing/stamp-outline';
import type { StampPlacementBody, StampPlacementView } from '@shared/schemas/stamp-placement';
import { AppError } from '../../lib/app-error';
import type { Storage } from '../../lib/storage';
import { UploadedFile } from '../files/file.entity';
import { Revision } from '../packages/package.entity';
import { findScopedPackage } from '../packages/package-scope';
import { firstPageInk, frameFromBoxes, originalPages } from '../returns/original-pages';
import { fetchOriginals } from '../returns/return-input';
import { chooseStampSpot, deskReserved, spotIsFree } from '../returns/stamp-placement';
import { Markup } from './review.entity';
import { requireAssignedEngineer, underReview } from './review-scope';

/** Page 1 of the revision's plan as the stamp builder reads it: its display size, its ink and the desk's own drawing. */
async function inspectFirstPage(ds: DataSource, storage: Storage, revision: Revision) {
  // The plan first, as the return orders its documents (return-input.ts).
  const [plan] = await ds
    .getRepository(UploadedFile)
    .find({ where: { revisionId: revision.id }, order: { kind: 'ASC', createdAt: 'ASC' }, take: 1 });
  if (!plan) throw new AppError(409, 'no_plan', `Revision ${revision.number} has no PDF to stamp.`);
  const marks = await ds
    .getRepository(Markup)
    .find({ where: { revisionId: revision.id, fileId: plan.id, pageNumber: 1 } });
  const work = await mkdtemp(path.join(tmpdir(), 'stamp-placement-'));
  try {
    const [doc] = await fetchOriginals(storage, [plan], work);
    const [first] = await originalPages(doc.file, plan.originalName);
    const frame = frameFromBoxes(first);
    const ink = await firstPageInk(doc.file, first, work);
    const reserved = deskReserved(
      frame,
      marks.map((m) => ({ kind: m.kind, geometry: m.geometry as Record<string, number>, text: m.text })),
    );
    return { fileId: plan.id, page: { width: frame.width, height: frame.height }, ink, reserved };
  } finally {
    await rm(work, { recursive: true, force: true });
  }
}

type Inspected = Awaited<ReturnType<typeof inspectFirstPage>>;

function view(revision: number, seen: Inspected, placement: StampPlacementBody | null): StampPlacementView {
  const lands = chooseStampSpot({ ...seen, size: STAMP_SIZE, placed: placement });
  return {
    revision,
    fileId: seen.fileId,
    placement,
    page: seen.page,
    stamp: { ...STAMP_SIZE },
    lands: lands.on === 'page' ? { on: 'page', how: lands.how, rect: lands.rect } : lands,
  };
}

async function currentRevision(ds: DataSource, user: Actor, packageId: string) {
  const pkg = await findScopedPackage(ds.manager, user, packageId);
  const revision = await ds
    .getRepository(Revision)
    .findOneBy({ packageId: pkg.id, number: pkg.currentRevision });
  if (!revision) throw AppError.notFound('revision');
  return { pkg, revision };
}

export async function getStampPlacement(ds: DataSource, storage: Storage, user: Actor, packageId: string) {
  const { revision } = await currentRevision(ds, user, packageId);
  return view(revision.number, await inspectFirstPage(ds, storage, revision), revision.stampPlacement);
}

/** Save `placement` (null: the desk chooses) on the revision inspected, under the package lock. */
async function save(
  ds: DataSource,
  user: Actor,
  packageId: string,
  revisionId: string,
  placement: StampPlacementBody | null,
) {
  return underReview(
    ds,
    user,
    packageId,
    'place_stamp',
    'The stamp can be placed',
    async (m, _pkg, revision) => {
      if (revision.id !== revisionId)
        throw new AppError(409, 'stale_review', 'A new revision was started meanwhile; nothing was saved.');
      await m.getRepository(Revision).update({ id: revision.id }, { stampPlacement: placement });
      return revision.number;
    },
  );
}

export async function placeStamp(
  ds: DataSource,
  storage: Storage,
  user: Actor,
  packageId: string,
  body: StampPlacementBody,
) {
  const { pkg, revision } = await currentRevision(ds, user, packageId);
  requireAssignedEngineer(user, pkg);
  const seen = await inspectFirstPage(ds, storage, revision);
  const outside = placementOutside(body, seen.page);
  if (outside) throw AppError.badRequest(`${outside.path}: ${outside.message}`, [outside]);
  const at = { x: Math.round(body.x * 10) / 10, y: Math.round(body.y * 10) / 10 };
  if (!spotIsFree(seen, { ...at, ...STAMP_SIZE })) {
    throw new AppError(
      422,
      'stamp_over_content',
      `The stamp placed at x ${at.x} pt, y ${at.y} pt would cover part of page 1 (the plan's own content, a markup or the footer), and the return never hides the plan. Drag it to an empty area, or let the desk choose (an empty corner, else a cover sheet).`,
      [{ path: 'x', message: 'x and y put the stamp over page 1’s content: choose an empty area' }],
    );
  }
  const saved = await save(ds, user, packageId, revision.id, at);
  return view(saved, seen, at);
}

export async function resetStampPlacement(ds: DataSource, storage: Storage, user: Actor, packageId: string) {
  const { pkg, revision } = await currentRevision(ds, user, packageId);
  requireAssignedEngineer(user, pkg);
  const saved = await save(ds, user, packageId, revision.id, null);
  return view(saved, await inspectFirstPage(ds, storage, revision), null);
}
