import { describe, expect, it } from 'vitest';
import { updateAccountBodySchema } from '@wickstone/contracts';
import { requireFields } from './form';

describe('requireFields', () => {
  const passwordChange = requireFields(updateAccountBodySchema, ['currentPassword', 'newPassword']);

  it('asks for the fields this form must fill, which the shared schema leaves optional', () => {
    expect(updateAccountBodySchema.safeParse({}).success).toBe(true);
    const result = passwordChange.safeParse({});
    expect(result.success).toBe(false);
    if (!result.success) {
      expect(result.error.issues.map((i) => [i.path.join('.'), i.message])).toEqual([
        ['currentPassword', 'Required'],
        ['newPassword', 'Required'],
      ]);
    }
  });

  it("keeps the schema's own rules for what was given", () => {
    const result = passwordChange.safeParse({ currentPassword: 'old-one', newPassword: 'short' });
    expect(result.success).toBe(false);
    if (!result.success) expect(result.error.issues.map((i) => i.path.join('.'))).toEqual(['newPassword']);
  });

  it('passes what the schema passes once the fields are there', () => {
    const result = passwordChange.safeParse({ currentPassword: 'old-one', newPassword: 'a-much-longer-one' });
    expect(result).toMatchObject({
      success: true,
      data: { currentPassword: 'old-one', newPassword: 'a-much-longer-one' },
    });
  });
});
