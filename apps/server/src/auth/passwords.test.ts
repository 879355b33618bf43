import { describe, expect, it } from 'vitest';
import bcrypt from 'bcryptjs';
import { assertAcceptablePassword, isCommonPassword, verifyPassword } from './passwords.js';

describe('passwords', () => {
  it('knows the common passwords, whatever their case', () => {
    for (const p of ['password', '12345678', 'qwertyuiop', 'iloveyou', 'Password1', 'SUNSHINE', 'trustno1'])
      expect(isCommonPassword(p), p).toBe(true);
    for (const p of ['capillary-fringe-42', 'Wilhelmy plate at 20 C', 'capillary-demo-2026'])
      expect(isCommonPassword(p), p).toBe(false);
  });

  it('refuses a common one naming the field it came in', () => {
    expect(() => assertAcceptablePassword('letmein1', 'body.newPassword')).toThrowError(
      expect.objectContaining({
        code: 'validation_failed',
        details: { fields: [{ field: 'body.newPassword', message: expect.stringMatching(/common/) }] },
      }),
    );
    expect(() => assertAcceptablePassword('capillary-fringe-42', 'body.password')).not.toThrow();
  });

  it('verifies against a hash, and says no (after the same work) with no hash or more than 72 bytes', async () => {
    const hash = await bcrypt.hash('capillary-fringe-42', 4);
    expect(await verifyPassword('capillary-fringe-42', hash, 4)).toBe(true);
    expect(await verifyPassword('capillary-fringe-43', hash, 4)).toBe(false);
    expect(await verifyPassword('capillary-fringe-42', null, 4)).toBe(false);
    // bcrypt would compare only the first 72 bytes and say yes; a longer password can never have been set.
    const long = 'a'.repeat(72);
    const longHash = await bcrypt.hash(long, 4);
    expect(await verifyPassword(`${long}and-more`, longHash, 4)).toBe(false);
  });
});
