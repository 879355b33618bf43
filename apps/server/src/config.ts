import { randomBytes } from 'node:crypto';
import { z } from 'zod';

const bool = z
  .enum(['true', 'false', '1', '0', 'yes', 'no'])
  .transform((v) => v === 'true' || v === '1' || v === 'yes');

/** Measured with bench/bcrypt.ts on the project's machine: cost 12 takes 0.26 s per bcryptjs hash. */
export const DEFAULT_BCRYPT_COST = 12;
/** Only for NODE_ENV=test: tests sign tokens of their own with it. */
const TEST_JWT_SECRET = 'test-only-secret-never-used-outside-tests-0123';

const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
  HOST: z.string().default('127.0.0.1'),
  PORT: z.coerce.number().int().min(0).max(65535).default(5180),
  PUBLIC_URL: z.url().optional(),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  /** Per-request logs: the full record (`json`), one short line (`line`), or none (`off`; errors still logged). */
  REQUEST_LOG: z.enum(['json', 'line', 'off']).default('json'),
  DB_HOST: z.string().default('127.0.0.1'),
  DB_PORT: z.coerce.number().int().min(1).max(65535).default(3307),
  DB_NAME: z
    .string()
    .regex(/^[A-Za-z0-9_]+$/)
    .default('wickstone'),
  DB_USER: z.string().default('wickstone'),
  DB_PASSWORD: z.string().default('wickstone-local'),
  DB_POOL_MAX: z.coerce.number().int().min(1).max(200).default(10),
  /**
   * A read replica of the database (binlog replication). When set, usage summaries and the runs
   * list and export read from it; everything else, and every write, uses the primary above. The
   * port, user and password default to the primary's.
   */
  DB_READ_HOST: z.string().min(1).optional(),
  DB_READ_PORT: z.coerce.number().int().min(1).max(65535).optional(),
  DB_READ_USER: z.string().min(1).optional(),
  DB_READ_PASSWORD: z.string().optional(),
  /**
   * Run reports stored per transaction at most (group commit), and such transactions at once per
   * process. One at a time makes the batches as large as the load (reports that arrive while one is
   * stored all join the next), and the database's work per report smallest (`bench/ingest.ts`: 24
   * reports per transaction against 9–10 with 4 in flight, about half the database's CPU per report).
   */
  INGEST_MAX_BATCH: z.coerce.number().int().min(1).max(5_000).default(500),
  INGEST_BATCHES_IN_FLIGHT: z.coerce.number().int().min(1).max(32).default(1),
  /**
   * Signs sessions, CSRF tokens and device cookies. `npm start` makes one per checkout
   * (var/session-secret); production must set its own; without one, development gets a random
   * secret per process (sessions end when it restarts).
   */
  JWT_SECRET: z.string().min(32).optional(),
  /** bcrypt work factor; the default takes about 0.25 s per hash on the project's 2-core machine (bench/bcrypt.ts). */
  BCRYPT_COST: z.coerce.number().int().min(4).max(15).default(DEFAULT_BCRYPT_COST),
  /** A session cookie lives this long and is renewed while it is used... */
  SESSION_TTL_MINUTES: z.coerce
    .number()
    .int()
    .min(1)
    .max(24 * 60)
    .default(30),
  /** ...but never past this long after the sign-in. */
  SESSION_MAX_HOURS: z.coerce
    .number()
    .int()
    .min(1)
    .max(24 * 30)
    .default(12),
  /** Failed invitation acceptances per invitation in one window (reset mails per address: half of it). */
  LOGIN_LIMIT_PER_ACCOUNT: z.coerce.number().int().min(1).max(10_000).default(10),
  /** The generous per-client ceiling: failed password checks from one client address in one window. */
  LOGIN_LIMIT_PER_IP: z.coerce.number().int().min(1).max(100_000).default(100),
  /** Sign-in throttle (auth/throttle.ts): failures per account and client before delays start... */
  LOGIN_FREE_FAILURES: z.coerce.number().int().min(1).max(1_000).default(5),
  /** ...failures per account from all untrusted clients together before those are delayed too... */
  LOGIN_ACCOUNT_FREE_FAILURES: z.coerce.number().int().min(1).max(10_000).default(20),
  /** ...the longest delay (they double from 1 s)... */
  LOGIN_MAX_DELAY_SECONDS: z.coerce.number().int().min(1).max(3_600).default(900),
  /** ...and the failures of one account in one window that send its holder a warning mail. */
  LOGIN_BURST_NOTIFY: z.coerce.number().int().min(1).max(10_000).default(10),
  /** Result copies mailed to one recipient address per day, and from one widget per hour. */
  COPY_LIMIT_PER_RECIPIENT: z.coerce.number().int().min(1).max(1_000).default(3),
  COPY_LIMIT_PER_WIDGET: z.coerce.number().int().min(1).max(100_000).default(60),
  RATE_LIMIT_WINDOW_MINUTES: z.coerce
    .number()
    .int()
    .min(1)
    .max(24 * 60)
    .default(15),
  SMTP_HOST: z.string().default('127.0.0.1'),
  SMTP_PORT: z.coerce.number().int().min(1).max(65535).default(2525),
  /** Implicit TLS (port 465 style); otherwise STARTTLS is used when the server offers it. */
  SMTP_SECURE: bool.default(false),
  SMTP_USER: z.string().optional(),
  SMTP_PASSWORD: z.string().optional(),
  MAIL_FROM: z.string().default('Wickstone <no-reply@wickstone.example>'),
  /** Set when the local fake SMTP server is in use: its HTTP listing of kept messages. */
  FAKE_MAIL_API_URL: z.url().optional(),
  DASHBOARD_DIR: z.string().optional(),
  /** Where the widget build writes its releases (one folder per version). */
  RELEASES_DIR: z.string().optional(),
  /** Where published releases are kept (`releases/` in the repository by default; see README). */
  PUBLISHED_RELEASES_DIR: z.string().optional(),
  /** The demo consultancy's site (npm start): its port, and where the seed writes its snippets. */
  DEMO_SITE_PORT: z.coerce.number().int().min(1).max(65535).default(5181),
  DEMO_SITE_FILE: z.string().optional(),
  /** Accepted lead requests from one client address to one widget, and to all widgets (the higher ceiling). */
  LEAD_LIMIT_PER_IP: z.coerce.number().int().min(1).max(100_000).default(10),
  LEAD_LIMIT_PER_IP_ALL_WIDGETS: z.coerce.number().int().min(1).max(100_000).default(40),
  /** Calculation sheets (PDFs) and verifications one address may ask for per rate-limit window. */
  SHEET_LIMIT_PER_IP: z.coerce.number().int().min(1).max(100_000).default(30),
  LEAD_LIMIT_PER_WIDGET: z.coerce.number().int().min(1).max(1_000_000).default(200),
  /** How often the retention purge runs, and how long after start the first one does. */
  RETENTION_PURGE_INTERVAL_HOURS: z.coerce
    .number()
    .min(1)
    .max(24 * 7)
    .default(24),
  RETENTION_FIRST_PURGE_MINUTES: z.coerce
    .number()
    .min(0)
    .max(24 * 60)
    .default(5),
  /** Runs or leads deleted per purge transaction: short transactions, short row locks. */
  RETENTION_PURGE_CHUNK: z.coerce.number().int().min(10).max(50_000).default(2000),
  /**
   * Which proxies' X-Forwarded-For to believe for the client address (the sign-in throttle and
   * every rate limit key on it): `false` (none: the direct peer), a number of hops in front of the
   * app (`1` for one load balancer), or a comma list of proxy addresses/subnets
   * (`loopback, 10.0.0.0/8`). `true` believes any X-Forwarded-For: only behind a proxy that
   * overwrites the header. README, "Deployment notes".
   */
  TRUST_PROXY: z.string().trim().default('false').transform(parseTrustProxy),
  /** The payments provider's API; unset means the provider's own host. Locally, the fake (scripts/fake-payments.mjs). */
  PAYMENTS_API_URL: z.url().optional(),
  /** Without a secret key the billing routes answer 503 and every firm is held to its stored plan. */
  PAYMENTS_SECRET_KEY: z.string().min(8).optional(),
  /** The signing secret of our webhook endpoint at the provider. */
  PAYMENTS_WEBHOOK_SECRET: z.string().min(8).optional(),
});

