import { isCalcInputError, type RunEngine } from './service.js';

/** One engine's answer for one run's inputs: its outputs and the codes of its warnings. */
export interface Answer {
  outputs: Record<string, number | null>;
  warnings: string[];
}

/**
 * An engine as a preview uses it. Engines from calc-core 0.3.0 on also have `compute`: the same
 * outputs, warnings and band as `calculate`, without the working text and the input hash, which
 * a preview never reads; older published engines have only `calculate`.
 */
export interface AnswerEngine extends RunEngine {
  compute?: (
    calculatorId: string,
    inputs: unknown,
  ) => { outputs: Record<string, number | null>; warnings: readonly { code: string }[] };
}

/** The engine's fastest way to an answer: `compute` when it has one, else `calculate`. */
export function answerer(
  engine: AnswerEngine,
): (calculatorId: string, inputs: unknown) => { outputs: Answer['outputs']; warnings: readonly { code: string }[] } {
  const { compute } = engine;
  if (typeof compute === 'function') return (id, inputs) => compute(id, inputs);
  return (id, inputs) => engine.calculate(id, inputs as Parameters<RunEngine['calculate']>[1]);
}

/**
 * The engine's answers for these input texts, in order; null where it refuses the inputs (a
 * calc-core input error). Each text is parsed here: an engine may keep what it is given.
 */
export function answersOf(engine: AnswerEngine, calculatorId: string, texts: readonly string[]): (Answer | null)[] {
  const run = answerer(engine);
  const out = new Array<Answer | null>(texts.length);
  for (let i = 0; i < texts.length; i++) {
    try {
      const res = run(calculatorId, JSON.parse(texts[i] as string));
      out[i] = { outputs: res.outputs, warnings: res.warnings.map((w) => w.code) };
    } catch (e) {
      if (!isCalcInputError(e)) throw e;
      out[i] = null;
    }
  }
  return out;
}
