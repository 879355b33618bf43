import { useEffect, useRef, useState } from 'preact/hooks';
import { errorMessage, fieldErrors } from '../lib/transport.js';
import type { LeadTarget } from './LeadForm.js';

/** The project block's fields, as the server's sheet schema limits them. */
const FIELDS = [
  { id: 'project', label: 'Project or site reference', max: 120, wide: false },
  { id: 'preparedFor', label: 'Prepared for', max: 120, wide: false },
  { id: 'note', label: 'Your note', max: 500, wide: true },
] as const;
type FieldId = (typeof FIELDS)[number]['id'];

type Status = 'idle' | 'making' | 'done' | 'failed';

/** What to tell the visitor when the sheet could not be made, by status. */
function problemFor(status: number, body: unknown): string {
  if (status === 0) return 'The sheet could not be fetched: the connection failed. Check it and try again.';
  if (status === 429)
    return 'Too many sheets have been asked for from here. Please wait a while and try again.';
  if (status === 403) return 'The firm does not offer calculation sheets on this page.';
  if (status === 404) return 'This result is no longer on record, so there is no sheet for it.';
  if (status >= 500) return 'The firm’s server could not make the sheet just now. Please try again shortly.';
  return errorMessage(body) ?? 'The sheet could not be made. Check the fields marked and try again.';
}

interface SheetBlockProps {
  readonly publicKey: string;
  /** null in preview: nothing is asked for. */
  readonly apiBase: string | null;
  readonly target: LeadTarget | null;
}

/**
 * "Download calculation sheet": the run's PDF record (inputs, every working step with its source,
 * cautions, sign-off boxes and a verification link), made by the firm's server. The visitor may
 * first name the project; the server keeps that block with the run so later copies print it.
 */
export function SheetBlock({ publicKey, apiBase, target }: SheetBlockProps) {
  const preview = apiBase === null;
  const [values, setValues] = useState<Partial<Record<FieldId, string>>>({});
  const [errors, setErrors] = useState<Partial<Record<FieldId, string>>>({});
  const [status, setStatus] = useState<Status>('idle');
  const [problem, setProblem] = useState<string | null>(null);
  const rootRef = useRef<HTMLElement>(null);
  const runId = target?.runId ?? null;

  useEffect(() => {
    setStatus('idle');
    setProblem(null);
  }, [runId]);

  const download = async (e: Event): Promise<void> => {
    e.preventDefault();
    if (preview || target === null || status === 'making') return;
    setStatus('making');
    setProblem(null);
    setErrors({});
    // The sheet is of a stored run: wait for the report's acknowledgement.
    if (!(await target.stored)) {
      setStatus('failed');
      setProblem('This result could not be recorded, so there is no sheet for it yet. Calculate again.');
      return;
    }
    let res: Response;
    try {
      res = await fetch(`${apiBase}/api/v1/embed/runs/${encodeURIComponent(target.runId)}/sheet`, {
        method: 'POST',
        // A CORS-simple request: no preflight round trip (the API reads the JSON from text/plain).
        headers: { 'Content-Type': 'text/plain;charset=UTF-8' },
        body: JSON.stringify({ publicKey, ...values }),
        credentials: 'omit',
        mode: 'cors',
      });
    } catch {
      setStatus('failed');
      setProblem(problemFor(0, null));
      return;
    }
    if (!res.ok) {
      const body: unknown = await res.json().catch(() => null);
      const found = fieldErrors(body, 'body.') as Partial<Record<FieldId, string>>;
      setErrors(found);
      setStatus('failed');
      setProblem(problemFor(res.status, body));
      const first = FIELDS.find((f) => found[f.id] !== undefined);
      if (first) rootRef.current?.querySelector<HTMLElement>(`[data-sheet-field="${first.id}"]`)?.focus();
      return;
    }
    const url = URL.createObjectURL(await res.blob());
    const a = document.createElement('a');
    a.href = url;
    a.download = `calculation-sheet-${target.runId}.pdf`;
    a.hidden = true;
    rootRef.current?.append(a);
    a.click();
    a.remove();
    setTimeout(() => URL.revokeObjectURL(url), 60_000);
    setStatus('done');
  };

  return (
    <section
      class="sheet"
      data-wickstone="sheet"
      data-state={status}
      aria-labelledby="wk-sheet-title"
      ref={rootRef}
    >
      <h3 class="section-title" id="wk-sheet-title">
        Calculation sheet
      </h3>
      <p class="lead-intro">
        A printable record of this result: inputs, every step with its source, cautions and a link anyone can
        use to check it.
      </p>
      <form noValidate onSubmit={(e) => void download(e)}>
        <details class="sheet-project">
          <summary>Name the project on the sheet (optional)</summary>
          <div class="grid">
            {FIELDS.map((f) => {
              const id = `wk-sheet-${f.id}`;
              const common = {
                id,
                name: f.id,
                'data-sheet-field': f.id,
                maxLength: f.max,
                disabled: preview,
                'aria-invalid': errors[f.id] ? ('true' as const) : undefined,
                'aria-describedby': errors[f.id] ? `${id}-error` : undefined,
                value: values[f.id] ?? '',
                onInput: (ev: { currentTarget: { value: string } }) =>
                  setValues((v) => ({ ...v, [f.id]: ev.currentTarget.value })),
              };
              return (
                <div class={`field${f.wide ? ' wide' : ''}${errors[f.id] ? ' invalid' : ''}`} key={f.id}>
                  <label class="label" for={id}>
                    {f.label}
                  </label>
                  <div class="box">
                    {f.wide ? <textarea rows={2} {...common} /> : <input type="text" {...common} />}
                  </div>
                  {errors[f.id] && (
                    <p class="error" id={`${id}-error`}>
                      {errors[f.id]}
                    </p>
                  )}
                </div>
              );
            })}
          </div>
        </details>
        <div class="actions">
          <button
            class="btn btn-quiet"
            type="submit"
            data-wickstone="sheet-download"
            disabled={preview || status === 'making'}
          >
            {status === 'making' ? 'Making the sheet…' : 'Download calculation sheet'}
          </button>
          {preview && <span class="hint">Preview: visitors download the sheet here.</span>}
        </div>
      </form>
      <div aria-live="polite" data-wickstone="sheet-status">
        {status === 'done' && <p class="hint">The sheet has been downloaded (PDF).</p>}
        {problem && (
          <p class="form-error" data-wickstone="sheet-error">
            {problem}
          </p>
        )}
      </div>
    </section>
  );
}