/**
 * The environment checked and shaped into the config the app takes. The `Config` type is inferred
 * from it, so the type and what `loadConfig` returns cannot drift apart.
 */
const configSchema = envSchema
  .superRefine((e, ctx) => {
    if (!e.DB_READ_HOST && (e.DB_READ_PORT || e.DB_READ_USER || e.DB_READ_PASSWORD !== undefined))
      ctx.addIssue({
        code: 'custom',
        path: ['DB_READ_HOST'],
        message: 'the read replica’s port, user or password is set but not its host',
      });
    if (e.NODE_ENV !== 'production') return;
    if (!e.JWT_SECRET || e.JWT_SECRET === TEST_JWT_SECRET)
      ctx.addIssue({
        code: 'custom',
        path: ['JWT_SECRET'],
        message: 'set a secret of your own in production',
      });
    if (e.FAKE_MAIL_API_URL)
      ctx.addIssue({
        code: 'custom',
        path: ['FAKE_MAIL_API_URL'],
        message: 'the fake mailbox is for local runs, not production',
      });
  })
  .transform((e) => {
    const publicUrl = e.PUBLIC_URL ?? `http://${e.HOST}:${e.PORT}`;
    return {
      env: e.NODE_ENV,
      host: e.HOST,
      port: e.PORT,
      publicUrl,
      logLevel: e.LOG_LEVEL,
      requestLog: e.REQUEST_LOG,
      db: {
        host: e.DB_HOST,
        port: e.DB_PORT,
        name: e.DB_NAME,
        user: e.DB_USER,
        password: e.DB_PASSWORD,
        poolMax: e.DB_POOL_MAX,
        read: e.DB_READ_HOST
          ? {
              host: e.DB_READ_HOST,
              port: e.DB_READ_PORT ?? e.DB_PORT,
              user: e.DB_READ_USER ?? e.DB_USER,
              password: e.DB_READ_PASSWORD ?? e.DB_PASSWORD,
            }
          : null,
      },
      ingest: { maxBatch: e.INGEST_MAX_BATCH, batchesInFlight: e.INGEST_BATCHES_IN_FLIGHT },
      // Development without a secret gets a random one per process (npm start makes one per checkout).
      jwtSecret:
        e.JWT_SECRET ?? (e.NODE_ENV === 'test' ? TEST_JWT_SECRET : randomBytes(32).toString('base64url')),
      auth: {
        bcryptCost: e.BCRYPT_COST,
        sessionTtlS: e.SESSION_TTL_MINUTES * 60,
        sessionMaxS: e.SESSION_MAX_HOURS * 3600,
        /** Secure cookies everywhere except a loopback http address (local development and tests). */
        secureCookies: !isLoopbackHttp(publicUrl),
      },
      rateLimits: {
        loginPerAccount: e.LOGIN_LIMIT_PER_ACCOUNT,
        loginPerIp: e.LOGIN_LIMIT_PER_IP,
        windowMs: e.RATE_LIMIT_WINDOW_MINUTES * 60_000,
        signIn: {
          pairFree: e.LOGIN_FREE_FAILURES,
          accountFree: e.LOGIN_ACCOUNT_FREE_FAILURES,
          perClient: e.LOGIN_LIMIT_PER_IP,
          maxDelayS: e.LOGIN_MAX_DELAY_SECONDS,
          burstNotify: e.LOGIN_BURST_NOTIFY,
        },
      },
      mail: {
        smtpHost: e.SMTP_HOST,
        smtpPort: e.SMTP_PORT,
        smtpSecure: e.SMTP_SECURE,
        smtpUser: e.SMTP_USER,
        smtpPassword: e.SMTP_PASSWORD,
        from: e.MAIL_FROM,
        fakeApiUrl: e.FAKE_MAIL_API_URL,
      },
      dashboardDir: e.DASHBOARD_DIR,
      releasesDir: e.RELEASES_DIR,
      publishedReleasesDir: e.PUBLISHED_RELEASES_DIR,
      demo: { sitePort: e.DEMO_SITE_PORT, snippetsFile: e.DEMO_SITE_FILE },
      embed: {
        leadsPerIp: e.LEAD_LIMIT_PER_IP,
        leadsPerIpAllWidgets: e.LEAD_LIMIT_PER_IP_ALL_WIDGETS,
        leadsPerWidget: e.LEAD_LIMIT_PER_WIDGET,
        sheetsPerIp: e.SHEET_LIMIT_PER_IP,
        windowMs: e.RATE_LIMIT_WINDOW_MINUTES * 60_000,
        copies: { perRecipientPerDay: e.COPY_LIMIT_PER_RECIPIENT, perWidgetPerHour: e.COPY_LIMIT_PER_WIDGET },
      },
      retention: {
        purgeIntervalMs: e.RETENTION_PURGE_INTERVAL_HOURS * 3_600_000,
        firstPurgeDelayMs: e.RETENTION_FIRST_PURGE_MINUTES * 60_000,
        chunkSize: e.RETENTION_PURGE_CHUNK,
      },
      /** Express's `trust proxy`: false, true, a hop count, or a list of proxy addresses/subnets. */
      trustProxy: e.TRUST_PROXY,
      payments: {
        apiUrl: e.PAYMENTS_API_URL,
        secretKey: e.PAYMENTS_SECRET_KEY,
        webhookSecret: e.PAYMENTS_WEBHOOK_SECRET,
      },
    };
  });

export type Config = z.output<typeof configSchema>;

/** Parse the environment once; everything else takes a `Config`, never `process.env`. */
export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const parsed = configSchema.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`Invalid configuration:\n${lines.join('\n')}`);
  }
  return parsed.data;
}

function parseTrustProxy(v: string): boolean | number | string {
  if (v === 'true' || v === 'yes') return true;
  if (v === 'false' || v === 'no' || v === '' || v === '0') return false;
  return /^\d+$/.test(v) ? Number(v) : v;
}

/** A browser sends a Secure cookie over https or to loopback only; keep cookies unsecured just for loopback http. */
function isLoopbackHttp(url: string): boolean {
  const u = new URL(url);
  if (u.protocol !== 'http:') return false;
  const host = u.hostname.replace(/^\[|\]$/g, '');
  return host === 'localhost' || host === '::1' || /^127\.\d+\.\d+\.\d+$/.test(host);
}
