import type { EmbedWidget } from '@wickstone/contracts';
import { useEffect, useRef, useState } from 'preact/hooks';
import { askedFields, buildLeadBody, validateLead, type LeadDraft } from '../lib/lead.js';
import { errorMessage, fieldErrors, request, type Reply } from '../lib/transport.js';

type LeadForm = EmbedWidget['settings']['leadForm'];

export interface LeadTarget {
  readonly runId: string;
  /** Resolves once the run's report is stored (true) or known lost (false). */
  readonly stored: Promise<boolean>;
}

interface LeadFormProps {
  readonly form: LeadForm;
  readonly publicKey: string;
  /** null in preview: nothing is sent. */
  readonly apiBase: string | null;
  readonly target: LeadTarget | null;
}

type Status = 'idle' | 'sending' | 'sent' | 'failed';

// A visitor is waiting on the button: shorter waits than a background run report.
const LEAD_RETRY_DELAYS_MS = [1000, 2000, 4000];

/** What to tell the visitor when the API refused or never answered, by status. */
function problemFor(reply: Reply): string {
  if (reply.status === 0)
    return 'The request could not be sent: the connection failed. Check it and try again.';
  if (reply.status === 429)
    return 'Too many requests have come from here. Please wait a while and try again.';
  if (reply.status === 403 || reply.status === 404)
    return 'The firm is not taking requests through this page at the moment.';
  if (reply.status >= 500)
    return 'The firm’s server could not take the request just now. Please try again shortly.';
  return 'The request could not be sent. Check the fields marked and try again.';
}

