// @vitest-environment happy-dom
import { calculator, compute } from '@wickstone/calc-core/calculators/tube-rise';
import { defaultWidgetSettings, type EmbedWidget } from '@wickstone/contracts';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { mountWidget } from '../mount.js';
import { mountFirst, type AppChunk } from './mount.js';
import { renderFirstView } from './view.js';

function widget(overrides: Partial<EmbedWidget['settings']> = {}): EmbedWidget {
  const s = defaultWidgetSettings();
  return {
    publicKey: 'wk_abcdefghij0123456789',
    name: 'Damp check',
    calculatorId: 'tube-rise',
    release: '0.3.0',
    settings: {
      inputs: {},
      units: { system: 'si', visitorMaySwitch: true },
      look: { colors: s.look.colors, font: 'system-sans', corner: s.look.corner, logoUrl: null },
      cautions: '',
      leadForm: { enabled: false, fields: s.leadForm.fields, consentText: s.leadForm.consentText },
      sheet: { enabled: false },
      ...overrides,
    },
  } as EmbedWidget;
}

/** A shadow root to render into, as the widget's host has. */
function shadowTarget(): { shadow: ShadowRoot; target: HTMLElement } {
  const host = document.createElement('div');
  document.body.append(host);
  const shadow = host.attachShadow({ mode: 'open' });
  const target = document.createElement('div');
  shadow.append(target);
  return { shadow, target };
}

/** The first view of the test widget (tube rise, no texts yet) in `target`. */
function renderTube(target: HTMLElement): void {
  renderFirstView(target, {
    widget: widget(),
    calculator: { cautions: [], references: [], ...calculator },
    compute,
    apiBase: null,
  });
}

function type(el: HTMLInputElement, text: string): void {
  el.value = text;
  el.dispatchEvent(new Event('input', { bubbles: true }));
}

/** Typing that leaves the caret (or a selection) inside the text, as a visitor editing in the middle does. */
function typeAt(el: HTMLInputElement, text: string, start: number, end: number): void {
  el.value = text;
  el.setSelectionRange(start, end);
  el.dispatchEvent(new Event('input', { bubbles: true }));
}

function submit(root: ParentNode): void {
  root.querySelector('form')!.dispatchEvent(new Event('submit', { bubbles: true, cancelable: true }));
}

const diameter = (root: ParentNode) => root.querySelector<HTMLInputElement>('input[data-input="diameter"]')!;

afterEach(() => {
  document.body.replaceChildren();
});

