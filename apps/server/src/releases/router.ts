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
 * With several folders (published releases first, then the widget build's output), a version is
 * served wholly from the first folder that has it, so a published release is never mixed with a
 * later build of the same version.
 */
export function releasesRouter(dirs: string | readonly string[]): Router {
  const router = express.Router();
  const roots = (typeof dirs === 'string' ? [dirs] : dirs).map((d) => path.resolve(d));
  const statics = new Map(
    roots.map((root) => [
      root,
      express.static(root, {
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
    ]),
  );
  const rootOf = (version: string) =>
    roots.find((r) => existsSync(path.join(r, version, 'manifest.json'))) ?? null;

  router.use((req, res, next) => {
    let version: string;
    try {
      version = decodeURIComponent(req.path).split('/')[1] ?? '';
    } catch {
      return next();
    }
    const root = /^[0-9A-Za-z.-]+$/.test(version) && !version.startsWith('.') ? rootOf(version) : null;
    if (!root) return next();
    if (req.path.endsWith('.js')) {
      const file = path.resolve(root, `.${decodeURIComponent(req.path)}`);
      if (file.startsWith(root + path.sep) && existsSync(file)) {
        res.vary('Accept-Encoding');
        // Our order (brotli is smaller), among the encodings the browser takes at all.
        const found = ENCODINGS.find(
          ([name, ext]) => req.acceptsEncodings(name) === name && existsSync(file + ext),
        );
        if (found) {
          const [chosen, ext] = found;
          releaseHeaders(res);
          res.setHeader('Content-Encoding', chosen);
          res.setHeader('Content-Type', 'text/javascript; charset=utf-8');
          res.sendFile(file + ext, { immutable: true, maxAge: '365d', dotfiles: 'ignore' });
          return;
        }
      }
    }
    (statics.get(root) as express.RequestHandler)(req, res, next);
  });
  // A missing file is a 404 here, never the dashboard's HTML shell.
  router.use((req, _res, next) => next(new AppError('not_found', `No release file ${req.path}`)));
  return router;
}
