import { describe, expect, it } from 'vitest';
import { DEFAULT_BCRYPT_COST, loadConfig } from './config.js';

describe('loadConfig', () => {
  it('has defaults for a local run', () => {
    const c = loadConfig({});
    expect(c.port).toBe(5180);
    expect(c.db.port).toBe(3307);
    expect(c.publicUrl).toBe('http://127.0.0.1:5180');
  });

  it('names the variable that is wrong', () => {
    expect(() => loadConfig({ PORT: 'eighty' })).toThrow(/PORT/);
    expect(() => loadConfig({ DB_NAME: 'x; DROP DATABASE y' })).toThrow(/DB_NAME/);
    expect(() => loadConfig({ JWT_SECRET: 'short' })).toThrow(/JWT_SECRET/);
  });

  it('hashes at the measured cost by default (bench/bcrypt.ts: cost 12 took 0.26 s here), and tests may lower it', () => {
    expect(DEFAULT_BCRYPT_COST).toBe(12);
    expect(loadConfig({}).auth.bcryptCost).toBe(12);
    expect(loadConfig({ BCRYPT_COST: '4' }).auth.bcryptCost).toBe(4);
    expect(() => loadConfig({ BCRYPT_COST: '3' })).toThrow(/BCRYPT_COST/);
  });

  it('reads from the primary unless a read replica is configured, whose port and account default to the primary’s', () => {
    expect(loadConfig({}).db.read).toBeNull();
    expect(loadConfig({ DB_PORT: '3416', DB_READ_HOST: '10.0.0.7' }).db.read).toEqual({
      host: '10.0.0.7',
      port: 3416,
      user: 'wickstone',
      password: 'wickstone-local',
    });
    expect(
      loadConfig({ DB_READ_HOST: 'replica.db.example', DB_READ_PORT: '3560', DB_READ_USER: 'reader' }).db
        .read,
    ).toMatchObject({ host: 'replica.db.example', port: 3560, user: 'reader' });
    expect(() => loadConfig({ DB_READ_PORT: '3560' })).toThrow(/DB_READ_HOST/);
    expect(() => loadConfig({ DB_READ_HOST: 'replica.db.example', DB_READ_PORT: 'x' })).toThrow(
      /DB_READ_PORT/,
    );
  });

  it('makes cookies Secure everywhere but loopback http', () => {
    expect(loadConfig({}).auth.secureCookies).toBe(false);
    expect(loadConfig({ PUBLIC_URL: 'http://localhost:5180' }).auth.secureCookies).toBe(false);
    expect(loadConfig({ PUBLIC_URL: 'https://wickstone.example' }).auth.secureCookies).toBe(true);
    expect(loadConfig({ PUBLIC_URL: 'http://wickstone.example' }).auth.secureCookies).toBe(true);
  });

  it('refuses the development secret and the fake mailbox in production', () => {
    const prod = { NODE_ENV: 'production', JWT_SECRET: 'a-production-secret-of-at-least-32-chars' };
    expect(() => loadConfig(prod)).not.toThrow();
    expect(() => loadConfig({ NODE_ENV: 'production' })).toThrow(/JWT_SECRET/);
    expect(() => loadConfig({ ...prod, FAKE_MAIL_API_URL: 'http://127.0.0.1:8025' })).toThrow(
      /FAKE_MAIL_API_URL/,
    );
  });

  it('reads TRUST_PROXY as off, on, a hop count or a list of proxy addresses', () => {
    expect(loadConfig({}).trustProxy).toBe(false);
    expect(loadConfig({ TRUST_PROXY: 'true' }).trustProxy).toBe(true);
    expect(loadConfig({ TRUST_PROXY: '0' }).trustProxy).toBe(false);
    expect(loadConfig({ TRUST_PROXY: '1' }).trustProxy).toBe(1);
    expect(loadConfig({ TRUST_PROXY: 'loopback, 10.0.0.0/8' }).trustProxy).toBe('loopback, 10.0.0.0/8');
  });

  it('never shares a session secret between development processes that were given none', () => {
    const a = loadConfig({ NODE_ENV: 'development' }).jwtSecret;
    const b = loadConfig({ NODE_ENV: 'development' }).jwtSecret;
    expect(a.length).toBeGreaterThanOrEqual(32);
    expect(a).not.toBe(b);
    expect(loadConfig({ NODE_ENV: 'development', JWT_SECRET: 'x'.repeat(40) }).jwtSecret).toBe(
      'x'.repeat(40),
    );
  });
});
