import type { IncomingHttpHeaders, IncomingMessage, ServerResponse } from 'node:http';
import compression from 'compression';
import express, {
  type ErrorRequestHandler,
  type NextFunction,
  type Request,
  type RequestHandler,
  type Response,
  type Router,
} from 'express';
import { z } from 'zod';
import {
  embedLeadBodySchema,
  embedRunBodySchema,
  embedSheetBodySchema,
  embedSheetParamsSchema,
  embedSheetQuerySchema,
  publicKeySchema,
} from '@wickstone/contracts';
import { AppError, isDatabaseUnavailable, parseRequest } from '../errors.js';
import type { Counters } from '../http/counters.js';
import { byIp, sharedRateLimit } from '../http/rate-limit.js';
import type { EmbedService } from './service.js';
import type { RefusalCounter } from './refusals.js';
import type { SheetService } from '../sheets/service.js';
import { sendSheet } from '../sheets/send.js';

export interface EmbedLimits {
  windowMs: number;
  /** Accepted requests from one client address to one widget... */
  leadsPerIp: number;
  /** ...and to every widget together: a higher ceiling. */
  leadsPerIpAllWidgets: number;
  /** Accepted requests to one widget from everyone. */
  leadsPerWidget: number;
  sheetsPerIp: number;
}

const keyParams = z.strictObject({ publicKey: publicKeySchema });

/**
 * The run report's schema compiled by zod (`z.compile`): a generated parser for the hot path, about
 * three times faster on a report than the schema's runtime parse. A report it does not accept is
 * parsed again by the runtime, so a bad report gets the same 400 naming the same field. Zod hands
 * back the schema itself when it cannot compile one (a later change to the contract): slower, never
 * different (a test asserts it compiled).
 */
export const runBodySchema = z.compile(embedRunBodySchema);
const assetParams = z.strictObject({
  assetId: z.coerce.number().int().positive(),
  hash: z.string().regex(/^[0-9a-f]{16}$/),
});

/**
 * The widget sends JSON as text/plain so its requests are CORS-simple (no preflight); JSON
 * proper is accepted too. A body that is not JSON is named as the bad field.
 */
function jsonBody(req: Request, _res: Response, next: NextFunction): void {
  if (typeof req.body !== 'string') {
    if (
      req.body === undefined ||
      (typeof req.body === 'object' && req.body !== null && Object.keys(req.body).length === 0)
    ) {
      req.body = undefined;
    }
    return next();
  }
  try {
    req.body = parseJson(req.body);
  } catch (err) {
    return next(err);
  }
  next();
}

/** The run-report route's body limit (32 KB, as `express.text`'s '32kb' counts it). */
const RUN_BODY_LIMIT = 32 * 1024;
/**
 * Content types a widget or a client sends, read as UTF-8 text without body-parser's generic
 * machinery (its media-type and charset parsing, a decoder stream): body-parser reads the same
 * types to the same text, and reads every other request, so nothing changes but the work done.
 */
const PLAIN_UTF8 = new Set(
  ['text/plain', 'application/json'].flatMap((t) => [t, `${t};charset=utf-8`, `${t}; charset=utf-8`]),
);

/**
 * The run report's body as text (then JSON, by `jsonBody`): read straight from the request when
 * it is a plain UTF-8 body of a known length within the limit (every widget's report), by
 * `express.text` otherwise, so that an unusual request (compressed, chunked, another charset, too
 * large) gets body-parser's own answer.
 */
function reportBody(textBody: RequestHandler) {
  return function readReport(req: Request, res: Response, next: NextFunction): void {
    const length = plainLength(req.headers);
    if (length === null) {
      void textBody(req, res, (err?: unknown) => (err ? next(err) : jsonBody(req, res, next)));
      return;
    }
    readPlain(req, length, (err, text) => {
      if (err) return next(err);
      req.body = text;
      jsonBody(req, res, next);
    });
  };
}

/** The length of a plain UTF-8 body within the limit (what `readPlain` reads), or null for any other. */
function plainLength(headers: IncomingHttpHeaders): number | null {
  const type = headers['content-type'];
  const length = Number(headers['content-length']);
  return headers['content-encoding'] !== undefined ||
    headers['transfer-encoding'] !== undefined ||
    type === undefined ||
    !PLAIN_UTF8.has(type.toLowerCase()) ||
    !Number.isInteger(length) ||
    length < 0 ||
    length > RUN_BODY_LIMIT
    ? null
    : length;
}

