import { describe, expect, it } from 'vitest';
import { loadConfig } from './config.js';

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
});
