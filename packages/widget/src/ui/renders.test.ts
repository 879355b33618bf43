// @vitest-environment happy-dom
import { calculator as core, compute, run } from '@wickstone/calc-core/calculators/tube-rise';
import type { CalculatorDefinition } from '@wickstone/calc-core';
import { defaultWidgetSettings, type EmbedWidget } from '@wickstone/contracts';
import { h, options, render, type VNode } from 'preact';
import { act } from 'preact/test-utils';
import { afterEach, beforeAll, beforeEach, describe, expect, it, vi } from 'vitest';
import { loadExtras } from '../lazy.js';
import type { Reporter } from '../lib/reporter.js';
import { App } from './App.js';

// How often each part of the full widget is rendered: a field's render makes its one
// `div[data-field]` element; the result's, the lead form's and the sheet's their one
// `section[data-wickstone]`; the answer inside the result its one `div.answer`. Counted with
// Preact's public `options.vnode` hook, which sees every element a render creates.
let renders = new Map<string, number>();
let previousHook: typeof options.vnode;

function counted(vnode: VNode): void {
  if (typeof vnode.type === 'string') {
    const props = vnode.props as Record<string, unknown>;
    const part =
      vnode.type === 'div' && typeof props['data-field'] === 'string'
        ? `field:${props['data-field']}`
        : vnode.type === 'section' && typeof props['data-wickstone'] === 'string'
          ? props['data-wickstone']
          : vnode.type === 'div' && props.class === 'answer'
            ? 'answer'
            : null;
    if (part !== null) renders.set(part, (renders.get(part) ?? 0) + 1);
  }
}

beforeEach(() => {
  previousHook = options.vnode;
  options.vnode = (vnode) => {
    counted(vnode);
    previousHook?.(vnode);
  };
});

afterEach(() => {
  options.vnode = previousHook;
  document.body.replaceChildren();
});

/** What was rendered since the last call, as `{ answer: 1, 'field:diameter': 1, result: 1 }`. */
function rendered(): Record<string, number> {
  const out = Object.fromEntries([...renders].sort(([a], [b]) => a.localeCompare(b)));
  renders = new Map();
  return out;
}

function widget(lead = false): EmbedWidget {
  const s = defaultWidgetSettings();
  return {
    publicKey: 'wk_abcdefghij0123456789',
    name: 'Damp check',
    calculatorId: 'tube-rise',
    release: '0.3.0',
    settings: {
      ...s,
      inputs: {},
      units: { system: 'si', visitorMaySwitch: true },
      look: { ...s.look, font: 'system-sans', logoUrl: null },
      cautions: '',
      leadForm: { ...s.leadForm, enabled: lead },
      sheet: { enabled: lead },
    },
  } as EmbedWidget;
}

const calculator: CalculatorDefinition = { cautions: [], references: [], ...core };

function mount(withRun = false, lead = false, reporter: Reporter | null = null): HTMLElement {
  const host = document.createElement('div');
  document.body.append(host);
  const target = document.createElement('div');
  host.attachShadow({ mode: 'open' }).append(target);
  act(() => {
    render(
      h(App, {
        widget: widget(lead),
        calculator,
        compute,
        run: withRun ? run : null,
        apiBase: reporter === null ? null : 'https://app.wickstone.example',
        reporter,
      }),
      target,
    );
  });
  rendered();
  return target;
}

const control = (root: ParentNode, id: string) =>
  root.querySelector<HTMLInputElement>(`input[data-input="${id}"]`)!;

function type(root: ParentNode, id: string, text: string): void {
  act(() => {
    const el = control(root, id);
    el.value = text;
    el.dispatchEvent(new Event('input', { bubbles: true }));
  });
}

function workItOut(root: ParentNode): void {
  act(() => {
    root.querySelector('form')!.dispatchEvent(new Event('submit', { bubbles: true, cancelable: true }));
  });
}

/** The fields shown, by input id. */
const fieldIds = (root: ParentNode) =>
  [...root.querySelectorAll<HTMLElement>('[data-field]')].map((f) => f.dataset.field!);

