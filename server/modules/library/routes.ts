// The fleet library's routes, thin, each described for OpenAPI in openapi.ts beside it. The
// contractor keeps its cranes, configurations and versions; the owner side reads the versions its
// packages use and its engineers verify them. Chart files are previewed here; nothing is stored
// until the client sends the accepted grid as a new version.
import type { NextFunction, Request, Response } from 'express';
import { Router } from 'express';
import multer from 'multer';
import { z } from 'zod';
import {
  ChartTextBody,
  ConfigurationBody,
  CraneBody,
  CraneRemovedBody,
  CraneListQuery,
  CranePatch,
  ExportQuery,
  LibraryUseBody,
  VerificationBody,
  VersionBody,
} from '@shared/schemas/library';
import { previewText } from '@shared/library/chart-text';
import type { AppContext } from '../../context';
import { AppError } from '../../lib/app-error';
import { sendStored } from '../../lib/send-stored';
import { currentActor, requireAuth, requireRole } from '../../middleware/auth';
import { valid, validate } from '../../middleware/validate';
import { chartCsv, chartXlsx, previewChartFile } from './chart-files';
import { createCrane, getCrane, listCranes, patchCrane, retireCrane } from './cranes';
import { craneRemoved, listUses, removeUse, setUse } from './uses';
import { verifyVersion } from './verifications';
import { attachDocument, documentTarget, readDocument } from './version-document';
import { uploadLimits, uploadWorkDir } from '../files/pdf-check';
import { receivedUpload, receiveInto, streamedUpload } from '../files/receive';
import {
  addVersion,
  chartOf,
  createConfiguration,
  deleteVersion,
  getConfiguration,
  getVersion,
  retireVersion,
} from './versions';

export const LibraryIdParams = z.object({ id: z.uuid({ error: 'id must be a valid id' }) });
export const LibraryUseParams = z.object({
  id: z.uuid({ error: 'id must be a valid id' }),
  slot: z.coerce
    .number()
    .int()
    .min(0, { error: 'slot must be 0 to 3' })
    .max(3, { error: 'slot must be 0 to 3' }),
});
export const VerifyBody = VerificationBody.extend({ packageId: z.uuid().optional() });

