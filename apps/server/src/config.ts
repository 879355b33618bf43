import { z } from 'zod';

const bool = z
  .enum(['true', 'false', '1', '0', 'yes', 'no'])
  .transform((v) => v === 'true' || v === '1' || v === 'yes');

/** Measured with bench/bcrypt.ts on the project's machine: cost 12 takes 0.26 s per bcryptjs hash. */
export const DEFAULT_BCRYPT_COST = 12;
const DEV_JWT_SECRET = 'local-development-secret-change-me-0123456789';

const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
  HOST: z.string().default('127.0.0.1'),
  PORT: z.coerce.number().int().min(0).max(65535).default(5180),
  PUBLIC_URL: z.url().optional(),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  DB_HOST: z.string().default('127.0.0.1'),
  DB_PORT: z.coerce.number().int().min(1).max(65535).default(3307),
  DB_NAME: z
    .string()
    .regex(/^[A-Za-z0-9_]+$/)
    .default('wickstone'),
  DB_USER: z.string().default('wickstone'),
  DB_PASSWORD: z.string().default('wickstone-local'),
  DB_POOL_MAX: z.coerce.number().int().min(1).max(200).default(10),
  JWT_SECRET: z.string().min(32).default(DEV_JWT_SECRET),
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
  /** Failed sign-ins allowed per e-mail address and per client address in one window. */
  LOGIN_LIMIT_PER_ACCOUNT: z.coerce.number().int().min(1).max(10_000).default(10),
  LOGIN_LIMIT_PER_IP: z.coerce.number().int().min(1).max(100_000).default(50),
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
  /** The demo consultancy's site (npm start): its port, and where the seed writes its snippets. */
  DEMO_SITE_PORT: z.coerce.number().int().min(1).max(65535).default(5181),
  DEMO_SITE_FILE: z.string().optional(),
  LEAD_LIMIT_PER_IP: z.coerce.number().int().min(1).max(100_000).default(10),
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
  TRUST_PROXY: bool.default(false),
});

export type Config = {
  env: 'development' | 'test' | 'production';
  host: string;
  port: number;
  publicUrl: string;
  logLevel: z.infer<typeof envSchema>['LOG_LEVEL'];
  db: { host: string; port: number; name: string; user: string; password: string; poolMax: number };
  jwtSecret: string;
  auth: {
    bcryptCost: number;
    sessionTtlS: number;
    sessionMaxS: number;
    /** Secure cookies everywhere except a loopback http address (local development and tests). */
    secureCookies: boolean;
  };
  rateLimits: { loginPerAccount: number; loginPerIp: number; windowMs: number };
  mail: {
    smtpHost: string;
    smtpPort: number;
    smtpSecure: boolean;
    smtpUser: string | undefined;
    smtpPassword: string | undefined;
    from: string;
    fakeApiUrl: string | undefined;
  };
  dashboardDir: string | undefined;
  releasesDir: string | undefined;
  demo: { sitePort: number; snippetsFile: string | undefined };
  embed: { leadsPerIp: number; leadsPerWidget: number; sheetsPerIp: number; windowMs: number };
  retention: { purgeIntervalMs: number; firstPurgeDelayMs: number; chunkSize: number };
  trustProxy: boolean;
};

/** Parse the environment once; everything else takes a `Config`, never `process.env`. */
export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const parsed = envSchema.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`Invalid configuration:\n${lines.join('\n')}`);
  }
  const e = parsed.data;
  if (e.NODE_ENV === 'production') {
    const wrong: string[] = [];
    if (e.JWT_SECRET === DEV_JWT_SECRET) wrong.push('  JWT_SECRET: set a secret of your own in production');
    if (e.FAKE_MAIL_API_URL)
      wrong.push('  FAKE_MAIL_API_URL: the fake mailbox is for local runs, not production');
    if (wrong.length) throw new Error(`Invalid configuration:\n${wrong.join('\n')}`);
  }
  const publicUrl = e.PUBLIC_URL ?? `http://${e.HOST}:${e.PORT}`;
  return {
    env: e.NODE_ENV,
    host: e.HOST,
    port: e.PORT,
    publicUrl,
    logLevel: e.LOG_LEVEL,
    db: {
      host: e.DB_HOST,
      port: e.DB_PORT,
      name: e.DB_NAME,
      user: e.DB_USER,
      password: e.DB_PASSWORD,
      poolMax: e.DB_POOL_MAX,
    },
    jwtSecret: e.JWT_SECRET,
    auth: {
      bcryptCost: e.BCRYPT_COST,
      sessionTtlS: e.SESSION_TTL_MINUTES * 60,
      sessionMaxS: e.SESSION_MAX_HOURS * 3600,
      secureCookies: !isLoopbackHttp(publicUrl),
    },
    rateLimits: {
      loginPerAccount: e.LOGIN_LIMIT_PER_ACCOUNT,
      loginPerIp: e.LOGIN_LIMIT_PER_IP,
      windowMs: e.RATE_LIMIT_WINDOW_MINUTES * 60_000,
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
    demo: { sitePort: e.DEMO_SITE_PORT, snippetsFile: e.DEMO_SITE_FILE },
    embed: {
      leadsPerIp: e.LEAD_LIMIT_PER_IP,
      leadsPerWidget: e.LEAD_LIMIT_PER_WIDGET,
      sheetsPerIp: e.SHEET_LIMIT_PER_IP,
      windowMs: e.RATE_LIMIT_WINDOW_MINUTES * 60_000,
    },
    retention: {
      purgeIntervalMs: e.RETENTION_PURGE_INTERVAL_HOURS * 3_600_000,
      firstPurgeDelayMs: e.RETENTION_FIRST_PURGE_MINUTES * 60_000,
      chunkSize: e.RETENTION_PURGE_CHUNK,
    },
    trustProxy: e.TRUST_PROXY,
  };
}

/** A browser sends a Secure cookie over https or to loopback only; keep cookies unsecured just for loopback http. */
function isLoopbackHttp(url: string): boolean {
  const u = new URL(url);
  if (u.protocol !== 'http:') return false;
  const host = u.hostname.replace(/^\[|\]$/g, '');
  return host === 'localhost' || host === '::1' || /^127\.\d+\.\d+\.\d+$/.test(host);
}