describe('what the full widget renders again', () => {
  it('renders every field and no result at first, so the counter sees each part', () => {
    const host = document.createElement('div');
    document.body.append(host);
    act(() => {
      render(
        h(App, { widget: widget(), calculator, compute, run: null, apiBase: null, reporter: null }),
        host,
      );
    });
    const ids = fieldIds(host);
    expect(ids).toContain('diameter');
    expect(ids).toContain('gravity');
    expect(rendered()).toEqual(Object.fromEntries(ids.map((id) => [`field:${id}`, 1]).sort()));
  });

  it('typing in one field renders that field alone, before and after an answer', () => {
    const root = mount();
    type(root, 'diameter', '0.5');
    expect(rendered()).toEqual({ 'field:diameter': 1 });
    expect(control(root, 'diameter').value).toBe('0.5');

    workItOut(root);
    expect(rendered()).toEqual({ answer: 1, result: 1 });
    // The first keystroke after an answer also marks the answer stale; later ones change nothing else.
    type(root, 'gravity', '9.8');
    expect(rendered()).toEqual({ 'field:gravity': 1, result: 1 });
    expect(root.querySelector('[data-result]')?.hasAttribute('data-stale')).toBe(true);
    type(root, 'gravity', '9.81');
    expect(rendered()).toEqual({ 'field:gravity': 1 });
    expect(control(root, 'gravity').value).toBe('9.81');
  });

  it('an answer renders the result and only the fields whose warnings or problems changed', () => {
    const root = mount();
    const others = () => fieldIds(root).filter((id) => id !== 'diameter');
    workItOut(root);
    expect(rendered()).toEqual({ answer: 1, result: 1 });

    // A 20 mm bore is wider than twice the capillary length of water: the warning names the bore.
    type(root, 'diameter', '20');
    rendered();
    workItOut(root);
    expect(rendered()).toEqual({ answer: 1, 'field:diameter': 1, result: 1 });
    const diameterField = root.querySelector('[data-field="diameter"]')!;
    expect(diameterField.hasAttribute('data-warned')).toBe(true);
    for (const id of others())
      expect(root.querySelector(`[data-field="${id}"]`)!.hasAttribute('data-warned')).toBe(false);

    // The same answer again: nothing in the form changes, only the result is rendered.
    workItOut(root);
    expect(rendered()).toEqual({ answer: 1, result: 1 });

    // Unreadable text: its field shows the problem, the other fields and the result are left alone.
    type(root, 'diameter', 'abc');
    rendered();
    workItOut(root);
    expect(rendered()).toEqual({ 'field:diameter': 1 });
    expect(diameterField.hasAttribute('data-invalid')).toBe(true);
    expect(root.querySelector('[data-field-error="diameter"]')?.textContent).not.toBe('');

    // Mended: the problem goes and a new answer comes, the other fields untouched.
    type(root, 'diameter', '1');
    rendered();
    workItOut(root);
    expect(rendered()).toEqual({ answer: 1, 'field:diameter': 1, result: 1 });
    expect(diameterField.hasAttribute('data-invalid')).toBe(false);
    expect(diameterField.hasAttribute('data-warned')).toBe(false);
  });

  it('the full run arriving after the answer renders the result, not the fields', async () => {
    const root = mount(true);
    workItOut(root);
    expect(rendered()).toEqual({ answer: 1, result: 1 });
    // The full run is made in a task after the answer's frame is painted.
    await vi.waitFor(() => expect(renders.get('result')).toBe(1), { timeout: 2000, interval: 10 });
    expect(rendered()).toEqual({ answer: 1, result: 1 });
  });

  it('the run report’s answer renders the result’s state, not the answer', async () => {
    let answered: (ok: boolean) => void = () => undefined;
    const reporter: Reporter = {
      report: () => ({ id: 'run_1', stored: new Promise<boolean>((resolve) => (answered = resolve)) }),
    };
    const root = mount(true, false, reporter);
    workItOut(root);
    rendered();
    const result = () => root.querySelector('[data-result]')!;
    await vi.waitFor(() => expect(result().getAttribute('data-report')).toBe('pending'), {
      timeout: 2000,
      interval: 10,
    });
    expect(result().getAttribute('data-run-id')).toBe('run_1');
    rendered();
    await act(async () => {
      answered(true);
      await Promise.resolve();
    });
    expect(result().getAttribute('data-report')).toBe('stored');
    expect(rendered()).toEqual({ result: 1 });
  });

  it('a unit switch renders every field again in the new units', () => {
    const root = mount();
    act(() => {
      root.querySelector<HTMLInputElement>('input[data-unit="us"]')!.click();
    });
    const ids = fieldIds(root);
    const counts = rendered();
    for (const id of ids) expect(counts[`field:${id}`]).toBe(1);
    expect(root.querySelector('label[for="wk-in-diameter"]')?.textContent).toBe('Bore (inside diameter), in');
  });
});

// Last in this file: the extras chunk, once loaded, stays loaded for the module.
describe('with the extras chunk here', () => {
  beforeAll(async () => {
    await loadExtras(() => import('../extras.js'));
  });

  it('typing beside the lead form and the sheet renders the field alone', () => {
    // In preview the lead form and the sheet show from the start.
    const root = mount(false, true);
    expect(root.querySelector('[data-wickstone="lead-form"]')).not.toBeNull();
    expect(root.querySelector('[data-wickstone="sheet"]')).not.toBeNull();
    type(root, 'diameter', '0.5');
    expect(rendered()).toEqual({ 'field:diameter': 1 });
    workItOut(root);
    expect(rendered()).toEqual({ answer: 1, result: 1 });
  });
});
