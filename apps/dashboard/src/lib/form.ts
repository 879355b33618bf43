import { useCallback, useRef, useState, type FormEvent } from 'react';
import { ApiError } from './api';

/** The part of a zod schema a form needs, so the dashboard validates with the contracts' own schemas. */
export interface Parser<T> {
  safeParse(
    data: unknown,
  ):
    | { success: true; data: T }
    | { success: false; error: { issues: readonly { path: readonly PropertyKey[]; message: string }[] } };
}

export type FieldErrors = Record<string, string>;

export interface SchemaForm {
  errors: FieldErrors;
  /** A problem that belongs to no one field (wrong password, server down, rate limited). */
  formError: string | null;
  formRef: React.RefObject<HTMLFormElement | null>;
  onSubmit(event: FormEvent<HTMLFormElement>): void;
  /** Show a failed request: `details.fields` land on their fields, the rest above the form. */
  showServerError(error: unknown, messages?: Partial<Record<string, string>>): void;
  reset(): void;
}

/** Empty inputs are left out, so optional fields stay optional and required ones say "Required". */
function formValues(form: HTMLFormElement): Record<string, string> {
  const values: Record<string, string> = {};
  for (const [name, value] of new FormData(form)) {
    if (typeof value === 'string' && value !== '') values[name] = value;
  }
  return values;
}

function focusField(form: HTMLFormElement | null, name: string | undefined) {
  if (!form || !name) return;
  const el = form.elements.namedItem(name);
  if (el instanceof HTMLElement) el.focus();
}

/**
 * A form checked by a schema before anything is sent. `toBody` shapes the raw inputs into the
 * request body (default: the inputs as they are); `onValid` gets the parsed body.
 */
export function useSchemaForm<T>(
  schema: Parser<T>,
  /** Gets the parsed body and the form's own `showServerError`, `formRef` and `reset`, for the request's outcome. */
  onValid: (body: T, form: Pick<SchemaForm, 'showServerError' | 'formRef' | 'reset'>) => void,
  toBody: (values: Record<string, string>) => unknown = (v) => v,
): SchemaForm {
  const formRef = useRef<HTMLFormElement | null>(null);
  const [errors, setErrors] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);

  const reset = useCallback(() => {
    setErrors({});
    setFormError(null);
  }, []);

  const showServerError = useCallback((error: unknown, messages: Partial<Record<string, string>> = {}) => {
    const form = formRef.current;
    if (!(error instanceof ApiError)) {
      setFormError('Something went wrong in the dashboard. Reload the page and try again.');
      return;
    }
    const fields: FieldErrors = {};
    const elsewhere: string[] = [];
    for (const issue of error.fields) {
      const name = issue.field.replace(/^body\./, '');
      const message = messages[name] ?? issue.message;
      if (form?.elements.namedItem(name)) fields[name] ??= message;
      else elsewhere.push(message);
    }
    setErrors(fields);
    if (error.status === 429) {
      const wait = error.retryAfterS
        ? ` Try again in ${Math.max(1, Math.ceil(error.retryAfterS / 60))} min.`
        : '';
      setFormError(`${error.body.message.replace(/([^.!?])$/, '$1.')}${wait}`);
    } else if (elsewhere.length > 0 || Object.keys(fields).length === 0) {
      setFormError(elsewhere.length > 0 ? elsewhere.join(' ') : error.body.message);
    } else {
      setFormError(null);
    }
    focusField(form, Object.keys(fields)[0]);
  }, []);

  const onSubmit = useCallback(
    (event: FormEvent<HTMLFormElement>) => {
      event.preventDefault();
      const form = event.currentTarget;
      const body = toBody(formValues(form));
      const parsed = schema.safeParse(body);
      if (!parsed.success) {
        const given = typeof body === 'object' && body !== null ? (body as Record<string, unknown>) : {};
        const next: FieldErrors = {};
        for (const issue of parsed.error.issues) {
          const key = issue.path.map(String).join('.') || '_form';
          // An empty input was left out of the body: "Required" says more than the schema's type error.
          const top = issue.path[0];
          next[key] ??= top !== undefined && given[String(top)] === undefined ? 'Required' : issue.message;
        }
        const { _form, ...fields } = next;
        setErrors(fields);
        setFormError(_form ?? null);
        focusField(form, Object.keys(fields)[0]);
        return;
      }
      setErrors({});
      setFormError(null);
      onValid(parsed.data, { showServerError, formRef, reset });
    },
    [schema, onValid, toBody, showServerError, reset],
  );

  return { errors, formError, formRef, onSubmit, showServerError, reset };
}

type Issue = { path: readonly PropertyKey[]; message: string };

/**
 * A schema whose optional fields this particular form must fill (e.g. the password form's
 * `currentPassword` and `newPassword` in the one account-update schema).
 */
export function requireFields<T>(
  schema: Parser<T>,
  names: readonly string[],
  message = 'Required',
): Parser<T> {
  return {
    safeParse(data) {
      const values = typeof data === 'object' && data !== null ? (data as Record<string, unknown>) : {};
      const missing: Issue[] = names
        .filter((n) => values[n] === undefined)
        .map((n) => ({ path: [n], message }));
      const result = schema.safeParse(data);
      if (missing.length === 0) return result;
      const others = result.success
        ? []
        : result.error.issues.filter((i) => !names.includes(String(i.path[0])));
      return { success: false, error: { issues: [...missing, ...others] } };
    },
  };
}
