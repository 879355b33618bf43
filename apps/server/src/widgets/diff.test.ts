import { describe, expect, it } from 'vitest';
import { diff } from './diff.js';

describe('diff', () => {
  it('names the leaves that changed', () => {
    const a = {
      name: 'A',
      settings: { look: { corner: 'soft', font: 'manrope' }, cautions: '' },
      allowedOrigins: ['https://a.example'],
    };
    const b = {
      name: 'A',
      settings: { look: { corner: 'round', font: 'manrope' }, cautions: 'x' },
      allowedOrigins: ['https://a.example', 'https://b.example'],
    };
    expect(diff(a, b)).toEqual([
      {
        path: 'allowedOrigins',
        before: ['https://a.example'],
        after: ['https://a.example', 'https://b.example'],
      },
      { path: 'settings.cautions', before: '', after: 'x' },
      { path: 'settings.look.corner', before: 'soft', after: 'round' },
    ]);
  });

  it('reports added and removed keys with null on the missing side', () => {
    expect(diff({ inputs: {} }, { inputs: { boreDiameter: { mode: 'locked' } } })).toEqual([
      { path: 'inputs.boreDiameter', before: null, after: { mode: 'locked' } },
    ]);
    expect(diff({ x: 1 }, { x: 1 })).toEqual([]);
  });
});
