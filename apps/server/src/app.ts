import { existsSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import type { IncomingMessage, ServerResponse } from 'node:http';
import express, { type Express, type Request, type Response } from 'express';
import cookieParser from 'cookie-parser';
import { pinoHttp } from 'pino-http';
import {
  errorLine,
  nextRequestId,
  quickRequestLog,
  requestLevel,
  requestRecord,
  successLine,
} from './http/request-log.js';
import type { Logger } from 'pino';
import type { Sequelize } from 'sequelize';
import type { Config } from './config.js';
import { errorHandler, notFoundHandler } from './errors.js';
import { createHealthService } from './health/service.js';
import { healthRouter } from './health/router.js';
import { serverVersion } from './version.js';
import { createAuditService } from './audit/service.js';
import { auditRoutes } from './audit/router.js';
import { createAuthService } from './auth/service.js';
import { authRoutes } from './auth/router.js';
import { createDevMailService } from './dev-mail/service.js';
import { devMailRoutes } from './dev-mail/router.js';
import { createCsrf } from './http/csrf.js';
import { createRateLimits } from './http/rate-limit.js';
import { createCounters } from './http/counters.js';
import { createDeviceCookies } from './http/device-cookie.js';
import { createLoginThrottle } from './auth/throttle.js';
import { ApiRoutes, type RouteRecord } from './http/routes.js';
import { createSessions } from './http/session.js';
import { createInvitationService } from './invitations/service.js';
import { invitationRoutes } from './invitations/router.js';
import { createSmtpMailer, type Mailer } from './mail/mailer.js';
import { createOrgService } from './orgs/service.js';
import { orgRoutes } from './orgs/router.js';
import { createAssetService } from './assets/service.js';
import { assetRoutes } from './assets/router.js';
import { createEmbedService } from './embed/service.js';
import { embedRouter } from './embed/router.js';
import { createRunIngest } from './embed/ingest.js';
import { createRefusalCounter } from './embed/refusals.js';
import { createReleaseService } from './releases/service.js';
import { releasesRouter } from './releases/router.js';
import { releaseRoutes } from './releases/api.js';
import { releaseDirsOf } from './releases/paths.js';
import { createWidgetService } from './widgets/service.js';
import { embedAccessRoutes, widgetRoutes } from './widgets/router.js';
import { createRunService } from './runs/service.js';
import { runRoutes } from './runs/router.js';
import { createSheetService } from './sheets/service.js';
import { sheetRoutes } from './sheets/router.js';
import { createUsageService } from './usage/service.js';
import { usageRoutes } from './usage/router.js';
import { createLeadService } from './leads/service.js';
import { leadRoutes } from './leads/router.js';
import { createRetentionService } from './retention/service.js';
import { retentionRoutes } from './retention/router.js';
import { createPaymentsClient } from './billing/provider.js';
import { createBillingService } from './billing/service.js';
import { billingRoutes, billingWebhookRouter } from './billing/router.js';
import { createRunAllowance } from './billing/allowance.js';

export interface AppDeps {
  config: Config;
  sequelize: Sequelize;
  /**
   * Reads that may come from the read replica (`createReadSequelize`): usage summaries and the
   * runs list and export. Defaults to `sequelize`, the primary.
   */
  reads?: Sequelize;
  logger: Logger;
  /** Defaults to nodemailer over the configured SMTP server. */
  mailer?: Mailer;
}

const API_BASE = '/api/v1';
const registries = new WeakMap<Express, readonly RouteRecord[]>();

/**
 * Every route the app declared through `ApiRoutes`, with who may call it: the table the permission
 * matrix and bad-input tests are generated from.
 */
export function routeTable(app: Express): readonly RouteRecord[] {
  const table = registries.get(app);
  if (!table) throw new Error('not an app made by createApp');
  return table;
}

const defaultDashboardDir = fileURLToPath(new URL('../../dashboard/dist', import.meta.url));

/** Build the Express app from its dependencies; listening and shutting down are index.ts's job. */
export function createApp(deps: AppDeps): Express {
  const { config, sequelize, logger } = deps;
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', config.trustProxy);

  // Every request gets `req.log` (errors are logged through it in every mode); what is written per
  // request follows REQUEST_LOG: the whole record, one short line, or nothing (`npm start`'s default).
  const line = config.requestLog === 'line';
  const requestLog = pinoHttp({
    logger,
    genReqId: nextRequestId,
    customLogLevel: (_req, res, err) => requestLevel(res, err),
    autoLogging: config.requestLog === 'off' ? false : { ignore: (req) => req.url === '/api/v1/health' },
    // A request's line says which request it was and how it ended, not every header both ways:
    // a short line is cheap, and browser details stay out of the log.
    ...(line
      ? {
          quietReqLogger: true,
          serializers: { req: () => undefined, res: () => undefined },
          customSuccessMessage: successLine,
          customErrorMessage: errorLine,
        }
      : {
          // Read straight from Node's request: the standard serializers would first copy every
          // header of every request only for these five fields to be picked out of the copy.
          wrapSerializers: false,
          serializers: {
            req: requestRecord,
            res: (res: { statusCode: number }) => ({ statusCode: res.statusCode }),
          },
        }),
  });

  const mailer = deps.mailer ?? createSmtpMailer(config.mail);
  const csrf = createCsrf(config);
  const sessions = createSessions(config, logger);
  // Rate-limit counters in MariaDB: every server process over this database counts as one.
  const counters = createCounters(sequelize);
  const limits = createRateLimits(config, counters);
  const devices = createDeviceCookies(config);
  const audit = createAuditService();
  const auth = createAuthService(
    { config, sequelize, audit, mailer, logger },
    createLoginThrottle(counters, { windowMs: config.rateLimits.windowMs, ...config.rateLimits.signIn }),
  );
  const orgs = createOrgService({ sequelize, audit });
  const invitations = createInvitationService({ config, sequelize, audit, mailer, logger });
  const releaseDirs = releaseDirsOf(config);
  const releases = createReleaseService(releaseDirs.build, config.publicUrl, releaseDirs.published);
  const widgets = createWidgetService({
    sequelize,
    releases,
    publicUrl: config.publicUrl,
    widgetVersion: serverVersion,
  });
  const assets = createAssetService(config.publicUrl);
  const afterRunsStored = createRunAllowance({ sequelize, mailer, logger, publicUrl: config.publicUrl });
  const ingest = createRunIngest(sequelize, {
    maxBatch: config.ingest.maxBatch,
    maxInFlight: config.ingest.batchesInFlight,
    // Each run is recomputed with the engine of the release that made it.
    engineOf: (release) => releases.engine(release),
    // Once per committed batch: runs past the plan's allowance are marked and the owner mailed.
    afterStored: (runs, known) =>
      afterRunsStored(runs, known).catch((err: unknown) =>
        logger.error({ err }, 'run allowance hook failed'),
      ),
  });
  const sheets = createSheetService({ publicUrl: config.publicUrl, releases });
  const embed = createEmbedService({
    sequelize,
    mailer,
    logger,
    publicUrl: config.publicUrl,
    ingest,
    counters,
    copyLimits: config.embed.copies,
    sheets,
    engineOf: (release) => releases.engine(release),
  });
  const billing = createBillingService({
    sequelize,
    client: createPaymentsClient(config.payments),
    webhookSecret: config.payments.webhookSecret,
    audit,
    publicUrl: config.publicUrl,
  });
  const reads = deps.reads ?? sequelize;
  const runs = createRunService({ sequelize, reads, engineOf: (release) => releases.engine(release) });
  const refusals = createRefusalCounter(sequelize);
  const usage = createUsageService({ sequelize: reads });
  const leads = createLeadService({ sequelize, runs });
  // The purge itself runs on a timer that index.ts starts; the app only serves the setting.
  const retention = createRetentionService({ sequelize, chunkSize: config.retention.chunkSize });

  const routes = new ApiRoutes(API_BASE, csrf);
  authRoutes(routes, { auth, sessions, csrf, limits, devices });
  orgRoutes(routes, orgs);
  invitationRoutes(routes, { invitations, auth, sessions, limits });
  auditRoutes(routes, audit);
  widgetRoutes(routes, widgets, audit);
  releaseRoutes(routes, releases, sequelize);
  embedAccessRoutes(routes, widgets, refusals, audit);
  assetRoutes(routes, assets);
  runRoutes(routes, runs);
  sheetRoutes(routes, sheets, config.embed, counters);
  usageRoutes(routes, usage);
  leadRoutes(routes, leads, audit);
  retentionRoutes(routes, retention, audit);
  billingRoutes(routes, billing);
  // Only while the fake SMTP server is in use; with a real relay the route does not exist.
  if (config.mail.fakeApiUrl) devMailRoutes(routes, createDevMailService(config.mail.fakeApiUrl));
  registries.set(app, routes.records);

  // The run-report hot path first, with a request log of its own (the same records): every visitor's
  // calculation comes here, so it skips the layers other requests pass (pino-http's child logger
  // per request, the routers before the embed API's).
  const embedApi = embedRouter(embed, sheets, config.embed, counters, refusals);
  const runsLog = quickRequestLog(logger, config.requestLog);
  app.post(`${API_BASE}/embed/runs`, runsLog, ...embedApi.runs);
  takeRunReportsFirst(app, (req, res) => {
    if (req.method !== 'POST' || req.url !== `${API_BASE}/embed/runs` || !embedApi.takes(req)) return false;
    runsLog(req as Request, res as Response, () => undefined);
    return embedApi.fast(req, res, (err, body) => {
      // A failure is answered as on every route: Express's request and response, the refusal
      // count, the one error shape.
      const [request, response] = asExpress(app, req, res);
      request.body = body;
      embedApi.refusals(err, request, response, (e: unknown) =>
        errorHandler(e, request, response, () => undefined),
      );
    });
  });
  app.use(requestLog);

  // The widget bundle's releases, and the cookie-less API the widgets call from the firms' sites.
  app.use('/releases', releasesRouter(releases.dirs));
  app.use(`${API_BASE}/embed`, embedApi.router);
  // The payments provider's signed events: raw bytes for the signature check, no session, no CSRF.
  app.use(`${API_BASE}/billing/webhook`, billingWebhookRouter(billing));

  const api = express.Router();
  api.use(express.json({ limit: '64kb' }));
  api.use((_req, res, next) => {
    res.set('Cache-Control', 'no-store');
    next();
  });
  api.use(healthRouter(createHealthService(sequelize, serverVersion)));
  api.use(cookieParser());
  api.use(sessions.load);
  api.use(routes.router);
  api.use(notFoundHandler);
  app.use(API_BASE, api);
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

type NodeHandler = (req: IncomingMessage, res: ServerResponse) => boolean;

/**
 * Lets `first` answer a request before Express dispatches it (the run-report hot path: Express's
 * dispatch, prototypes swapped on both objects and the router's matching, costs a bare handler as
 * much again as its own work). `first` returns false for a request it leaves alone; Express then
 * handles it as it would have. Every way in (listen, a test's supertest, a server's 'request'
 * listener) calls `app.handle`, so every one of them takes the same path.
 */
function takeRunReportsFirst(app: Express, first: NodeHandler): void {
  const dispatch = (app as unknown as { handle: Dispatch }).handle;
  (app as unknown as { handle: Dispatch }).handle = function handle(this: Express, req, res, done) {
    if (first(req, res)) return;
    dispatch.call(this, req, res, done);
  };
}
type Dispatch = (req: IncomingMessage, res: ServerResponse, done?: (err?: unknown) => void) => void;

/** A request and response as Express's handlers expect them (what `app.handle` does first). */
function asExpress(app: Express, req: IncomingMessage, res: ServerResponse): [Request, Response] {
  const request = Object.setPrototypeOf(req, app.request) as Request;
  const response = Object.setPrototypeOf(res, app.response) as Response;
  (request as { res?: Response }).res = response;
  (response as { req?: Request }).req = request;
  response.locals ??= Object.create(null) as Response['locals'];
  return [request, response];
}