describe('the first view', () => {
  it('renders the header, the fields with their units and the button, with no result before one is asked for', () => {
    const { target } = shadowTarget();
    renderTube(target);
    expect(target.querySelector('.widget-name')?.textContent).toBe('Damp check');
    expect(target.querySelector('h2.title')?.textContent).toBe(calculator.title);
    expect(target.querySelector('label[for="wk-in-diameter"]')?.textContent).toBe(
      'Bore (inside diameter), mm',
    );
    expect(diameter(target).value).toBe('1');
    expect(target.querySelector('select[data-input="liquid"]')).not.toBeNull();
    // Water: its temperature shows; the custom liquid's surface tension does not apply.
    expect(target.querySelector('[data-field="temperatureC"]')).not.toBeNull();
    expect(target.querySelector('[data-field="surfaceTension"]')).toBeNull();
    expect(target.querySelector('[data-wickstone="calculate"]')?.textContent).toBe('Work it out');
    expect(target.querySelector('[data-wickstone="result"]')).toBeNull();
    expect(target.querySelector<HTMLInputElement>('input[data-unit="si"]')!.checked).toBe(true);
  });

  it('works out the answer calc-core gives for what was typed', () => {
    const { target } = shadowTarget();
    renderTube(target);
    type(diameter(target), '0.5');
    submit(target);
    const rise = target.querySelector<HTMLElement>('.readout[data-output="rise"]');
    const expected = compute({ ...calculatorDefaults(), diameter: 0.0005 }).outputs.rise as number;
    expect(Number(rise?.getAttribute('data-value'))).toBeCloseTo(expected, 12);
    expect(target.querySelector('[data-wickstone="headline"]')?.textContent).not.toBe('');
    expect(target.querySelector('[data-wickstone="announcer"]')?.textContent).toContain(
      target.querySelector('[data-wickstone="headline"]')?.textContent ?? 'none',
    );
    // A new keystroke marks the answer as out of date, as the full widget does.
    type(diameter(target), '0.6');
    expect(target.querySelector('[data-wickstone="stale"]')).not.toBeNull();
    expect(diameter(target).value).toBe('0.6');
  });

  it('never shows a withheld figure, and shows the warning that says why with the answer', () => {
    const { target } = shadowTarget();
    renderTube(target);
    type(diameter(target), '20');
    submit(target);
    const withheld = target.querySelector('.readout[data-output="rise"]');
    expect(withheld?.getAttribute('data-withheld')).toBeTruthy();
    expect(withheld?.textContent).toContain('no figure');
    expect(withheld?.hasAttribute('data-value')).toBe(false);
    const code = withheld!.getAttribute('data-withheld')!;
    const shown = target.querySelector(`.warning[data-warning="${code}"]`);
    expect(shown?.textContent).toContain('no rise is given');
    // The field the warning names points at it.
    expect(diameter(target).getAttribute('aria-describedby')).toContain(`wk-warn-${code}`);
    expect(target.querySelector('[data-field="diameter"]')?.classList.contains('warned')).toBe(true);
  });

  it('names the field a problem is in, beside it, and gives it focus', () => {
    const { shadow, target } = shadowTarget();
    renderTube(target);
    type(diameter(target), 'abc');
    submit(target);
    const error = target.querySelector('[data-field-error="diameter"]');
    expect(error?.textContent).toBe('Enter a number, such as 0.5');
    expect(diameter(target).getAttribute('aria-invalid')).toBe('true');
    expect(target.querySelector('[data-wickstone="result"]')).toBeNull();
    expect(shadow.activeElement).toBe(diameter(target));
    // Out of range: the range in the unit the box is in.
    type(diameter(target), '90');
    submit(target);
    expect(target.querySelector('[data-field-error="diameter"]')?.textContent).toBe(
      'Use a value from 0.001 mm to 50 mm',
    );
  });

  it('switches units, showing the typed value in the new unit, and keeps focus and caret on a redraw', () => {
    const { shadow, target } = shadowTarget();
    renderTube(target);
    type(diameter(target), '25.4');
    const us = target.querySelector<HTMLInputElement>('input[data-unit="us"]')!;
    us.checked = true;
    us.dispatchEvent(new Event('change', { bubbles: true }));
    expect(target.querySelector('label[for="wk-in-diameter"]')?.textContent).toBe(
      'Bore (inside diameter), in',
    );
    expect(diameter(target).value).toBe('1');
    expect(target.querySelector('.root')?.getAttribute('data-system')).toBe('us');
    // A redraw (here: the answer going stale) keeps the focused box and its selection.
    submit(target);
    const box = diameter(target);
    box.focus();
    // The first keystroke after an answer redraws (the answer goes stale).
    typeAt(box, '1.25', 1, 3);
    expect(target.querySelector('[data-wickstone="stale"]')).not.toBeNull();
    expect(shadow.activeElement).toBe(diameter(target));
    expect(diameter(target).selectionStart).toBe(1);
    expect(diameter(target).selectionEnd).toBe(3);
  });

  it('keeps focus on a choice whose change redraws the fields, and a backward selection as it was', () => {
    const { shadow, target } = shadowTarget();
    renderTube(target);
    const liquid = () => target.querySelector<HTMLSelectElement>('select[data-input="liquid"]')!;
    const before = liquid();
    before.focus();
    before.value = 'ethanol';
    before.dispatchEvent(new Event('change', { bubbles: true }));
    expect(liquid()).not.toBe(before);
    expect(shadow.activeElement).toBe(liquid());
    expect(liquid().value).toBe('ethanol');

    submit(target);
    const box = diameter(target);
    box.focus();
    box.value = '1.25';
    box.setSelectionRange(1, 3, 'backward');
    box.dispatchEvent(new Event('input', { bubbles: true }));
    expect(diameter(target)).not.toBe(box);
    expect(shadow.activeElement).toBe(diameter(target));
    expect(diameter(target).selectionDirection).toBe('backward');
  });
});

describe('a snippet’s settings, checked by the runtime', () => {
  const bundle = (checkSettings: boolean) => ({
    calculator,
    compute,
    releaseBase: null,
    defaultApiBase: 'https://app.wickstone.example',
    texts: null,
    extras: null,
    tables: null,
    app: null,
    checkSettings,
  });

  it('refuses a malformed answer before drawing anything, so the loader can give the place back', () => {
    const host = document.createElement('wickstone-widget');
    document.body.append(host);
    const broken = { ...widget(), settings: { ...widget().settings, look: null } } as unknown as EmbedWidget;
    expect(() => mountFirst(bundle(true), host, { widget: broken })).toThrow(/malformed settings/);
    expect(host.shadowRoot).toBeNull();
    expect(host.hasAttribute('data-state')).toBe(false);
  });

  it('draws a well-formed answer', () => {
    const host = document.createElement('wickstone-widget');
    document.body.append(host);
    mountFirst(bundle(true), host, { widget: widget() });
    expect(host.shadowRoot?.querySelector('[data-wickstone="root"]')).not.toBeNull();
    expect(host.getAttribute('data-state')).toBe('ready');
  });
});

