import { existsSync } from 'node:fs';
import { join, resolve } from 'node:path';
import express, { type Express } from 'express';
import cookieParser from 'cookie-parser';
import helmet from 'helmet';
import { pino, type Logger } from 'pino';
import { pinoHttp } from 'pino-http';
import { RequestContext, type MikroORM } from '@mikro-orm/sqlite';
import type { AppConfig } from './config';
import { errorHandler, notFoundApi } from './errors';
import type { RouteMeta } from './http/api-router';
import { originCheck } from './http/origin-check';
import { authRoutes } from './modules/users/auth.routes';
import { userRoutes } from './modules/users/users.routes';
import { projectRoutes } from './modules/projects/projects.routes';
import { boreRoutes } from './modules/bores/bores.routes';
import { lineRoutes } from './modules/lines/lines.routes';
import { holeRoutes } from './modules/holes/holes.routes';
import { ruleRoutes } from './modules/rules/rules.routes';
import { conflictRoutes } from './modules/conflicts/conflicts.routes';
import { clearanceRoutes } from './modules/clearances/clearances.routes';
import { adminMailRoutes, projectMailRoutes } from './modules/mail/mail.routes';
import type { MailRuntime } from './modules/mail/mail-runtime';
import { stakeoutRoutes } from './modules/stakeout/stakeout.routes';
import { tileRoutes } from './modules/tiles/tiles.routes';
import { exportRoutes } from './modules/exports/exports.routes';
import { importRoutes } from './modules/imports/imports.routes';
import type { FileStorage } from './storage/storage';

export interface AppDeps {
  orm: MikroORM;
  config: AppConfig;
  storage: FileStorage;
  logger?: Logger;
  /** Folder of the built client to serve; omitted in API tests. */
  clientDir?: string;
  /** Outgoing mail (server/index.ts starts it); omitted in API tests, which drive the outbox themselves. */
  mail?: MailRuntime;
}

/** JSON bodies larger than this get 413. Photos go through multipart uploads, not JSON. */
export const JSON_BODY_LIMIT = '1mb';
/** Line imports carry the file in the JSON body (GeoJSON, DXF or CSV text up to 15 million characters). */
export const IMPORT_BODY_LIMIT = '32mb';

/**
 * Build the Express app with no port and no side effects, so tests can drive it with supertest.
 * The route table (`app.locals.routes`) lists every API route with its access rule.
 */
export function createApp(deps: AppDeps): Express {
  const { orm, config, storage } = deps;
  const logger = deps.logger ?? pino({ level: config.logLevel });
  const app = express();
  const routes: RouteMeta[] = [];
  app.locals.routes = routes;

  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');
  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: true,
        directives: {
          'default-src': ["'self'"],
          'img-src': ["'self'", 'data:', 'blob:'],
          'style-src': ["'self'", "'unsafe-inline'"],
          'font-src': ["'self'", 'data:'],
          'connect-src': ["'self'"],
          'upgrade-insecure-requests': null,
        },
      },
      crossOriginEmbedderPolicy: false,
    }),
  );
  app.use(pinoHttp({ logger, autoLogging: { ignore: (req) => req.url === '/api/health' } }));

  app.get('/api/health', (_req, res) => {
    res.json({ status: 'ok' });
  });
  routes.push({ method: 'get', path: '/api/health', access: 'public', project: false, hasBody: false });

  // Parsed first with a larger limit; the general parser below then leaves these bodies alone.
  app.use('/api/projects/:projectId/imports', express.json({ limit: IMPORT_BODY_LIMIT }));
  app.use('/api', express.json({ limit: JSON_BODY_LIMIT }), cookieParser(), originCheck(config.appOrigins));
  app.use('/api', (_req, _res, next) => RequestContext.create(orm.em, next));

  for (const api of [
    authRoutes(routes, config),
    userRoutes(routes, config),
    projectRoutes(routes, config),
    boreRoutes(routes, config),
    lineRoutes(routes, config),
    holeRoutes(routes, config, storage),
    ruleRoutes(routes, config),
    conflictRoutes(routes, config, deps.mail ?? null),
    clearanceRoutes(routes, config),
    stakeoutRoutes(routes, config),
    projectMailRoutes(routes, config, deps.mail ?? null),
    adminMailRoutes(routes, config, deps.mail ?? null),
    tileRoutes(routes, config),
    exportRoutes(routes, config, storage),
    importRoutes(routes, config),
  ]) {
    app.use(api.mountPath, api.router);
  }
  app.use('/api', notFoundApi);

  if (deps.clientDir && existsSync(join(deps.clientDir, 'index.html'))) {
    const dir = resolve(deps.clientDir);
    app.use('/assets', express.static(join(dir, 'assets'), { immutable: true, maxAge: '1y', index: false }));
    app.use(express.static(dir, { index: false, maxAge: 0 }));
    // Client-side routes: every other GET gets the app shell.
    app.get('/{*splat}', (_req, res) => {
      res.set('Cache-Control', 'no-cache').sendFile(join(dir, 'index.html'));
    });
  }

  app.use(errorHandler(logger));
  return app;
}
