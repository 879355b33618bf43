import { existsSync } from 'node:fs';
import path from 'node:path';
import express, { type Response, type Router } from 'express';
import { AppError } from '../errors.js';

/** The compressed copies the widget build writes beside each script, best first. */
const ENCODINGS = [
  ['br', '.br'],
  ['gzip', '.gz'],
] as const;

function releaseHeaders(res: Response): void {
  res.setHeader('Access-Control-Allow-Origin', '*');
  res.setHeader('Cross-Origin-Resource-Policy', 'cross-origin');
  res.setHeader('X-Content-Type-Options', 'nosniff');
}

/**
 * `/releases/<version>/<file>`: immutable, cached for a year, readable cross-origin (a script
 * with `integrity` and `crossorigin` is only run when its response allows CORS). A script is sent
 * as the brotli or gzip copy the build made, whichever the browser takes (nothing is compressed
 * per request); the SRI hash covers the uncompressed bytes, which is what the browser checks.
 */
export function releasesRouter(dir: string): Router {
  const router = express.Router();
  const root = path.resolve(dir);
  router.get(/\.js$/, (req, res, next) => {
    const file = path.resolve(root, `.${decodeURIComponent(req.path)}`);
    if (!file.startsWith(root + path.sep) || !existsSync(file)) return next();
    res.vary('Accept-Encoding');
    // Our order (brotli is smaller), among the encodings the browser takes at all.
    const found = ENCODINGS.find(
      ([name, ext]) => req.acceptsEncodings(name) === name && existsSync(file + ext),
    );
    if (!found) return next();
    const [chosen, ext] = found;
    releaseHeaders(res);
    res.setHeader('Content-Encoding', chosen);
    res.setHeader('Content-Type', 'text/javascript; charset=utf-8');
    res.sendFile(file + ext, { immutable: true, maxAge: '365d', dotfiles: 'ignore' });
  });
  router.use(
    express.static(dir, {
      index: false,
      immutable: true,
      maxAge: '365d',
      fallthrough: true,
      dotfiles: 'ignore',
      setHeaders(res, file) {
        releaseHeaders(res);
        if (file.endsWith('.js')) res.setHeader('Vary', 'Accept-Encoding');
      },
    }),
  );
  // A missing file is a 404 here, never the dashboard's HTML shell.
  router.use((req, _res, next) => next(new AppError('not_found', `No release file ${req.path}`)));
  return router;
}
