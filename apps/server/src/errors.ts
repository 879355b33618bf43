import type { ErrorRequestHandler, RequestHandler } from 'express';
import { ConnectionError } from 'sequelize';
import { ZodError } from 'zod';
import { errorStatus, type ErrorBody, type ErrorCode, type FieldIssue } from '@wickstone/contracts';

/**
 * The one error type services throw; the error handler turns it into the one error shape. When it
 * stands for another error (a driver's, a library's), pass that as `cause`: logs keep the chain.
 */
export class AppError extends Error {
  readonly code: ErrorCode;
  readonly details: unknown;

  constructor(code: ErrorCode, message: string, details: unknown = null, options: { cause?: unknown } = {}) {
    super(message, options);
    this.name = 'AppError';
    this.code = code;
    this.details = details;
  }

  get status(): number {
    return errorStatus[this.code];
  }
}

export const notFound = (what = 'Resource'): AppError => new AppError('not_found', `${what} not found`);

/** Turn zod issues into field issues whose `field` names where the bad value was (`body.email`). */
export function fieldIssues(error: ZodError, where: string): FieldIssue[] {
  return error.issues.flatMap((issue) => {
    // An unrecognised key is reported on the object; name each extra key as its own field.
    if (issue.code === 'unrecognized_keys') {
      return issue.keys.map((key) => ({
        field: [where, ...issue.path.map(String), key].join('.'),
        message: 'Unknown field',
      }));
    }
    const path = [where, ...issue.path.map(String)].join('.');
    return [{ field: path, message: issue.message }];
  });
}

/** What a field error may say besides its fields: another code (a 409 naming the field), its own message, a cause. */
export interface FieldErrorOptions {
  code?: ErrorCode;
  message?: string;
  cause?: unknown;
}

/**
 * A 400 (or `code`) naming each field, in the same shape a schema failure has:
 * `{ fields: [{ field, message }] }`.
 */
export function fieldsError(fields: FieldIssue[], options: FieldErrorOptions = {}): AppError {
  const named = [...new Set(fields.map((f) => f.field))].join(', ');
  return new AppError(
    options.code ?? 'validation_failed',
    options.message ?? `Invalid request: check ${named}`,
    { fields },
    { cause: options.cause },
  );
}

/** A 400 (or `code`) for one field that passed its schema but not a rule only the server can check. */
export const fieldError = (field: string, message: string, options?: FieldErrorOptions): AppError =>
  fieldsError([{ field, message }], options);

export function validationError(error: ZodError, where: string): AppError {
  return fieldsError(fieldIssues(error, where), { cause: error });
}

/**
 * Parse one part of a request with its zod schema; a failure becomes a 400 naming each bad field.
 */
export function parseRequest<T>(
  schema: { safeParse(data: unknown): { success: true; data: T } | { success: false; error: ZodError } },
  data: unknown,
  where: 'body' | 'query' | 'params',
): T {
  const result = schema.safeParse(data);
  if (!result.success) throw validationError(result.error, where);
  return result.data;
}

export const notFoundHandler: RequestHandler = (req, _res, next) => {
  next(new AppError('not_found', `No route for ${req.method} ${req.baseUrl}${req.path}`));
};

function body(code: ErrorCode, message: string, details: unknown): ErrorBody {
  return { error: { code, message, details: details ?? null } };
}

interface HttpishError {
  status?: number;
  statusCode?: number;
  type?: string;
  expose?: boolean;
  message?: string;
}

/** Connector codes that mean the database could not be reached or dropped the connection. */
const UNREACHABLE_CODES = new Set([
  'ECONNREFUSED',
  'ECONNRESET',
  'ETIMEDOUT',
  'EPIPE',
  'ER_GET_CONNECTION_TIMEOUT',
  'ER_CONNECTION_TIMEOUT',
  'ER_SOCKET_UNEXPECTED_CLOSE',
  'ER_CONNECTION_ALREADY_CLOSED',
  // A connection the server closed (killed or restarted) before a command could be sent on it.
  'ER_CMD_CONNECTION_CLOSED',
  'ER_CLOSING_POOL',
  'ER_POOL_ALREADY_CLOSED',
  'ER_SERVER_SHUTDOWN',
  'ER_CONNECTION_KILLED',
]);

