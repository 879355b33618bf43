import { leadFieldIds, leadFieldModes, type LeadFieldId, type LeadFieldMode } from '@wickstone/contracts';
import { checkEmail, errorsUnder, lines, type WidgetDraft } from '../lib/widget-draft';
import { FieldProblem, TextAreaField } from './form';
import { CheckField, EditorSection, smallControlClass, type SectionProps } from './widget-fields';

const fieldLabel: Record<LeadFieldId, string> = {
  name: 'Name',
  email: 'E-mail address',
  company: 'Company',
  phone: 'Phone',
  message: 'Message',
  siteAddress: 'Site address',
};

const modeLabel: Record<LeadFieldMode, string> = {
  off: 'Not asked',
  optional: 'Optional',
  required: 'Required',
};

type LeadForm = WidgetDraft['settings']['leadForm'];

function setLeadForm(draft: WidgetDraft, change: Partial<LeadForm>): WidgetDraft {
  return {
    ...draft,
    settings: { ...draft.settings, leadForm: { ...draft.settings.leadForm, ...change } },
  };
}

export function LeadFormSection({ draft, onChange, errors, readOnly }: SectionProps) {
  const form = draft.settings.leadForm;
  const notify = lines(draft.notifyText);
  // Each address is checked as it is typed; the save's own errors (too many, the server's) join them.
  const notifyProblems = [
    ...notify.flatMap((line, i) => {
      const problem = checkEmail(line);
      return problem ? [`Line ${i + 1} (${line}): ${problem}`] : [];
    }),
    ...errorsUnder(errors, 'settings.leadForm.notify').flatMap(([k, m]) => {
      const line = /\.(\d+)$/.exec(k)?.[1];
      if (line === undefined) return [m];
      // A line the live check already names is not named twice.
      return checkEmail(notify[Number(line)] ?? '') === null ? [`Line ${Number(line) + 1}: ${m}`] : [];
    }),
  ];
  const fieldsOff = !form.enabled || readOnly;
  return (
    <EditorSection
      id="widget-lead-form"
      title="Request form"
      lead="After a result, visitors can ask the firm for a site assessment and have the result e-mailed to them."
    >
      <CheckField
        label="Offer the request form after a result"
        detail="Off: the widget shows results only."
        checked={form.enabled}
        disabled={readOnly}
        onChange={(enabled) => onChange((d) => setLeadForm(d, { enabled }))}
      />
      <fieldset className="space-y-2" disabled={fieldsOff}>
        <legend className="mb-2 text-sm font-semibold">What the form asks for</legend>
        <div className="grid gap-x-4 gap-y-2 sm:grid-cols-2">
          {leadFieldIds.map((id) => (
            <div
              key={id}
              className="flex items-center justify-between gap-3 rounded-md border border-line px-3 py-2"
            >
              <label
                htmlFor={`lead-field-${id}`}
                className={`text-sm font-semibold ${form.enabled ? '' : 'text-ink-soft'}`}
              >
                {fieldLabel[id]}
              </label>
              <select
                id={`lead-field-${id}`}
                value={form.fields[id]}
                onChange={(e) => {
                  const mode = e.target.value as LeadFieldMode;
                  onChange((d) => setLeadForm(d, { fields: { ...d.settings.leadForm.fields, [id]: mode } }));
                }}
                className={smallControlClass}
              >
                {leadFieldModes.map((m) => (
                  <option key={m} value={m}>
                    {modeLabel[m]}
                  </option>
                ))}
              </select>
            </div>
          ))}
        </div>
        <p className="text-xs text-ink-soft">
          A visitor who asks for a copy of the result must give an e-mail address, whatever is chosen here.
        </p>
        <FieldProblem
          id="lead-fields-error"
          message={errorsUnder(errors, 'settings.leadForm.fields')[0]?.[1]}
        />
      </fieldset>
      <TextAreaField
        label="Consent wording"
        rows={3}
        value={form.consentText}
        disabled={fieldsOff}
        error={errors['settings.leadForm.consentText']}
        hint="Shown beside the box the visitor must tick before sending. 10 to 600 characters."
        onChange={(e) => {
          const consentText = e.target.value;
          onChange((d) => setLeadForm(d, { consentText }));
        }}
      />
      <TextAreaField
        label="Who in the firm is told of each request"
        rows={3}
        value={draft.notifyText}
        disabled={readOnly}
        spellCheck={false}
        autoComplete="off"
        placeholder={readOnly ? undefined : 'surveys@brackenridge-ground.example'}
        error={notifyProblems.length ? notifyProblems.join('; ') : undefined}
        hint={`One e-mail address a line, up to 10.${notify.length === 0 ? ' With none, the owners and admins are told.' : ''}`}
        onChange={(e) => {
          const notifyText = e.target.value;
          onChange((d) => ({ ...d, notifyText }));
        }}
      />
    </EditorSection>
  );
}
