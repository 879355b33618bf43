import type { CalculatorCore, InputDefinition, TableRow } from '@wickstone/calc-core';
import type { EmbedWidget, InputMode } from '@wickstone/contracts';

type InputSettings = EmbedWidget['settings']['inputs'];

/** How the widget treats one calculator input: its mode and the canonical value it starts from. */
export interface ResolvedInput {
  readonly def: InputDefinition;
  readonly mode: InputMode;
  /** Canonical number (SI, degrees, °C), a choice value or a table's rows: the firm's default if usable, else the calculator's. */
  readonly initial: number | string | readonly TableRow[];
  /** The firm's default could not be used (wrong type or not an option) and the calculator's was taken. */
  readonly defaultRejected: boolean;
  /** For a choice the firm limited: the options it offers. Absent: every option. */
  readonly allowed?: readonly string[];
}

const MODES: readonly InputMode[] = ['editable', 'locked', 'hidden'];

/**
 * Applies a widget's input settings to a calculator's inputs, in the calculator's order.
 * A setting for an input the calculator does not have is ignored (the calculator may have been
 * changed under a saved widget); an unknown mode counts as editable, so nothing is hidden by mistake.
 * A firm's numeric default is used as set, even outside the input's range: calc-core then names the
 * problem, which is better than silently using another number than the firm chose.
 */
export function resolveInputSettings(def: CalculatorCore, settings: InputSettings): ResolvedInput[] {
  return def.inputs.map((input) => {
    const s = Object.hasOwn(settings, input.id) ? settings[input.id] : undefined;
    const mode: InputMode = s !== undefined && MODES.includes(s.mode) ? s.mode : 'editable';
    const wanted = s?.default;
    let initial: ResolvedInput['initial'] = input.default;
    let defaultRejected = false;
    if (wanted !== undefined) {
      const usable =
        input.kind === 'choice'
          ? typeof wanted === 'string' && input.options.some((o) => o.value === wanted)
          : input.kind === 'table'
            ? // calc-core names any bad row on Calculate; the firm's rows are used as set, like its numbers.
              Array.isArray(wanted)
            : typeof wanted === 'number' && Number.isFinite(wanted);
      if (usable) initial = wanted as ResolvedInput['initial'];
      else defaultRejected = true;
    }
    const allowed = input.kind === 'choice' ? s?.options : undefined;
    return { def: input, mode, initial, defaultRejected, ...(allowed !== undefined ? { allowed } : {}) };
  });
}
