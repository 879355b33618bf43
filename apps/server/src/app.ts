import { existsSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import express, { type Express } from 'express';
import { pinoHttp } from 'pino-http';
import type { Logger } from 'pino';
import type { Sequelize } from 'sequelize';
import type { Config } from './config.js';
import { errorHandler, notFoundHandler } from './errors.js';
import { createHealthService } from './health/service.js';
import { healthRouter } from './health/router.js';
import { serverVersion } from './version.js';

export interface AppDeps {
  config: Config;
  sequelize: Sequelize;
  logger: Logger;
}

const defaultDashboardDir = fileURLToPath(new URL('../../dashboard/dist', import.meta.url));

/** Build the Express app from its dependencies; listening and shutting down are index.ts's job. */
export function createApp(deps: AppDeps): Express {
  const { config, sequelize, logger } = deps;
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', config.trustProxy);

  app.use(
    pinoHttp({
      logger,
      customLogLevel: (_req, res, err) => (err || res.statusCode >= 500 ? 'error' : res.statusCode >= 400 ? 'warn' : 'info'),
      autoLogging: { ignore: (req) => req.url === '/api/v1/health' },
    }),
  );

  const api = express.Router();
  api.use(express.json({ limit: '64kb' }));
  api.use((_req, res, next) => {
    res.set('Cache-Control', 'no-store');
    next();
  });
  api.use(healthRouter(createHealthService(sequelize, serverVersion)));
  api.use(notFoundHandler);
  app.use('/api/v1', api);
  app.use('/api', notFoundHandler);

  const dashboardDir = config.dashboardDir ?? defaultDashboardDir;
  if (existsSync(path.join(dashboardDir, 'index.html'))) {
    app.use(express.static(dashboardDir, { index: false, maxAge: '1h' }));
    // Client-side routes: every other GET that wants HTML gets the SPA shell.
    app.get(/^\/(?!api\/).*/, (req, res, next) => {
      if (!req.accepts('html')) return next();
      res.set('Cache-Control', 'no-cache').sendFile(path.join(dashboardDir, 'index.html'));
    });
  }

  app.use(notFoundHandler);
  app.use(errorHandler);
  return app;
}