/** A plain UTF-8 body of a known length as text, with body-parser's answers to a short or aborted one. */
function readPlain(
  req: IncomingMessage,
  length: number,
  done: (err: Error | null, text?: string) => void,
): void {
  const chunks: Buffer[] = [];
  let received = 0;
  const onData = (chunk: Buffer) => {
    chunks.push(chunk);
    received += chunk.length;
  };
  const onEnd = () => {
    req.removeListener('error', onError);
    if (received !== length) {
      // What body-parser answers (a 400) for a body shorter or longer than its Content-Length.
      done(httpError(400, 'request size did not match content length', 'request.size.invalid'));
      return;
    }
    const text = (chunks.length === 1 ? chunks[0]! : Buffer.concat(chunks, received)).toString('utf8');
    // body-parser's decoder drops a byte order mark.
    done(null, text.charCodeAt(0) === 0xfeff ? text.slice(1) : text);
  };
  const onError = () => {
    req.removeListener('data', onData);
    req.removeListener('end', onEnd);
    done(httpError(400, 'request aborted', 'request.aborted'));
  };
  req.on('data', onData);
  req.once('end', onEnd);
  req.once('error', onError);
}

/** A body's text as JSON; not JSON is named as the bad field (as `jsonBody` does). */
function parseJson(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch {
    throw new AppError('bad_request', 'Request body is not valid JSON', {
      fields: [{ field: 'body', message: 'Malformed JSON' }],
    });
  }
}

/** An http-errors style failure, as body-parser makes them (the app's error handler reads `status`). */
function httpError(status: number, message: string, type: string): Error {
  return Object.assign(new Error(message), { status, statusCode: status, expose: true, type });
}

/** Let the page read the answer, and the `Retry-After` of an outage (not a CORS-safelisted header). */
function allowOrigin(res: ServerResponse, origin: string): void {
  res.setHeader('Access-Control-Allow-Origin', origin);
  res.setHeader('Access-Control-Expose-Headers', 'Retry-After');
}

/** The embed API's routers: `router` for `/api/v1/embed`, and `runs`, the run-report route's handlers. */
export interface EmbedRoutes {
  router: Router;
  /**
   * `POST /api/v1/embed/runs`, the platform's hot path, as handlers the app mounts on that exact
   * path ahead of its other middleware: the same CORS answer, body parsing, validation and refusal
   * counting as the rest of the embed API, without the layers every other request passes.
   */
  runs: (RequestHandler | ErrorRequestHandler)[];
  /**
   * The same route answered on Node's own request and response, before Express dispatches at all
   * (measured: Express's dispatch costs a bare handler about as much as its own work). Takes a
   * plain UTF-8 report of a known length, what every widget sends, and returns true; returns false,
   * having touched nothing, for any other request, which then goes the Express way (`runs`). A
   * failure goes to `failed` with the request's body as far as it was read, for the app's error
   * handlers (`refusals`, then the one error shape).
   */
  fast(req: IncomingMessage, res: ServerResponse, failed: (err: unknown, body: unknown) => void): boolean;
  /** Whether `fast` takes this request (a plain UTF-8 body of a known length within the limit). */
  takes(req: IncomingMessage): boolean;
  /** Counts a refused origin for the widget a failed request named, then passes the error on. */
  refusals: ErrorRequestHandler;
}

/**
 * `/api/v1/embed`: what widgets on the firms' sites call. No cookies and no CSRF token: a browser
 * may read an answer only when the page's origin is one a live widget allows (CORS), and each
 * call checks the origin against its own widget.
 */
