// @vitest-environment happy-dom
import { cleanup, render } from '@testing-library/react';
import { afterEach, describe, expect, it } from 'vitest';
import { getCalculator } from '@wickstone/calc-core';
import { describeRevision, TextDifference } from './widget-history';

const calc = getCalculator('tube-rise')!;

afterEach(cleanup);

describe('a revision in words', () => {
  it('names a creation, a status change, a rename and the settings changed', () => {
    expect(describeRevision([{ path: 'name', before: null, after: 'Bore check' }], calc)).toBe(
      'Created the widget.',
    );
    expect(
      describeRevision(
        [
          { path: 'status', before: 'draft', after: 'live' },
          { path: 'settings.units.system', before: 'si', after: 'us' },
        ],
        calc,
      ),
    ).toBe('Put it in service and changed the unit system.');
    expect(
      describeRevision(
        [
          { path: 'name', before: 'A', after: 'Bore check' },
          { path: 'status', before: 'live', after: 'paused' },
        ],
        calc,
      ),
    ).toBe('Renamed it “Bore check” and put it on hold.');
  });

  it('names an input by its label and counts what it does not list', () => {
    expect(
      describeRevision([{ path: 'settings.inputs.diameter.default', before: 0.001, after: 0.002 }], calc),
    ).toBe('Changed the bore (inside diameter): default.');
    const many = ['font', 'corner', 'colors.text', 'colors.background', 'colors.primary'].map((k) => ({
      path: `settings.look.${k}`,
      before: 'a',
      after: 'b',
    }));
    expect(describeRevision(many, calc)).toBe('Changed the font, the corners and 3 more settings.');
  });
});

describe('a long text as it changed', () => {
  it('marks the words taken out and put in, and keeps the rest as it was', () => {
    const { container } = render(
      <TextDifference
        before="Readings on site govern this estimate."
        after="Readings taken on site by a surveyor govern this estimate."
      />,
    );
    const added = [...container.querySelectorAll('ins')].map((e) => e.textContent);
    const removed = [...container.querySelectorAll('del')].map((e) => e.textContent);
    expect(added.join('|')).toContain('taken');
    expect(added.join('|')).toContain('surveyor');
    expect(removed).toEqual([]);
    expect(container.textContent).toContain('govern this estimate.');
  });
});
