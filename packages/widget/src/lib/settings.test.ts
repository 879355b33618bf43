import { calculator as tube } from '@wickstone/calc-core/calculators/tube-rise';
import { describe, expect, it } from 'vitest';
import { resolveInputSettings } from './settings.js';

describe('resolveInputSettings', () => {
  it('keeps the calculator’s order and defaults when the widget sets nothing', () => {
    const r = resolveInputSettings(tube, {});
    expect(r.map((i) => i.def.id)).toEqual(tube.inputs.map((i) => i.id));
    expect(r.every((i) => i.mode === 'editable' && !i.defaultRejected)).toBe(true);
    expect(r.find((i) => i.def.id === 'diameter')?.initial).toBe(0.001);
  });

  it('applies modes and the firm’s defaults', () => {
    const r = resolveInputSettings(tube, {
      diameter: { mode: 'locked', default: 0.0004 },
      gravity: { mode: 'hidden' },
      liquid: { mode: 'editable', default: 'ethanol' },
    });
    const get = (id: string) => r.find((i) => i.def.id === id);
    expect(get('diameter')).toMatchObject({ mode: 'locked', initial: 0.0004 });
    expect(get('gravity')).toMatchObject({ mode: 'hidden', initial: 9.80665 });
    expect(get('liquid')).toMatchObject({ mode: 'editable', initial: 'ethanol' });
  });

  it('refuses a default of the wrong kind and falls back to the calculator’s', () => {
    const r = resolveInputSettings(tube, {
      liquid: { mode: 'locked', default: 'lava' },
      diameter: { mode: 'editable', default: 'wide' },
    });
    expect(r.find((i) => i.def.id === 'liquid')).toMatchObject({
      mode: 'locked',
      initial: 'water',
      defaultRejected: true,
    });
    expect(r.find((i) => i.def.id === 'diameter')).toMatchObject({ initial: 0.001, defaultRejected: true });
  });

  it('keeps a numeric default outside the range, for calc-core to name', () => {
    const r = resolveInputSettings(tube, { diameter: { mode: 'hidden', default: 9 } });
    expect(r.find((i) => i.def.id === 'diameter')).toMatchObject({ initial: 9, defaultRejected: false });
  });

  it('ignores settings for inputs the calculator lacks and unknown modes', () => {
    const settings = {
      noSuchInput: { mode: 'hidden' as const },
      gravity: { mode: 'sideways' as unknown as 'hidden' },
    };
    const r = resolveInputSettings(tube, settings);
    expect(r).toHaveLength(tube.inputs.length);
    expect(r.find((i) => i.def.id === 'gravity')?.mode).toBe('editable');
  });
});
