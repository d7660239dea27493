// Lift package routes. Thin: check the role, validate, call the service, answer.
import { Router } from 'express';
import { z } from 'zod';
import {
  CreatePackageBody,
  PackageListQuery,
  SaveDraftBody,
  UploadFileFields,
} from '@shared/schemas/packages';
import { appUrl } from '../../config';
import type { AppContext } from '../../context';
import { AppError, fromZod } from '../../lib/app-error';
import { sendStored } from '../../lib/send-stored';
import { currentActor, requireAuth, requireRole } from '../../middleware/auth';
import { valid, validate } from '../../middleware/validate';
import { uploadLimits, uploadWorkDir } from '../files/pdf-check';
import { discardUpload, receivedUpload, receiveInto, streamedUpload } from '../files/receive';
import { addFile, readFile, removeFile, uploadTarget } from '../files/service';
import { createPackage, duplicatePackage, saveDraft, submitPackage } from './drafts';
import { deleteDraftPackage } from './delete-draft';
import { listPackages } from './list-packages';
import { getPackage, getRevision, packageDetail } from './service';

export const PackageIdParams = z.object({ id: z.uuid({ message: 'id must be a UUID' }) });
export const FileParams = PackageIdParams.extend({ fileId: z.uuid({ message: 'fileId must be a UUID' }) });
export const RevisionParams = PackageIdParams.extend({
  number: z.coerce.number().int().min(1, 'number must be 1 or more').max(1000, 'number must be at most 1000'),
});

export function packageRoutes(ctx: AppContext): Router {
  const router = Router();
  const { dataSource: ds } = ctx;
  const contractorOnly = requireRole('contractor');
  router.use('/packages', requireAuth(ctx.passport));

  router.get('/packages', validate({ query: PackageListQuery }), async (req, res) => {
    res.json(await listPackages(ds, currentActor(req), valid(req, 'query', PackageListQuery)));
  });

  router.post('/packages', contractorOnly, validate({ body: CreatePackageBody }), async (req, res) => {
    const id = await createPackage(ds, currentActor(req), valid(req, 'body', CreatePackageBody));
    res.status(201).json(await packageDetail(ds, id, currentActor(req)));
  });

  router.get('/packages/:id', validate({ params: PackageIdParams }), async (req, res) => {
    res.json(await getPackage(ds, currentActor(req), valid(req, 'params', PackageIdParams).id));
  });

  router.get('/packages/:id/revisions/:number', validate({ params: RevisionParams }), async (req, res) => {
    const { id, number } = valid(req, 'params', RevisionParams);
    res.json(await getRevision(ds, currentActor(req), id, number));
  });

  router.put(
    '/packages/:id/draft',
    contractorOnly,
    validate({ params: PackageIdParams, body: SaveDraftBody }),
    async (req, res) => {
      const { id } = valid(req, 'params', PackageIdParams);
      await saveDraft(ds, currentActor(req), id, valid(req, 'body', SaveDraftBody));
      res.json(await packageDetail(ds, id, currentActor(req)));
    },
  );

  router.delete('/packages/:id', contractorOnly, validate({ params: PackageIdParams }), async (req, res) => {
    await deleteDraftPackage(ds, ctx.storage, currentActor(req), valid(req, 'params', PackageIdParams).id);
    res.status(204).end();
  });

  router.post(
    '/packages/:id/duplicate',
    contractorOnly,
    validate({ params: PackageIdParams }),
    async (req, res) => {
      const newId = await duplicatePackage(ds, currentActor(req), valid(req, 'params', PackageIdParams).id);
      res.status(201).json(await packageDetail(ds, newId, currentActor(req)));
    },
  );

  router.post(
    '/packages/:id/submit',
    contractorOnly,
    validate({ params: PackageIdParams }),
    async (req, res) => {
      const { id } = valid(req, 'params', PackageIdParams);
      await submitPackage(ds, ctx.queues, currentActor(req), id, appUrl(ctx.config));
      res.status(202).json(await packageDetail(ds, id, currentActor(req)));
    },
  );

  // The body streams into the object store under the key named here, once the package is
  // known to be the person's and its revision a draft (nothing is read for a refused request).
  const receive = streamedUpload({
    storage: ctx.storage,
    workDir: uploadWorkDir(ctx.config),
    maxBytes: ctx.config.UPLOAD_MAX_BYTES,
    what: 'file',
    fields: 5,
  });
  router.post(
    '/packages/:id/files',
    contractorOnly,
    validate({ params: PackageIdParams }),
    async (req, res, next) => {
      const target = await uploadTarget(ds, currentActor(req), valid(req, 'params', PackageIdParams).id);
      res.locals.uploadTarget = target;
      receiveInto(req, target.storageKey);
      next();
    },
    receive,
    async (req, res) => {
      const { id } = valid(req, 'params', PackageIdParams);
      const upload = receivedUpload(req);
      if (!upload)
        throw AppError.badRequest('Attach one PDF in the form field "file".', [
          { path: 'file', message: 'file is required' },
        ]);
      const fields = UploadFileFields.safeParse(req.body ?? {});
      if (!fields.success) {
        await discardUpload(ctx.storage, upload);
        throw fromZod(fields.error);
      }
      const summary = await addFile(
        ds,
        ctx.storage,
        currentActor(req),
        id,
        res.locals.uploadTarget as { id: string },
        { ...upload, kind: fields.data.kind },
        uploadLimits(ctx.config),
      );
      res.status(201).json(summary);
    },
  );

  router.delete(
    '/packages/:id/files/:fileId',
    contractorOnly,
    validate({ params: FileParams }),
    async (req, res) => {
      const { id, fileId } = valid(req, 'params', FileParams);
      await removeFile(ds, ctx.storage, currentActor(req), id, fileId);
      res.status(204).end();
    },
  );

  router.get('/packages/:id/files/:fileId', validate({ params: FileParams }), async (req, res) => {
    const { id, fileId } = valid(req, 'params', FileParams);
    const file = await readFile(ds, currentActor(req), id, fileId);
    await sendStored(req, res, ctx.storage, {
      key: file.storageKey,
      contentType: 'application/pdf',
      disposition: `inline; filename="${encodeURIComponent(file.originalName)}"`,
      sha256: file.sha256,
      what: 'file',
    });
  });

  return router;
}