/** Seconds a client is asked to wait after an outage answer: about how long a restart takes. */
export const OUTAGE_RETRY_AFTER_S = 5;

/**
 * Whether a failure means the database is unreachable (an outage, answered 503 with Retry-After)
 * rather than a defect (500). Sequelize wraps connector errors; the original is on `parent`/`original`.
 */
export function isDatabaseUnavailable(err: unknown): boolean {
  if (err instanceof ConnectionError) return true;
  for (let e: unknown = err, depth = 0; e && typeof e === 'object' && depth < 4; depth++) {
    const code = (e as { code?: unknown }).code;
    if (typeof code === 'string' && UNREACHABLE_CODES.has(code)) return true;
    e =
      (e as { parent?: unknown; original?: unknown; cause?: unknown }).parent ??
      (e as { original?: unknown }).original ??
      (e as { cause?: unknown }).cause;
  }
  return false;
}

/** The last middleware: every failure leaves as `{ error: { code, message, details } }`, never a stack. */
export const errorHandler: ErrorRequestHandler = (err: unknown, req, res, _next) => {
  if (res.headersSent) {
    res.end();
    return;
  }
  if (err instanceof AppError) {
    if (err.status >= 500) req.log?.error({ err }, err.message);
    if (err.code === 'service_unavailable' && !res.getHeader('Retry-After'))
      res.setHeader('Retry-After', String(OUTAGE_RETRY_AFTER_S));
    // A throttled sign-in says how long to wait, in the header as in the body.
    const wait = (err.details as { retryAfterS?: unknown } | null)?.retryAfterS;
    if (err.code === 'rate_limited' && typeof wait === 'number' && !res.getHeader('Retry-After'))
      res.setHeader('Retry-After', String(wait));
    res.status(err.status).json(body(err.code, err.message, err.details));
    return;
  }
  if (err instanceof ZodError) {
    const e = validationError(err, 'body');
    res.status(400).json(body(e.code, e.message, e.details));
    return;
  }
  const h = (typeof err === 'object' && err !== null ? err : {}) as HttpishError;
  const status = h.status ?? h.statusCode;
  // body-parser and other http-errors style failures carry their own client status.
  if (h.type === 'entity.too.large' || status === 413) {
    res.status(413).json(body('payload_too_large', 'Request body is too large', null));
    return;
  }
  if (h.type === 'entity.parse.failed') {
    const e = fieldError('body', 'Malformed JSON', {
      code: 'bad_request',
      message: 'Request body is not valid JSON',
      cause: err,
    });
    res.status(e.status).json(body(e.code, e.message, e.details));
    return;
  }
  if (h.type === 'encoding.unsupported' || h.type === 'charset.unsupported' || status === 415) {
    res.status(415).json(body('unsupported_media_type', 'Unsupported content encoding or charset', null));
    return;
  }
  if (typeof status === 'number' && status >= 400 && status < 500) {
    res.status(status).json(body('bad_request', h.expose && h.message ? h.message : 'Bad request', null));
    return;
  }
  if (isDatabaseUnavailable(err)) {
    req.log?.warn({ err }, 'database unavailable');
    res.setHeader('Retry-After', String(OUTAGE_RETRY_AFTER_S));
    res.status(503).json(
      body('service_unavailable', 'Temporarily unavailable: try again in a few seconds', {
        retryAfterS: OUTAGE_RETRY_AFTER_S,
      }),
    );
    return;
  }
  req.log?.error({ err }, 'unhandled error');
  res.status(500).json(body('internal', 'Something went wrong on our side', null));
};