export function libraryRoutes(ctx: AppContext): Router {
  const router = Router();
  const ds = ctx.dataSource;
  const auth = requireAuth(ctx.passport);
  const contractor = requireRole('contractor');
  router.use(['/library', '/packages/:id/library-uses'], auth);

  router.get('/library/cranes', contractor, validate({ query: CraneListQuery }), async (req, res) => {
    res.json(await listCranes(ds, currentActor(req), valid(req, 'query', CraneListQuery)));
  });
  router.post('/library/cranes', contractor, validate({ body: CraneBody }), async (req, res) => {
    res.status(201).json(await createCrane(ds, currentActor(req), valid(req, 'body', CraneBody)));
  });
  router.get('/library/cranes/:id', contractor, validate({ params: LibraryIdParams }), async (req, res) => {
    res.json(await getCrane(ds, currentActor(req), valid(req, 'params', LibraryIdParams).id));
  });
  router.patch(
    '/library/cranes/:id',
    contractor,
    validate({ params: LibraryIdParams, body: CranePatch }),
    async (req, res) => {
      const { id } = valid(req, 'params', LibraryIdParams);
      res.json(await patchCrane(ds, currentActor(req), id, valid(req, 'body', CranePatch)));
    },
  );
  router.post(
    '/library/cranes/:id/retire',
    contractor,
    validate({ params: LibraryIdParams }),
    async (req, res) => {
      res.json(await retireCrane(ds, currentActor(req), valid(req, 'params', LibraryIdParams).id));
    },
  );
  router.post(
    '/library/cranes/:id/configurations',
    contractor,
    validate({ params: LibraryIdParams, body: ConfigurationBody }),
    async (req, res) => {
      const { id } = valid(req, 'params', LibraryIdParams);
      res
        .status(201)
        .json(await createConfiguration(ds, currentActor(req), id, valid(req, 'body', ConfigurationBody)));
    },
  );
  router.get(
    '/library/configurations/:id',
    contractor,
    validate({ params: LibraryIdParams }),
    async (req, res) => {
      res.json(await getConfiguration(ds, currentActor(req), valid(req, 'params', LibraryIdParams).id));
    },
  );
  router.post(
    '/library/configurations/:id/versions',
    contractor,
    validate({ params: LibraryIdParams, body: VersionBody }),
    async (req, res) => {
      const { id } = valid(req, 'params', LibraryIdParams);
      res.status(201).json(await addVersion(ds, currentActor(req), id, valid(req, 'body', VersionBody)));
    },
  );
  router.get('/library/versions/:id', validate({ params: LibraryIdParams }), async (req, res) => {
    res.json(await getVersion(ds, currentActor(req), valid(req, 'params', LibraryIdParams).id));
  });
  router.post(
    '/library/versions/:id/retire',
    contractor,
    validate({ params: LibraryIdParams }),
    async (req, res) => {
      res.json(await retireVersion(ds, currentActor(req), valid(req, 'params', LibraryIdParams).id));
    },
  );
  router.delete(
    '/library/versions/:id',
    contractor,
    validate({ params: LibraryIdParams }),
    async (req, res) => {
      await deleteVersion(ds, ctx.storage, currentActor(req), valid(req, 'params', LibraryIdParams).id);
      res.status(204).end();
    },
  );

  const receive = (limit: number, what: string) => {
    const upload = multer({
      storage: multer.memoryStorage(),
      preservePath: true,
      limits: { fileSize: limit, files: 1, fields: 2 },
    }).single('file');
    return (req: Request, res: Response, next: NextFunction) =>
      upload(req, res, (err: unknown) => {
        if (err instanceof multer.MulterError) {
          const mb = Math.round((limit / 1024 / 1024) * 10) / 10;
          if (err.code === 'LIMIT_FILE_SIZE')
            return next(
              new AppError(413, 'file_too_large', `The ${what} is larger than the limit of ${mb} MB.`, [
                { path: 'file', message: `file must be at most ${mb} MB` },
              ]),
            );
          return next(
            new AppError(400, 'bad_upload', `The upload was refused: ${err.message}.`, [
              { path: err.field ?? 'file', message: err.message },
            ]),
          );
        }
        next(err);
      });
  };
  const fileOf = (req: Request) => {
    if (!req.file)
      throw AppError.badRequest('Attach one file in the form field "file".', [
        { path: 'file', message: 'file is required' },
      ]);
    return { name: Buffer.from(req.file.originalname, 'latin1').toString('utf8'), bytes: req.file.buffer };
  };

  // The document streams into the object store (files/receive.ts), under a key named once the
  // version is known to be the person's and still without a document.
  const receiveDocument = streamedUpload({
    storage: ctx.storage,
    workDir: uploadWorkDir(ctx.config),
    maxBytes: ctx.config.UPLOAD_MAX_BYTES,
    what: "manufacturer's document",
    fields: 2,
  });
  router.post(
    '/library/versions/:id/document',
    contractor,
    validate({ params: LibraryIdParams }),
    async (req, _res, next) => {
      const target = await documentTarget(ds, currentActor(req), valid(req, 'params', LibraryIdParams).id);
      receiveInto(req, target.storageKey);
      next();
    },
    receiveDocument,
    async (req, res) => {
      const { id } = valid(req, 'params', LibraryIdParams);
      const upload = receivedUpload(req);
      if (!upload)
        throw AppError.badRequest('Attach one file in the form field "file".', [
          { path: 'file', message: 'file is required' },
        ]);
      res
        .status(201)
        .json(await attachDocument(ds, ctx.storage, currentActor(req), id, upload, uploadLimits(ctx.config)));
    },
  );
  router.get('/library/versions/:id/document', validate({ params: LibraryIdParams }), async (req, res) => {
    const file = await readDocument(ds, currentActor(req), valid(req, 'params', LibraryIdParams).id);
    await sendStored(req, res, ctx.storage, {
      key: file.storageKey,
      contentType: 'application/pdf',
      disposition: `inline; filename="${encodeURIComponent(file.name)}"`,
      sha256: file.sha256,
      what: "manufacturer's document",
    });
  });
  router.get(
    '/library/versions/:id/chart',
    validate({ params: LibraryIdParams, query: ExportQuery }),
    async (req, res) => {
      const { grid, name } = await chartOf(ds, currentActor(req), valid(req, 'params', LibraryIdParams).id);
      const { format } = valid(req, 'query', ExportQuery);
      const file = `${name.replace(/[^\w.-]+/g, '-')}.${format}`;
      res.setHeader('Content-Disposition', `attachment; filename="${file}"`);
      if (format === 'csv') {
        res.setHeader('Content-Type', 'text/csv; charset=utf-8');
        res.send(chartCsv(grid));
      } else {
        res.setHeader('Content-Type', 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet');
        res.end(await chartXlsx(grid, name));
      }
    },
  );
  router.post(
    '/library/versions/:id/verifications',
    requireRole('engineer'),
    validate({ params: LibraryIdParams, body: VerifyBody }),
    async (req, res) => {
      const { id } = valid(req, 'params', LibraryIdParams);
      const body = valid(req, 'body', VerifyBody);
      res.status(201).json(await verifyVersion(ds, currentActor(req), id, body.note, body.packageId));
    },
  );

  router.post(
    '/library/chart-import/file',
    contractor,
    receive(ctx.config.CHART_IMPORT_MAX_BYTES, 'chart file'),
    async (req, res) => {
      const f = fileOf(req);
      res.json(await previewChartFile(f.name, f.bytes));
    },
  );
  router.post(
    '/library/chart-import/text',
    contractor,
    validate({ body: ChartTextBody }),
    async (req, res) => {
      res.json(previewText(valid(req, 'body', ChartTextBody).text));
    },
  );

  router.get('/packages/:id/library-uses', validate({ params: LibraryIdParams }), async (req, res) => {
    res.json(await listUses(ds, currentActor(req), valid(req, 'params', LibraryIdParams).id));
  });
  router.put(
    '/packages/:id/library-uses',
    contractor,
    validate({ params: LibraryIdParams, body: LibraryUseBody }),
    async (req, res) => {
      const { id } = valid(req, 'params', LibraryIdParams);
      res.json(await setUse(ds, currentActor(req), id, valid(req, 'body', LibraryUseBody)));
    },
  );
  router.post(
    '/packages/:id/library-uses/crane-removed',
    contractor,
    validate({ params: LibraryIdParams, body: CraneRemovedBody }),
    async (req, res) => {
      const { id } = valid(req, 'params', LibraryIdParams);
      const { slot } = valid(req, 'body', CraneRemovedBody);
      res.json(await craneRemoved(ds, currentActor(req), id, slot));
    },
  );
  router.delete(
    '/packages/:id/library-uses/:slot',
    contractor,
    validate({ params: LibraryUseParams }),
    async (req, res) => {
      const { id, slot } = valid(req, 'params', LibraryUseParams);
      await removeUse(ds, currentActor(req), id, slot);
      res.status(204).end();
    },
  );
  return router;
}
