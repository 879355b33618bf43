import express, { type Router } from 'express';
import { AppError } from '../errors.js';

/**
 * `/releases/<version>/<file>`: immutable, cached for a year, readable cross-origin (a script
 * with `integrity` and `crossorigin` is only run when its response allows CORS).
 */
export function releasesRouter(dir: string): Router {
  const router = express.Router();
  router.use(
    express.static(dir, {
      index: false,
      immutable: true,
      maxAge: '365d',
      fallthrough: true,
      dotfiles: 'ignore',
      setHeaders(res) {
        res.setHeader('Access-Control-Allow-Origin', '*');
        res.setHeader('Cross-Origin-Resource-Policy', 'cross-origin');
        res.setHeader('X-Content-Type-Options', 'nosniff');
      },
    }),
  );
  // A missing file is a 404 here, never the dashboard's HTML shell.
  router.use((req, _res, next) => next(new AppError('not_found', `No release file ${req.path}`)));
  return router;
}
