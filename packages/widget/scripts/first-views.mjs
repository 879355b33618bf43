// Renders every calculator's first view from a release's own chunks (runtime and engine, as a
// browser runs them) in happy-dom, and records the markup after each step a visitor takes: the
// view as it opens, "Work it out" on the defaults, then seeded random choices and numbers (some
// outside each input's range, some unreadable), each worked out and then shown in the other unit
// system. Two builds that render the same record alike have printed the same figures, units,
// headlines, range messages and converted defaults. Used by `src/lib/unit-registry.test.ts` (a
// release with each engine's units against one with calc-core's whole table) and by
// `dev/compare-first-views.mjs` (any two releases, e.g. before and after a change).
import { calculators, displayUnitOf, formatInput, fromCanonical } from '@wickstone/calc-core';
import { defaultWidgetSettings } from '@wickstone/contracts';
import fc from 'fast-check';
import { Window } from 'happy-dom';

/** Seeded uniform draws in [0, 1) (fast-check's generator), so both builds get the very same inputs. */
function random(seed) {
  const draws = fc.sample(fc.noBias(fc.integer({ min: 0, max: 2 ** 32 - 1 })), { numRuns: 4000, seed });
  let i = 0;
  return () => draws[i++ % draws.length] / 2 ** 32;
}

function widget(calculatorId, system) {
  const s = defaultWidgetSettings();
  return {
    publicKey: 'wk_abcdefghij0123456789',
    name: 'Unit check',
    calculatorId,
    release: '0.0.0',
    settings: { ...s, inputs: {}, units: { system, visitorMaySwitch: true } },
  };
}

/**
 * What a visitor types into a quantity box: a value within the input's range (spread over its
 * decades when it spans more than two), written in the box's unit by calc-core in this process (the
 * same text for both builds); with `mistakes`, sometimes one beyond the range or not a number.
 */
function typedText(def, system, next, mistakes) {
  const roll = mistakes ? next() : 1;
  if (roll < 0.1) return 'abc';
  const { min, max } = def;
  let value;
  if (roll < 0.4)
    value =
      next() < 0.5 ? min - Math.abs(min || 1) * (0.1 + next()) : max + Math.abs(max || 1) * (0.1 + next());
  else if (min > 0 && max / min > 100) value = min * (max / min) ** next();
  else value = min + (max - min) * next();
  return formatInput(fromCanonical(value, displayUnitOf(def, system)));
}

/**
 * @param {{ files: (calculatorId: string) => string[], read: (file: string) => string }} release
 *   `files`: the chunks of a calculator's first flight in load order (runtime first, engine last);
 *   `read`: a chunk's code
 * @param {{ samples?: number, seed?: number, only?: string[] }} options
 * @returns {{ records: [string, string][], errors: string[] }} each step's label and the view's
 *   markup; `errors`: what the widget reported on the console (a failed calculation)
 */
export function firstViews(release, { samples = 12, seed = 14, only } = {}) {
  const records = [];
  const errors = [];
  for (const calc of calculators.filter((c) => only === undefined || only.includes(c.id))) {
    const window = new Window({ url: 'https://widget.example/' });
    const document = window.document;
    window.console.error = (...args) => errors.push(`${calc.id}: ${args.map(String).join(' ')}`);
    const factories = {};
    window.Wickstone = { _d: (key, factory) => void (factories[key.slice(key.indexOf('/') + 1)] = factory) };
    const files = release.files(calc.id);
    for (const file of files) window.eval(release.read(file));
    const loaded = {};
    const run = (file) => (file in loaded ? loaded[file] : (loaded[file] = factories[file](run)));
    const engine = run(files[files.length - 1]);
    const next = random(seed + calc.id.length);
    for (const system of ['si', 'us']) {
      const other = system === 'si' ? 'us' : 'si';
      const element = document.createElement('div');
      document.body.append(element);
      const bundle = {
        calculator: engine.calculator,
        compute: engine.compute,
        releaseBase: null,
        defaultApiBase: null,
        texts: null,
        extras: null,
        tables: null,
        app: null,
      };
      const handle = engine.mountFirst(bundle, element, { widget: widget(calc.id, system), preview: true });
      const view = () =>
        element
          .querySelector('[data-wickstone="host"]')
          .shadowRoot.querySelector('div[data-wickstone="mount"]');
      const record = (label) => records.push([`${calc.id} ${system} ${label}`, view().innerHTML]);
      const submit = () =>
        view()
          .querySelector('form')
          .dispatchEvent(new window.Event('submit', { bubbles: true, cancelable: true }));
      const switchTo = (to) => {
        const radio = view().querySelector(`input[data-unit="${to}"]`);
        radio.checked = true;
        radio.dispatchEvent(new window.Event('change', { bubbles: true }));
      };
      record('opened');
      submit();
      record('defaults');
      switchTo(other);
      record(`defaults in ${other}`);
      switchTo(system);
      for (let n = 0; n < samples; n++) {
        // One sample in three has mistakes in it (the messages name the ranges in units).
        const mistakes = n % 3 === 2;
        for (const select of view().querySelectorAll('select[data-input]')) {
          const options = [...select.querySelectorAll('option')];
          select.value = options[Math.floor(next() * options.length)].value;
          select.dispatchEvent(new window.Event('change', { bubbles: true }));
        }
        for (const box of view().querySelectorAll('input[data-input]')) {
          const def = calc.inputs.find((i) => i.id === box.getAttribute('data-input'));
          if (def === undefined || def.kind === 'choice' || def.kind === 'table' || box.readOnly) continue;
          box.value = typedText(def, system, next, mistakes);
          box.dispatchEvent(new window.Event('input', { bubbles: true }));
        }
        submit();
        record(`sample ${n}`);
        switchTo(other);
        record(`sample ${n} in ${other}`);
        switchTo(system);
      }
      handle.unmount();
    }
    window.happyDOM.abort();
    window.close();
  }
  return { records, errors };
}

/** Compares two runs of `firstViews`: how many steps were compared and the first that differ. */
export function compareViews(a, b) {
  const differ = [];
  const count = Math.max(a.records.length, b.records.length);
  for (let i = 0; i < count; i++) {
    const [label, html] = a.records[i] ?? ['(missing)', ''];
    const [labelB, htmlB] = b.records[i] ?? ['(missing)', ''];
    if (label !== labelB || html !== htmlB)
      differ.push({ label: label === labelB ? label : `${label} / ${labelB}`, a: html, b: htmlB });
  }
  return { compared: count, differ };
}
