import express from 'express';
import helmet from 'helmet';
import path from 'node:path';
import fs from 'node:fs';
import type { Sequelize } from 'sequelize';
import type { AppConfig } from './config/config';
import { configurePassport } from './auth/passport-setup';
import { createSessionMiddleware } from './http/session-middleware';
import { requireCsrf } from './http/csrf';
import { apiNotFound, errorHandler } from './http/error-handler';
import { healthRoutes } from './features/health/health-routes';
import { sessionRoutes } from './features/session/session-routes';
import { userRoutes } from './features/users/user-routes';
import { projectRoutes } from './features/projects/project-routes';
import type { Logger } from './logger';
import type { FileStore } from './storage/file-store';
import { modelRoutes } from './features/models/model-routes';
import { memberRoutes } from './features/members/member-routes';
import { memberSheetCompanion } from './features/members/member-sheet-read';
import { outboxRoutes } from './features/mail/outbox-routes';
import { sendCriticalRoutes } from './features/mail/send-critical-routes';
import { compareRoutes } from './features/compare/compare-routes';
import type { MailService } from './mail/mail-service';
import { geometryRoutes } from './features/geometry/geometry-routes';
import { memberColumnsRoutes } from './features/member-columns/member-columns-routes';
import { exportRoutes } from './features/exports/export-routes';
import { projectLogRoutes } from './features/project-log/project-log-routes';

export interface AppHandle {
  app: express.Express;
  /** Stops background timers owned by the app (session expiry sweeps). */
  close(): void;
}

/** Builds the Express app: security headers, sessions, the API, then the built client. */
export interface AppServices {
  store: FileStore;
  mail: MailService;
  /** Called when a new import job is queued, so it starts without waiting for the poll. */
  onImportQueued: () => void;
}

export function createApp(config: AppConfig, sequelize: Sequelize, logger: Logger, services: AppServices): AppHandle {
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');

  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          // web-ifc and three need WebAssembly in the browser; nothing wider is allowed.
          'script-src': ["'self'", "'wasm-unsafe-eval'"],
          'img-src': ["'self'", 'data:', 'blob:'],
          'worker-src': ["'self'", 'blob:'],
        },
      },
    }),
  );
  if (config.logRequests) {
    app.use((req, res, next) => {
      const started = Date.now();
      res.on('finish', () => logger.info(`${req.method} ${req.originalUrl} ${res.statusCode} ${Date.now() - started}ms`));
      next();
    });
  }

  // Health is answered before sessions so it works while the database is down.
  app.use('/api/health', healthRoutes(sequelize));

  const api = express.Router();
  // The member sheet's statements ride along with the session read (http/request-read-ahead.ts).
  const sessions = createSessionMiddleware(sequelize, config, [memberSheetCompanion]);
  const pp = configurePassport();
  // Forces tables may be large; every other body is small.
  const smallJson = express.json({ limit: '1mb' });
  api.use((req, res, next) => (req.path.endsWith('/forces') ? next() : smallJson(req, res, next)));
  api.use(sessions.middleware);
  api.use(pp.session());
  api.use(requireCsrf);
  api.use('/session', sessionRoutes(pp, config, sequelize, services.mail));
  api.use('/users', userRoutes(sequelize, config, services.mail));
  api.use('/mail', outboxRoutes(services.mail));
  api.use('/projects/:projectId/revisions/:revisionId/comparison', compareRoutes());
  api.use('/projects/:projectId/revisions/:revisionId/send-critical', sendCriticalRoutes(sequelize, config, services.mail));
  api.use('/projects/:projectId/revisions/:revisionId/exports', exportRoutes(sequelize, services.store));
  api.use('/projects/:projectId/revisions/:revisionId/geometry', geometryRoutes(services.store));
  api.use('/projects/:projectId/revisions/:revisionId/member-columns', memberColumnsRoutes());
  api.use('/projects/:projectId/revisions/:revisionId', memberRoutes(sequelize));
  api.use('/projects/:projectId/audit', projectLogRoutes());
  api.use('/projects/:projectId', modelRoutes(sequelize, config, services.store, services.onImportQueued));
  api.use('/projects', projectRoutes(sequelize));
  api.use(apiNotFound);
  app.use('/api', api);

  const clientDist = path.resolve(config.clientDist);
  if (fs.existsSync(path.join(clientDist, 'index.html'))) {
    app.use(express.static(clientDist, { index: false, maxAge: '1h', setHeaders: noCacheForHtml }));
    // Client-side routes: any other GET serves the app shell.
    app.get('/{*splat}', (_req, res) => {
      res.setHeader('Cache-Control', 'no-cache');
      res.sendFile(path.join(clientDist, 'index.html'));
    });
  } else {
    logger.warn(`No built client at ${clientDist}; only the API is served.`);
  }

  app.use(errorHandler((msg, err) => logger.error(msg, err)));
  return { app, close: sessions.stop };
}

function noCacheForHtml(res: express.Response, filePath: string): void {
  if (filePath.endsWith('.html')) res.setHeader('Cache-Control', 'no-cache');
}
