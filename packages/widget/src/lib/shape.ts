import type { EmbedWidget } from '@wickstone/contracts';

const isObject = (v: unknown): v is Record<string, unknown> =>
  typeof v === 'object' && v !== null && !Array.isArray(v);
const isString = (v: unknown): v is string => typeof v === 'string';

/**
 * Whether an API answer has the shape of `embedWidgetSchema`, checked by hand: the schema's zod
 * would multiply the bundle's size, and the server already validated what it stored. This only
 * keeps a malformed answer from breaking the host page; it does not re-check values. The runtime
 * checks (`mountFirst`), not the loader: shared by every widget on a page, and compressed better there.
 */
export function isEmbedWidget(v: unknown): v is EmbedWidget {
  if (
    !isObject(v) ||
    !isString(v.publicKey) ||
    !isString(v.name) ||
    !isString(v.calculatorId) ||
    !isString(v.release)
  )
    return false;
  const s = v.settings;
  if (!isObject(s) || !isObject(s.inputs) || !isString(s.cautions)) return false;
  const { units, look, leadForm } = s;
  if (
    !isObject(units) ||
    (units.system !== 'si' && units.system !== 'us') ||
    typeof units.visitorMaySwitch !== 'boolean'
  )
    return false;
  if (!isObject(look) || !isObject(look.colors) || !isString(look.font) || !isString(look.corner))
    return false;
  if (look.logoUrl !== null && !isString(look.logoUrl)) return false;
  const c = look.colors;
  if (![c.background, c.text, c.primary, c.primaryText].every(isString)) return false;
  if (
    !isObject(leadForm) ||
    typeof leadForm.enabled !== 'boolean' ||
    !isObject(leadForm.fields) ||
    !isString(leadForm.consentText)
  )
    return false;
  if (!isObject(s.sheet) || typeof s.sheet.enabled !== 'boolean') return false;
  return Object.values(s.inputs).every((i) => isObject(i) && isString(i.mode));
}
