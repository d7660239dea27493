// The engineer's markups on the pages of a submitted revision: list, add, delete (not once
// the revision's stamped return is requested).
import type { Actor } from '@shared/rules/actor';
import type { DataSource, EntityManager } from 'typeorm';
import { In } from 'typeorm';
import type { Markup as MarkupDto, MarkupBody } from '@shared/schemas/reviews';
import { AppError } from '../../lib/app-error';
import { UploadedFile } from '../files/file.entity';
import { Revision } from '../packages/package.entity';
import { findScopedPackage } from '../packages/package-scope';
import { User } from '../users/user.entity';
import { Markup } from './review.entity';
import { underReview } from './review-scope';

export async function names(m: EntityManager, ids: string[]) {
  const users = ids.length ? await m.getRepository(User).findBy({ id: In([...new Set(ids)]) }) : [];
  return new Map(users.map((u) => [u.id, u.name]));
}

function toMarkup(mk: Markup, who: Map<string, string>): MarkupDto {
  return {
    id: mk.id,
    revisionId: mk.revisionId,
    fileId: mk.fileId,
    pageNumber: mk.pageNumber,
    kind: mk.kind,
    geometry: mk.geometry as Record<string, number>,
    colour: mk.colour as MarkupDto['colour'],
    text: mk.text,
    number: mk.number,
    createdBy: who.get(mk.createdById) ?? '',
    createdAt: mk.createdAt.toISOString(),
  };
}

export async function listMarkups(ds: DataSource, user: Actor, packageId: string, revisionNumber?: number) {
  const pkg = await findScopedPackage(ds.manager, user, packageId);
  const revision = await ds
    .getRepository(Revision)
    .findOneBy({ packageId: pkg.id, number: revisionNumber ?? pkg.currentRevision });
  if (!revision) throw AppError.notFound('revision');
  const markups = await ds
    .getRepository(Markup)
    .find({ where: { revisionId: revision.id }, order: { createdAt: 'ASC' } });
  const who = await names(
    ds.manager,
    markups.map((x) => x.createdById),
  );
  return { items: markups.map((x) => toMarkup(x, who)) };
}

export async function addMarkup(ds: DataSource, user: Actor, packageId: string, body: MarkupBody) {
  return underReview(
    ds,
    user,
    packageId,
    'edit_markups',
    'Markups can be added',
    async (m, _pkg, revision) => {
      const file = await m
        .getRepository(UploadedFile)
        .findOneBy({ id: body.fileId, revisionId: revision.id });
      if (!file)
        throw AppError.badRequest('fileId: not a file of this revision', [
          { path: 'fileId', message: 'fileId must be one of the revision’s files' },
        ]);
      if (body.pageNumber > file.pages) {
        throw AppError.badRequest(`pageNumber: the file has ${file.pages} pages`, [
          { path: 'pageNumber', message: `pageNumber must be between 1 and ${file.pages}` },
        ]);
      }
      let number: number | null = null;
      if (body.kind === 'pin') {
        // The package lock underReview holds numbers the pins one at a time.
        const [row] = await m.query(
          `SELECT coalesce(max(number), 0) + 1 AS n FROM markups WHERE revision_id = $1 AND kind = 'pin'`,
          [revision.id],
        );
        number = Number(row.n);
      }
      const saved = await m.getRepository(Markup).save({
        revisionId: revision.id,
        fileId: file.id,
        pageNumber: body.pageNumber,
        kind: body.kind,
        geometry: body.geometry,
        colour: body.colour,
        text: body.text ?? null,
        number,
        createdById: user.id,
      });
      return toMarkup(saved, new Map([[user.id, user.name]]));
    },
  );
}

export async function deleteMarkup(ds: DataSource, user: Actor, packageId: string, markupId: string) {
  await underReview(
    ds,
    user,
    packageId,
    'edit_markups',
    'Markups can be removed',
    async (m, _pkg, revision) => {
      const result = await m.getRepository(Markup).delete({ id: markupId, revisionId: revision.id });
      if (!result.affected) throw AppError.notFound('markup');
    },
  );
}
