import { describe, expect, it } from 'vitest';
import { sameProps } from './pure.js';

describe('sameProps', () => {
  const input = { id: 'diameter' };
  const onText = () => undefined;

  it('holds for the same values, and for arrays with the same items in the same order', () => {
    expect(sameProps({ input, n: 1, warningIds: ['a', 'b'] }, { input, n: 1, warningIds: ['a', 'b'] })).toBe(
      true,
    );
    expect(sameProps({ value: NaN }, { value: NaN })).toBe(true);
    expect(sameProps({}, {})).toBe(true);
  });

  it('fails for a changed value, a new object, a missing or added key, or arrays that differ', () => {
    expect(sameProps({ input, onText }, { input, onText: () => undefined })).toBe(false);
    expect(sameProps({ input }, { input: { id: 'diameter' } })).toBe(false);
    expect(sameProps({ error: undefined }, {})).toBe(false);
    expect(sameProps({}, { error: undefined })).toBe(false);
    expect(sameProps({ ids: ['a', 'b'] }, { ids: ['b', 'a'] })).toBe(false);
    expect(sameProps({ ids: ['a'] }, { ids: ['a', 'b'] })).toBe(false);
    expect(sameProps({ ids: [] }, { ids: null })).toBe(false);
    expect(sameProps({ options: [input] }, { options: [{ id: 'diameter' }] })).toBe(false);
  });
});
