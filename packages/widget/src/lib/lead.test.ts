import { embedLeadBodySchema } from '@wickstone/contracts';
import { describe, expect, it } from 'vitest';
import { askedFields, buildLeadBody, validateLead, type LeadDraft } from './lead.js';

const modes = {
  name: 'required',
  email: 'optional',
  company: 'off',
  phone: 'optional',
  message: 'optional',
  siteAddress: 'required',
} as const;
const draft = (over: Partial<LeadDraft> = {}): LeadDraft => ({
  values: {},
  consent: true,
  sendCopy: false,
  ...over,
});
const RUN = '0b7f6f52-6c1e-4a57-9a1d-3c2b8f0e4d11';

describe('askedFields', () => {
  it('lists the fields not switched off, in display order', () => {
    expect(askedFields(modes).map((f) => [f.spec.id, f.mode])).toEqual([
      ['name', 'required'],
      ['email', 'optional'],
      ['phone', 'optional'],
      ['siteAddress', 'required'],
      ['message', 'optional'],
    ]);
  });
});

describe('validateLead', () => {
  it('asks for required fields and consent', () => {
    expect(validateLead(draft({ consent: false }), modes)).toEqual({
      name: 'Required',
      siteAddress: 'Required',
      consent: 'Tick this box so the firm may contact you',
    });
    expect(validateLead(draft({ values: { name: '  ', siteAddress: '4 Quarry Lane' } }), modes)).toEqual({
      name: 'Required',
    });
  });

  it('checks e-mail and phone formats and lengths when given', () => {
    const base = { name: 'Imogen Tarrant', siteAddress: '4 Quarry Lane' };
    expect(validateLead(draft({ values: { ...base, email: 'imogen@visitor' } }), modes)).toEqual({
      email: 'Enter a valid e-mail address',
    });
    expect(validateLead(draft({ values: { ...base, phone: 'call me' } }), modes)).toEqual({
      phone: 'Enter a phone number',
    });
    expect(validateLead(draft({ values: { ...base, phone: '+44 (0)1632 960 123' } }), modes)).toEqual({});
    expect(validateLead(draft({ values: { ...base, message: 'x'.repeat(2001) } }), modes)).toEqual({
      message: 'At most 2000 characters',
    });
  });

  it('needs an e-mail address for a copy of the result', () => {
    const values = { name: 'Imogen Tarrant', siteAddress: '4 Quarry Lane' };
    expect(validateLead(draft({ values, sendCopy: true }), modes)).toEqual({
      email: 'Needed to send you a copy',
    });
    expect(
      validateLead(
        draft({ values: { ...values, email: 'imogen.tarrant@visitor.example' }, sendCopy: true }),
        modes,
      ),
    ).toEqual({});
  });

  it('ignores values for fields switched off', () => {
    expect(
      validateLead(draft({ values: { name: 'A', siteAddress: 'B', company: 'x'.repeat(999) } }), modes),
    ).toEqual({});
  });
});

describe('buildLeadBody', () => {
  it('sends only asked-for, filled-in fields, trimmed, in the embed API’s shape', () => {
    const body = buildLeadBody({
      runId: RUN,
      publicKey: 'wk_abcdefghij0123456789',
      modes,
      draft: draft({
        values: {
          name: ' Imogen Tarrant ',
          email: 'imogen.tarrant@visitor.example',
          phone: '',
          company: 'Quarry Cottage Ltd',
          siteAddress: '4 Quarry Lane',
        },
        sendCopy: true,
      }),
    });
    expect(body).toEqual({
      runId: RUN,
      publicKey: 'wk_abcdefghij0123456789',
      fields: {
        name: 'Imogen Tarrant',
        email: 'imogen.tarrant@visitor.example',
        siteAddress: '4 Quarry Lane',
      },
      consent: true,
      sendCopy: true,
    });
    expect(embedLeadBodySchema.parse(body)).toEqual(body);
  });

  it('never asks for a copy without an address', () => {
    const body = buildLeadBody({
      runId: RUN,
      publicKey: 'wk_abcdefghij0123456789',
      modes,
      draft: draft({ values: { name: 'A', siteAddress: 'B' }, sendCopy: true }),
    });
    expect(body.sendCopy).toBe(false);
  });
});
