import pino, { type DestinationStream, type Logger } from 'pino';
import type { Config } from './config.js';

/** `destination` is for tests that read what would be logged; the app logs to stdout. */
export function createLogger(config: Pick<Config, 'logLevel'>, destination?: DestinationStream): Logger {
  return pino(
    {
      level: config.logLevel,
      // Session and CSRF tokens travel in these headers, both ways: they never reach the log.
      redact: {
        paths: [
          'req.headers.cookie',
          'req.headers.authorization',
          'req.headers["x-csrf-token"]',
          'res.headers["set-cookie"]',
        ],
        remove: true,
      },
    },
    destination,
  );
}