export function embedRouter(
  service: EmbedService,
  sheets: SheetService,
  limits: EmbedLimits,
  counters: Counters,
  refusals?: RefusalCounter,
): EmbedRoutes {
  const router = express.Router();
  const known = new Map<string, { ok: boolean; until: number }>();

  /** Whether a live widget allows this origin: from the last 5 s's answer when there is one. */
  function originAllowed(origin: string): boolean | Promise<boolean> {
    const now = Date.now();
    const hit = known.get(origin);
    if (hit && hit.until > now) return hit.ok;
    return service.originKnown(origin).then((ok) => {
      if (known.size > 10_000) known.clear();
      known.set(origin, { ok, until: now + 5_000 });
      return ok;
    });
  }

  function preflight(req: Request, res: Response, next: NextFunction): void {
    if (req.method !== 'OPTIONS') return next();
    if (res.get('Access-Control-Allow-Origin')) {
      res.set('Access-Control-Allow-Methods', 'GET, POST');
      res.set('Access-Control-Allow-Headers', 'Content-Type');
      res.set('Access-Control-Max-Age', '600');
    }
    res.status(204).end();
  }

  /**
   * The CORS answer of every embed route. Synchronous while the origin's answer is cached (every
   * run report but the first few from a site): the hot path awaits nothing here.
   */
  function cors(req: Request, res: Response, next: NextFunction): void | Promise<void> {
    res.set('Cache-Control', 'no-store');
    res.vary('Origin');
    const origin = req.get('origin');
    const answered = origin ? answerOrigin(res, origin) : undefined;
    if (answered === undefined) return preflight(req, res, next);
    return answered.then(() => preflight(req, res, next));
  }

  /**
   * Lets the page read the answer when a live widget allows its origin: synchronous while the
   * origin's answer is cached. While the database is down the origin cannot be checked; the 503
   * carries no data, so the widget may read it and its Retry-After (the failure is passed on).
   */
  function answerOrigin(res: ServerResponse, origin: string): void | Promise<void> {
    const allowed = originAllowed(origin.toLowerCase());
    if (typeof allowed === 'boolean') {
      if (allowed) allowOrigin(res, origin);
      return;
    }
    return allowed.then(
      (ok) => {
        if (ok) allowOrigin(res, origin);
      },
      (e: unknown) => {
        if (isDatabaseUnavailable(e)) allowOrigin(res, origin);
        throw e;
      },
    );
  }
  const textBody = express.text({ type: ['text/plain', 'application/json'], limit: '32kb' });

  // A request refused because its page's origin is not allowed is counted for the widget it named,
  // so the developer sees a site missing from the list. Counting never changes the answer.
  async function countRefusal(err: unknown, req: Request, _res: Response, next: NextFunction): Promise<void> {
    const origin = req.get('origin');
    if (refusals && origin && err instanceof AppError && err.code === 'forbidden' && refusedFor(err)) {
      const key = keyOf(req);
      if (key) await refusals.count(key, origin).catch(() => undefined);
    }
    next(err);
  }

  /** Records a report and writes its acknowledgement: no `res.json` ETag or charset work. */
  async function acknowledge(json: unknown, origin: string | undefined, res: ServerResponse): Promise<void> {
    const body = parseRequest(runBodySchema, json, 'body');
    const result = await service.recordRun(body, origin);
    const text = JSON.stringify(result);
    res.statusCode = result.duplicate ? 200 : 201;
    res.setHeader('Content-Type', 'application/json; charset=utf-8');
    res.setHeader('Content-Length', Buffer.byteLength(text));
    res.end(text);
  }

  const runs: EmbedRoutes['runs'] = [
    cors,
    reportBody(textBody),
    (req: Request, res: Response) => acknowledge(req.body, req.get('origin'), res),
    countRefusal,
  ];

  function fast(
    req: IncomingMessage,
    res: ServerResponse,
    failed: (err: unknown, body: unknown) => void,
  ): boolean {
    const length = plainLength(req.headers);
    if (length === null) return false;
    // What `cors` answers, with Node's own calls; the origin's check runs while the body arrives.
    res.setHeader('Cache-Control', 'no-store');
    res.setHeader('Vary', 'Origin');
    const origin = req.headers.origin;
    const answered = origin ? answerOrigin(res, origin) : undefined;
    // A check that fails is answered once the body is read, as in `cors`.
    answered?.catch(() => undefined);
    readPlain(req, length, (err, text) => {
      let json: unknown;
      void (async () => {
        await answered;
        if (err) throw err;
        json = parseJson(text!);
        await acknowledge(json, origin, res);
      })().catch((e: unknown) => failed(e, json));
    });
    return true;
  }

  router.use(cors);
  router.use(textBody, jsonBody);

  // Only accepted requests count (a 4xx or 5xx answer gives its hit back): a visitor's mistakes, or
  // another firm's widget, never use up what one widget allows. Counters are shared by all processes.
  const leadLimit = (name: string, limit: number, key: (req: Request) => string) =>
    sharedRateLimit(counters, name, {
      limit,
      windowMs: limits.windowMs,
      keyGenerator: key,
      skipFailedRequests: true,
      message: 'Too many requests from here: wait a while and try again',
    });
  const leadKey = (req: Request) =>
    String((req.res?.locals.leadBody as { publicKey?: string } | undefined)?.publicKey ?? '');
  const leadsPerIpPerWidget = leadLimit(
    'leads-per-ip-widget',
    limits.leadsPerIp,
    (req) => `${leadKey(req)}|${byIp(req)}`,
  );
  const leadsPerIp = leadLimit('leads-per-ip', limits.leadsPerIpAllWidgets, byIp);
  const leadsPerWidget = leadLimit('leads-per-widget', limits.leadsPerWidget, leadKey);

  // The settings a widget asks for on every page view: compressed, and kept by the browser with a
  // validator (ETag, made by res.json) so an unchanged widget costs a 304 with no body.
  router.get('/widgets/:publicKey', compression({ threshold: 0 }), async (req, res) => {
    // Any page may read this route's answer: a refused origin then learns at once that there is no
    // widget for it (403, no data) instead of waiting out retries on what looks like a network error.
    const origin = req.get('origin');
    if (origin) res.set('Access-Control-Allow-Origin', origin);
    const { publicKey } = parseRequest(keyParams, req.params, 'params');
    const widget = await service.widgetFor(publicKey, req.get('origin'));
    res.set('Cache-Control', 'private, no-cache');
    res.json(widget);
  });

  router.post(
    '/leads',
    (req, res, next) => {
      // Validated first: the limits are per widget, named in the body.
      res.locals.leadBody = parseRequest(embedLeadBodySchema, req.body, 'body');
      next();
    },
    leadsPerIpPerWidget,
    leadsPerIp,
    leadsPerWidget,
    async (_req, res) => {
      res.status(201).json(await service.recordLead(res.locals.leadBody, res.req.get('origin')));
    },
  );

  // The run id is the capability: made in the visitor's browser, unguessable, never listed.
  const sheetsPerIp = sharedRateLimit(counters, 'sheets-per-ip', {
    limit: limits.sheetsPerIp,
    windowMs: limits.windowMs,
    keyGenerator: byIp,
    message: 'Too many requests from here: wait a while and try again',
  });
  router.get('/runs/:runId/sheet', sheetsPerIp, async (req, res) => {
    const { runId } = parseRequest(embedSheetParamsSchema, req.params, 'params');
    const { publicKey, ...project } = parseRequest(embedSheetQuerySchema, req.query, 'query');
    const origin = req.get('origin');
    sendSheet(
      res,
      await service.withKey(publicKey, (key) =>
        sheets.forVisitor({ runId, publicKey: key, origin, project }),
      ),
    );
  });
  // The widget's "Download calculation sheet": the project block typed there is kept with the run.
  router.post('/runs/:runId/sheet', sheetsPerIp, async (req, res) => {
    const { runId } = parseRequest(embedSheetParamsSchema, req.params, 'params');
    const { publicKey, ...project } = parseRequest(embedSheetBodySchema, req.body, 'body');
    const origin = req.get('origin');
    sendSheet(
      res,
      await service.withKey(publicKey, (key) =>
        sheets.forVisitor({ runId, publicKey: key, origin, project, store: true }),
      ),
    );
  });

  router.get('/assets/:assetId/:hash', async (req, res) => {
    const { assetId, hash } = parseRequest(assetParams, req.params, 'params');
    const asset = await service.asset(assetId);
    if (!asset || !asset.sha256.startsWith(hash)) throw new AppError('not_found', 'Image not found');
    res.set({
      'Content-Type': asset.contentType,
      'Cache-Control': 'public, max-age=31536000, immutable',
      'Content-Security-Policy': "default-src 'none'",
      'X-Content-Type-Options': 'nosniff',
      'Cross-Origin-Resource-Policy': 'cross-origin',
    });
    res.send(asset.data);
  });

  router.use(countRefusal);

  return { router, runs, fast, takes: (req) => plainLength(req.headers) !== null, refusals: countRefusal };
}

/** A refusal of the page's origin (other 403s, a lead form turned off, are not counted). */
const refusedFor = (err: AppError) =>
  typeof err.details === 'object' && err.details !== null && 'origin' in err.details;

/** The widget key a request names: in its path, body or query. */
function keyOf(req: Request): string | null {
  const fromPath = /^\/widgets\/([^/]+)$/.exec(req.path)?.[1];
  const candidates = [
    fromPath,
    (req.body as { publicKey?: unknown } | undefined)?.publicKey,
    req.query.publicKey,
  ];
  const key = candidates.find((k): k is string => typeof k === 'string');
  return key && publicKeySchema.safeParse(key).success ? key : null;
}
