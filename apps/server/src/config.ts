import { z } from 'zod';

const bool = z
  .enum(['true', 'false', '1', '0', 'yes', 'no'])
  .transform((v) => v === 'true' || v === '1' || v === 'yes');

const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
  HOST: z.string().default('127.0.0.1'),
  PORT: z.coerce.number().int().min(0).max(65535).default(5180),
  PUBLIC_URL: z.url().optional(),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  DB_HOST: z.string().default('127.0.0.1'),
  DB_PORT: z.coerce.number().int().min(1).max(65535).default(3307),
  DB_NAME: z.string().regex(/^[A-Za-z0-9_]+$/).default('wickstone'),
  DB_USER: z.string().default('wickstone'),
  DB_PASSWORD: z.string().default('wickstone-local'),
  DB_POOL_MAX: z.coerce.number().int().min(1).max(200).default(10),
  JWT_SECRET: z.string().min(32).default('local-development-secret-change-me-0123456789'),
  SMTP_HOST: z.string().default('127.0.0.1'),
  SMTP_PORT: z.coerce.number().int().min(1).max(65535).default(2525),
  MAIL_FROM: z.string().default('Wickstone <no-reply@wickstone.example>'),
  /** Set when the local fake SMTP server is in use: its HTTP listing of kept messages. */
  FAKE_MAIL_API_URL: z.url().optional(),
  DASHBOARD_DIR: z.string().optional(),
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
  mail: { smtpHost: string; smtpPort: number; from: string; fakeApiUrl: string | undefined };
  dashboardDir: string | undefined;
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
  return {
    env: e.NODE_ENV,
    host: e.HOST,
    port: e.PORT,
    publicUrl: e.PUBLIC_URL ?? `http://${e.HOST}:${e.PORT}`,
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
    mail: { smtpHost: e.SMTP_HOST, smtpPort: e.SMTP_PORT, from: e.MAIL_FROM, fakeApiUrl: e.FAKE_MAIL_API_URL },
    dashboardDir: e.DASHBOARD_DIR,
    trustProxy: e.TRUST_PROXY,
  };
}
