// How a calculator's core and its texts make the whole calculator: calc-core's registry joins them
// when it is imported, and the widget when the texts chunk arrives after first paint, with this same
// function. It imports types only, so whatever bundles it carries no calculator, formula or text.
import type {
  CalculatorCore,
  CalculatorDefinition,
  CalculatorTexts,
  WarningDefinition,
} from './calculators/types.js';

/**
 * A calculator whole: its core (what computes) and its texts (cautions, references, the working's
 * writer, and the summaries of the warnings the core declares without one). Each of the core's
 * warnings keeps its place and its own summary, or takes the one its texts give.
 * @throws Error naming the calculator and the warning's code when a warning is left without a summary,
 *   when the texts summarise a code the core does not declare, or when they summarise a warning the
 *   core already summarises (a calc-core bug: each summary is written in one place)
 */
export function withTexts(core: CalculatorCore, texts: CalculatorTexts): CalculatorDefinition {
  const { warningSummaries = {}, ...rest } = texts;
  for (const code of Object.keys(warningSummaries)) {
    if (!core.warnings.some((w) => w.code === code))
      throw new Error(`${core.id}: its texts summarise ${code}, a warning its core does not declare`);
  }
  const warnings = core.warnings.map((w): WarningDefinition => {
    const given = Object.hasOwn(warningSummaries, w.code) ? warningSummaries[w.code] : undefined;
    if (w.summary !== undefined && given !== undefined)
      throw new Error(`${core.id}: its texts summarise ${w.code} again, which its core already summarises`);
    if (given !== undefined) return { ...w, summary: given };
    if (w.summary === undefined)
      throw new Error(`${core.id}: ${w.code} has no summary, in its core or its texts`);
    return w;
  });
  return { ...core, ...rest, warnings };
}
