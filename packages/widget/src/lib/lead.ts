import type { EmbedLeadBody, EmbedWidget, LeadFieldId, LeadFieldMode } from '@wickstone/contracts';

type LeadFieldModes = EmbedWidget['settings']['leadForm']['fields'];

/** How each lead field is asked for. Limits mirror `embedLeadBodySchema` (checked here so a visitor hears at once, not after a round trip). */
export interface LeadFieldSpec {
  readonly id: LeadFieldId;
  readonly label: string;
  readonly type: 'text' | 'email' | 'tel' | 'textarea';
  readonly autocomplete: string;
  readonly max: number;
}

export const LEAD_FIELDS: readonly LeadFieldSpec[] = [
  { id: 'name', label: 'Your name', type: 'text', autocomplete: 'name', max: 120 },
  { id: 'email', label: 'E-mail', type: 'email', autocomplete: 'email', max: 254 },
  { id: 'phone', label: 'Phone', type: 'tel', autocomplete: 'tel', max: 32 },
  { id: 'company', label: 'Company', type: 'text', autocomplete: 'organization', max: 160 },
  { id: 'siteAddress', label: 'Site address', type: 'textarea', autocomplete: 'street-address', max: 300 },
  { id: 'message', label: 'What would you like assessed?', type: 'textarea', autocomplete: 'off', max: 2000 },
];

export type LeadValues = Readonly<Partial<Record<LeadFieldId, string>>>;

export interface LeadDraft {
  readonly values: LeadValues;
  readonly consent: boolean;
  readonly sendCopy: boolean;
}

/** The fields a widget asks for, in display order. */
export function askedFields(
  modes: LeadFieldModes,
): { spec: LeadFieldSpec; mode: Exclude<LeadFieldMode, 'off'> }[] {
  return LEAD_FIELDS.flatMap((spec) => {
    const mode = modes[spec.id];
    return mode === 'optional' || mode === 'required' ? [{ spec, mode }] : [];
  });
}

// Deliberately loose: one @, a dot in the domain, no spaces. The server's check is the real one;
// this only catches typing slips before a round trip.
const EMAIL = /^[^\s@]+@[^\s@]+\.[^\s@.]+$/;
const PHONE = /^[+0-9 ()./-]{5,32}$/;

/**
 * Problems with a lead draft, keyed by field id (`consent` for the consent box), worded for the
 * visitor. Empty when the draft may be sent.
 */
export function validateLead(draft: LeadDraft, modes: LeadFieldModes): Record<string, string> {
  const errors: Record<string, string> = {};
  for (const { spec, mode } of askedFields(modes)) {
    const value = (draft.values[spec.id] ?? '').trim();
    if (value === '') {
      if (mode === 'required' || (spec.id === 'email' && draft.sendCopy)) {
        errors[spec.id] =
          spec.id === 'email' && mode !== 'required' ? 'Needed to send you a copy' : 'Required';
      }
      continue;
    }
    if (value.length > spec.max) errors[spec.id] = `At most ${spec.max} characters`;
    else if (spec.id === 'email' && !EMAIL.test(value)) errors[spec.id] = 'Enter a valid e-mail address';
    else if (spec.id === 'phone' && !PHONE.test(value)) errors[spec.id] = 'Enter a phone number';
  }
  if (!draft.consent) errors.consent = 'Tick this box so the firm may contact you';
  return errors;
}

/** The lead request (`embedLeadBodySchema`): only the fields the widget asks for and the visitor filled in, trimmed. */
export function buildLeadBody(args: {
  runId: string;
  publicKey: string;
  draft: LeadDraft;
  modes: LeadFieldModes;
}): EmbedLeadBody {
  const { runId, publicKey, draft, modes } = args;
  const fields: Partial<Record<LeadFieldId, string>> = {};
  for (const { spec } of askedFields(modes)) {
    const value = (draft.values[spec.id] ?? '').trim();
    if (value !== '') fields[spec.id] = value;
  }
  const canCopy = fields.email !== undefined;
  return { runId, publicKey, fields, consent: true, sendCopy: canCopy && draft.sendCopy };
}