/** The request for a site assessment, offered after a result. */
export function LeadForm({ form, publicKey, apiBase, target }: LeadFormProps) {
  const preview = apiBase === null;
  const [draft, setDraft] = useState<LeadDraft>({ values: {}, consent: false, sendCopy: false });
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [status, setStatus] = useState<Status>('idle');
  const [problem, setProblem] = useState<string | null>(null);
  const [copySent, setCopySent] = useState(false);
  const formRef = useRef<HTMLFormElement>(null);
  const doneRef = useRef<HTMLDivElement>(null);
  const fields = askedFields(form.fields);
  const emailAsked = fields.some((f) => f.spec.id === 'email');
  const runId = target?.runId ?? null;

  // A new result is a new request: the form opens again, keeping what the visitor typed.
  useEffect(() => {
    setStatus('idle');
    setProblem(null);
  }, [runId]);
  useEffect(() => {
    if (status === 'sent') doneRef.current?.focus();
  }, [status]);

  const focusFirst = (found: Record<string, string>): void => {
    const first = [...fields.map((f) => f.spec.id), 'consent'].find((id) => found[id] !== undefined);
    if (first) formRef.current?.querySelector<HTMLElement>(`[data-lead-field="${first}"]`)?.focus();
  };

  const submit = async (e: Event): Promise<void> => {
    e.preventDefault();
    if (preview || target === null || status === 'sending') return;
    const found = validateLead(draft, form.fields);
    setErrors(found);
    setProblem(null);
    if (Object.keys(found).length > 0) {
      focusFirst(found);
      return;
    }
    setStatus('sending');
    // The lead names its run: the server must have stored that run first.
    if (!(await target.stored)) {
      setStatus('failed');
      setProblem(
        'This result could not be recorded, so the request cannot refer to it. Work it out again, then send the request.',
      );
      return;
    }
    const body = buildLeadBody({ runId: target.runId, publicKey, draft, modes: form.fields });
    const reply = await request(`${apiBase}/api/v1/embed/leads`, body, { delays: LEAD_RETRY_DELAYS_MS });
    // 409: this run already has a request, which is what a retried send that got through looks like.
    if ((reply.status >= 200 && reply.status < 300) || reply.status === 409) {
      setCopySent(body.sendCopy);
      setStatus('sent');
      return;
    }
    const server = fieldErrors(reply.body, 'body.fields.');
    const mapped: Record<string, string> = {};
    for (const [key, message] of Object.entries(server))
      mapped[key === 'body.consent' ? 'consent' : key] = message;
    setErrors(mapped);
    setStatus('failed');
    const marked = Object.keys(mapped).some((k) => k === 'consent' || fields.some((f) => f.spec.id === k));
    // A refusal that names no field on the form (say, the run id) is explained in the server's words.
    setProblem(
      reply.status === 400 && !marked ? (errorMessage(reply.body) ?? problemFor(reply)) : problemFor(reply),
    );
    focusFirst(mapped);
  };

  const set = (patch: Partial<LeadDraft>): void => setDraft((d) => ({ ...d, ...patch }));

  if (status === 'sent') {
    return (
      <section class="lead" data-wickstone="lead-form" aria-labelledby="wk-lead-title">
        <h3 class="section-title" id="wk-lead-title">
          Ask for a site assessment
        </h3>
        <div class="done" data-wickstone="lead-confirmation" tabIndex={-1} ref={doneRef} role="status">
          <strong>Thank you: your request has reached the firm.</strong>
          <p>They have this result with your details and will be in touch.</p>
          {copySent && <p>A copy of the result is on its way to {draft.values.email?.trim()}.</p>}
        </div>
      </section>
    );
  }

  const err = (id: string) =>
    errors[id] ? (
      <p
        class={id === 'consent' ? 'error check-error' : 'error'}
        id={`wk-lead-${id}-error`}
        data-lead-error={id}
      >
        {errors[id]}
      </p>
    ) : null;
  const described = (id: string): string | undefined => (errors[id] ? `wk-lead-${id}-error` : undefined);

  return (
    <section class="lead" data-wickstone="lead-form" data-state={status} aria-labelledby="wk-lead-title">
      <h3 class="section-title" id="wk-lead-title">
        Ask for a site assessment
      </h3>
      <p class="lead-intro">Send this result to the firm with your details and they will contact you.</p>
      {preview && (
        <p class="preview-note" data-wickstone="preview-note">
          Preview: this form is shown as visitors will see it, but nothing is sent from here.
        </p>
      )}
      <form ref={formRef} noValidate onSubmit={(e) => void submit(e)}>
        <fieldset disabled={preview}>
          <legend class="sr">Your details</legend>
          <div class="grid">
            {fields.map(({ spec, mode }) => {
              const id = `wk-lead-${spec.id}`;
              const common = {
                id,
                name: spec.id,
                'data-lead-field': spec.id,
                autoComplete: spec.autocomplete,
                maxLength: spec.max,
                required: mode === 'required',
                'aria-required': mode === 'required' ? ('true' as const) : undefined,
                'aria-invalid': errors[spec.id] ? ('true' as const) : undefined,
                'aria-describedby': described(spec.id),
                value: draft.values[spec.id] ?? '',
                onInput: (ev: { currentTarget: { value: string } }) =>
                  set({ values: { ...draft.values, [spec.id]: ev.currentTarget.value } }),
              };
              return (
                <div
                  class={`field${spec.type === 'textarea' ? ' wide' : ''}${errors[spec.id] ? ' invalid' : ''}`}
                  key={spec.id}
                >
                  <label class="label" for={id}>
                    {spec.label}
                    {mode === 'optional' && <span class="optional"> (optional)</span>}
                  </label>
                  <div class="box">
                    {spec.type === 'textarea' ? (
                      <textarea rows={3} {...common} />
                    ) : spec.type === 'email' ? (
                      <input type="email" {...common} />
                    ) : spec.type === 'tel' ? (
                      <input type="tel" {...common} />
                    ) : (
                      <input type="text" {...common} />
                    )}
                  </div>
                  {err(spec.id)}
                </div>
              );
            })}
          </div>
          <div class="checks">
            <label class="check">
              <input
                type="checkbox"
                data-lead-field="consent"
                checked={draft.consent}
                aria-required="true"
                aria-invalid={errors.consent ? 'true' : undefined}
                aria-describedby={described('consent')}
                onChange={(ev) => set({ consent: ev.currentTarget.checked })}
              />
              <span>{form.consentText}</span>
            </label>
            {err('consent')}
            {emailAsked && (
              <label class="check">
                <input
                  type="checkbox"
                  data-lead-field="sendCopy"
                  checked={draft.sendCopy}
                  onChange={(ev) => set({ sendCopy: ev.currentTarget.checked })}
                />
                <span>Send me a copy of this result by e-mail</span>
              </label>
            )}
          </div>
          <div class="actions">
            <button class="btn" type="submit" data-wickstone="lead-submit" disabled={status === 'sending'}>
              {status === 'sending' ? 'Sending…' : 'Send request'}
            </button>
          </div>
        </fieldset>
      </form>
      <div aria-live="polite" data-wickstone="lead-status">
        {problem && (
          <p class="form-error" data-wickstone="lead-error">
            {problem}
          </p>
        )}
      </div>
    </section>
  );
}
