import type { IncomingMessage, ServerResponse } from 'node:http';
import type { NextFunction, Request, Response } from 'express';
import type { Logger } from 'pino';
import type { Config } from '../config.js';

/*
 * The request log's record of a request, by REQUEST_LOG: `json` the request (id, method, url,
 * origin, address) and its status, `line` one short line, `off` nothing. pino-http writes it for
 * every route but the run-report hot path; `quickRequestLog` writes the same records there without
 * a child logger per request (a child is made only when something logs through `req.log`, an error).
 */

type Mode = Config['requestLog'];

/** What a request's record says of it: which request it was, no header beyond its origin. */
export const requestRecord = (req: IncomingMessage & { id: unknown }) => ({
  id: req.id,
  method: req.method,
  url: req.url,
  origin: req.headers.origin,
  remoteAddress: req.socket.remoteAddress,
});

/** The level of a request's record: error for a 5xx or a failure, warn for a 4xx. */
export const requestLevel = (res: { statusCode: number }, err?: unknown): 'error' | 'warn' | 'info' =>
  err || res.statusCode >= 500 ? 'error' : res.statusCode >= 400 ? 'warn' : 'info';

/** The `line` mode's messages. */
export const successLine = (req: IncomingMessage, res: ServerResponse, ms: number) =>
  `${req.method} ${req.url} ${res.statusCode} ${ms} ms`;
export const errorLine = (req: IncomingMessage, res: ServerResponse) =>
  `${req.method} ${req.url} ${res.statusCode}`;

let lastId = 0;
/** Request ids, one sequence per process for every route (pino-http's and `quickRequestLog`'s). */
export const nextRequestId = (): number => (lastId = (lastId % 2147483646) + 1);

/**
 * The request log for one route, with the records pino-http writes for the others (same fields,
 * levels and messages), at the cost of one log call per request. Its records go through a child
 * logger without the app's redaction: they carry no header but the origin (see `requestRecord`), so
 * there is nothing to redact, and redacting copies the record's `req` on every request. Errors
 * logged through `req.log` still go through the app's own logger, redaction and all.
 */
export function quickRequestLog(logger: Logger, mode: Mode) {
  const line = mode === 'line';
  const records = logger.child({}, { redact: [] });
  return function requestLog(req: Request, res: Response, next: NextFunction): void {
    const id = nextRequestId();
    const started = Date.now();
    (req as { id: unknown }).id = id;
    let child: Logger | undefined;
    // Made only when used: errors are logged through it in every mode.
    Object.defineProperty(req, 'log', {
      configurable: true,
      enumerable: false,
      get: () => (child ??= line ? logger.child({ reqId: id }) : logger.child({ req: requestRecord(req) })),
    });
    if (mode !== 'off') {
      // A response always ends with 'close' (after 'finish', or when the connection is lost first):
      // one listener, where pino-http listens for both.
      res.once('close', () => {
        const ms = Date.now() - started;
        const level = requestLevel(res);
        const failed = res.statusCode >= 500;
        const err = failed ? new Error(`failed with status code ${res.statusCode}`) : undefined;
        if (line) {
          records[level](
            { reqId: id, responseTime: ms, ...(err ? { err } : {}) },
            failed ? errorLine(req, res) : successLine(req, res, ms),
          );
        } else {
          records[level](
            {
              req: requestRecord(req),
              res: { statusCode: res.statusCode },
              ...(err ? { err } : {}),
              responseTime: ms,
            },
            failed ? 'request errored' : 'request completed',
          );
        }
      });
    }
    next();
  };
}
