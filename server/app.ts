// Builds the Express app (no listen): security headers, request logs, compression, JSON
// parsing, the API routes, the built client with its history fallback, and one error handler.
import fs from 'node:fs';
import path from 'node:path';
import cookieParser from 'cookie-parser';
import express from 'express';
import helmet from 'helmet';
import { pinoHttp } from 'pino-http';
import { randomUUID } from 'node:crypto';
import { trustProxySetting } from './config';
import type { AppContext } from './context';
import { logger, redactUrl } from './lib/logger';
import { openApiDocument } from './openapi';
import { errorHandler, notFoundHandler } from './middleware/error-handler';
import { clientFiles, compressResponses } from './middleware/delivery';
import { contentTypeGuard, csrfGuard, inputTextGuard, verifyJsonDepth } from './middleware/request-guards';
import { adminRoutes } from './modules/admin/routes';
import { authRoutes } from './modules/auth/routes';
import { calculationRoutes } from './modules/calculations/routes';
import { checkRunRoutes } from './modules/check-runs/routes';
import { healthRoutes } from './modules/health/routes';
import { libraryRoutes } from './modules/library/routes';
import { liveRoutes } from './modules/live/routes';
import { packageRoutes } from './modules/packages/routes';
import { profileRoutes } from './modules/profile/routes';
import { returnRoutes } from './modules/returns/routes';
import { reviewRoutes } from './modules/reviews/routes';
import { siteRoutes } from './modules/sites/routes';
import { verifyRoutes } from './modules/verify/routes';

export function createApp(ctx: AppContext, opts: { clientDir?: string } = {}) {
  const app = express();
  app.disable('x-powered-by');
  // X-Forwarded-For is believed only when a proxy is configured (TRUST_PROXY); otherwise
  // any client could rotate its address past the rate limits with one header.
  app.set('trust proxy', trustProxySetting(ctx.config.TRUST_PROXY));
  // Served over plain http on a loopback or LAN address, HSTS and the upgrade directive
  // would send browsers to an https port that does not exist.
  const https = (ctx.config.APP_URL ?? '').startsWith('https://');
  app.use(
    helmet({
      strictTransportSecurity: https,
      contentSecurityPolicy: {
        directives: {
          'upgrade-insecure-requests': https ? [] : null,
          'img-src': ["'self'", 'data:', 'blob:'],
          'worker-src': ["'self'", 'blob:'],
          'script-src': ["'self'"],
        },
      },
    }),
  );
  app.use(
    pinoHttp({
      logger,
      genReqId: (req) => (req.headers['x-request-id'] as string) || randomUUID(),
      autoLogging: { ignore: (req) => !req.url?.startsWith('/api') },
      serializers: {
        req: (req: { url?: string }) => ({ ...req, url: redactUrl(req.url) }),
      },
    }),
  );
  app.use(compressResponses());
  app.use(cookieParser());
  app.use('/api', csrfGuard(ctx.config.APP_URL ? new URL(ctx.config.APP_URL).origin : null));
  app.use('/api', contentTypeGuard);
  app.use('/api', express.json({ limit: '2mb', verify: verifyJsonDepth }));
  app.use('/api', inputTextGuard);

  app.use('/api', healthRoutes(ctx));
  app.use('/api', authRoutes(ctx));
  app.use('/api', checkRunRoutes(ctx));
  app.use('/api', packageRoutes(ctx));
  app.use('/api', adminRoutes(ctx));
  app.use('/api', siteRoutes(ctx));
  app.use('/api', calculationRoutes(ctx));
  app.use('/api', reviewRoutes(ctx));
  app.use('/api', returnRoutes(ctx));
  app.use('/api', verifyRoutes(ctx));
  app.use('/api', profileRoutes(ctx));
  app.use('/api', libraryRoutes(ctx));
  app.use('/api', liveRoutes(ctx));
  app.get('/api/openapi.json', (_req, res) => {
    res.json(openApiDocument());
  });
  app.use('/api', notFoundHandler);

  const clientDir = opts.clientDir ?? path.resolve('dist');
  if (fs.existsSync(path.join(clientDir, 'index.html'))) {
    app.use(clientFiles(clientDir));
  }
  app.use(notFoundHandler);
  app.use(errorHandler);
  return app;
}