describe('the full widget taking over from the first view', () => {
  it('keeps the typed text, the unit system, the answer, the focused control and its caret', async () => {
    const host = document.createElement('wickstone-widget');
    document.body.append(host);
    let release: (app: AppChunk) => void = () => undefined;
    const app = new Promise<AppChunk>((r) => (release = r));
    mountFirst(
      {
        calculator,
        compute,
        releaseBase: null,
        defaultApiBase: null,
        texts: null,
        extras: null,
        tables: null,
        app: () => app,
      },
      host,
      { widget: widget(), preview: true },
    );
    const shadow = host.shadowRoot!;
    const before = shadow.querySelector<HTMLElement>('div[data-wickstone="mount"]')!;
    expect(before.querySelector('[data-wickstone="root"]')).not.toBeNull();
    type(diameter(shadow), '0.8');
    submit(shadow);
    const us = shadow.querySelector<HTMLInputElement>('input[data-unit="us"]')!;
    us.checked = true;
    us.dispatchEvent(new Event('change', { bubbles: true }));
    diameter(shadow).focus();
    typeAt(diameter(shadow), '0.0315', 2, 4);
    // That keystroke made the answer stale and redrew the fields: the box now in place, focused.
    const box = diameter(shadow);
    expect(shadow.activeElement).toBe(box);
    const headline = shadow.querySelector('[data-wickstone="headline"]')!.textContent;
    const fields = [...shadow.querySelectorAll('[data-field]')].map((f) => f.getAttribute('data-field'));
    const markup = outline(before);

    release({ mountWidget });
    await vi.waitFor(() => expect(before.getAttribute('data-view')).toBe('full'));
    const after = shadow.querySelector<HTMLElement>('div[data-wickstone="mount"]')!;
    // The App adopted the first view's elements: the same container, the same box, never blurred.
    expect(after).toBe(before);
    expect(diameter(after)).toBe(box);
    expect(shadow.querySelectorAll('div[data-wickstone="mount"]')).toHaveLength(1);
    // The App, with the first view's state.
    expect(diameter(after).value).toBe('0.0315');
    expect(after.querySelector('.root')?.getAttribute('data-system')).toBe('us');
    expect(after.querySelector<HTMLInputElement>('input[data-unit="us"]')!.checked).toBe(true);
    expect(after.querySelector('[data-wickstone="headline"]')?.textContent).toBe(headline);
    expect(after.querySelector('[data-wickstone="stale"]')).not.toBeNull();
    expect([...after.querySelectorAll('[data-field]')].map((f) => f.getAttribute('data-field'))).toEqual(
      fields,
    );
    // The same elements, classes and text: what the App renders is what the first view showed.
    expect(outline(after)).toEqual(markup);
    expect(shadow.activeElement).toBe(diameter(after));
    expect(diameter(after).selectionStart).toBe(2);
    expect(diameter(after).selectionEnd).toBe(4);
    // And it is the App now: typing and working out go through it.
    type(diameter(after), '0.04');
    submit(after);
    await vi.waitFor(() => expect(after.querySelector('[data-wickstone="stale"]')).toBeNull());
    expect(diameter(after).value).toBe('0.04');
  });
});

/** Every element under `root` with its classes, the attributes tests and styles key on, and its own text. */
function outline(root: Element): string[] {
  return [...root.querySelectorAll('*')].map((e) => {
    const attrs = [
      'class',
      'data-field',
      'data-input',
      'data-output',
      'data-warning',
      'aria-describedby',
      'style',
    ]
      .map((a) => (e.hasAttribute(a) ? `${a}=${e.getAttribute(a)}` : ''))
      .filter(Boolean)
      .join(' ');
    const text = [...e.childNodes]
      .filter((n) => n.nodeType === 3)
      .map((n) => n.textContent)
      .join('');
    return `${e.localName} ${attrs} ${text}`;
  });
}

/** The calculator's own defaults, canonical, as the form sends them for water. */
function calculatorDefaults(): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const i of calculator.inputs)
    if (i.appliesWhen === undefined || i.appliesWhen.every((c) => c.values.includes('water')))
      out[i.id] = i.default;
  return out;
}
