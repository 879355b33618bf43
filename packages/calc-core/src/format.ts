// How a number is shown to, and read from, a person: shared by the widget, the dashboard and the
// server's e-mails so a figure reads the same everywhere. Pure: no DOM, no locale lookups.

const SUPERSCRIPT = '⁰¹²³⁴⁵⁶⁷⁸⁹';

/**
 * A result figure for a person: `digits` significant figures, a true minus sign, powers of ten
 * outside 0.001–999 999 (written ×10ⁿ, as the working is), grouping never (a thin space reads as
 * two numbers in a narrow column).
 */
export function formatValue(value: number, digits = 4): string {
  if (!Number.isFinite(value)) return String(value);
  if (value === 0) return '0';
  const abs = Math.abs(value);
  const sign = value < 0 ? '−' : '';
  if (abs >= 1e-3 && abs < 1e6) return sign + String(Number(abs.toPrecision(digits)));
  const [mantissa = '', exponent = ''] = abs.toExponential(digits - 1).split('e');
  const power = Number(exponent);
  const sup = [...String(Math.abs(power))].map((c) => SUPERSCRIPT[Number(c)] ?? c).join('');
  return `${sign}${String(Number(mantissa))}×10${power < 0 ? '⁻' : ''}${sup}`;
}

/**
 * A number put into an input box: plain digits a person can edit (no ×10ⁿ, no unicode minus),
 * six significant figures so a converted default such as 1 mm → 0.0393701 in stays readable.
 */
export function formatInput(value: number): string {
  if (!Number.isFinite(value)) return '';
  const rounded = Number(value.toPrecision(6));
  const text = String(rounded);
  if (!/e/i.test(text)) return text;
  // Very small or large values: print without an exponent while that stays short enough to edit.
  const abs = Math.abs(rounded);
  if (abs >= 1e-9 && abs < 1e-6)
    return rounded.toFixed(5 - Math.floor(Math.log10(abs))).replace(/\.?0+$/, '');
  return text;
}

/**
 * What a person typed, as a number: trims, accepts one comma as the decimal mark when there is no
 * point (many visitors write 0,5), and a leading unicode minus. Empty → null; anything else
 * unreadable → NaN, which calc-core reports as "must be a number".
 */
export function parseNumber(text: string): number | null {
  let t = text.trim().replace(/^[−–]/, '-');
  if (t === '') return null;
  if (!t.includes('.') && /^-?\d*,\d+$/.test(t)) t = t.replace(',', '.');
  if (!/^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i.test(t)) return Number.NaN;
  return Number(t);
}
