import { describe, expect, it } from 'vitest';
import { lookVariables, MANROPE_FAMILY } from './look.js';

const colors = { background: '#fbf8f3', text: '#2b2118', primary: '#8a3b12', primaryText: '#ffffff' };

describe('lookVariables', () => {
  it('turns a widget’s look into the custom properties the style sheet reads', () => {
    expect(lookVariables({ colors, font: 'manrope', corner: 'round', logoUrl: null })).toEqual({
      '--wk-bg': '#fbf8f3',
      '--wk-fg': '#2b2118',
      '--wk-accent': '#8a3b12',
      '--wk-on-accent': '#ffffff',
      '--wk-r': '18px',
      '--wk-rc': '12px',
      '--wk-font': `'${MANROPE_FAMILY}', ui-sans-serif, system-ui, sans-serif`,
    });
    expect(lookVariables({ colors, font: 'system-serif', corner: 'square', logoUrl: null })).toMatchObject({
      '--wk-r': '0px',
      '--wk-font': expect.stringMatching(/serif$/),
    });
  });

  it('never passes anything but #rrggbb into the style sheet', () => {
    const v = lookVariables({
      colors: { ...colors, background: 'red; background-image: url(x)', primary: '#12345' },
      font: 'manrope',
      corner: 'soft',
      logoUrl: null,
    });
    expect(v['--wk-bg']).toBe('#ffffff');
    expect(v['--wk-accent']).toBe('#1d4e5f');
    expect(v['--wk-fg']).toBe('#2b2118');
  });
});
