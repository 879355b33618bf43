import {
  useId,
  useState,
  type InputHTMLAttributes,
  type ReactNode,
  type SelectHTMLAttributes,
  type TextareaHTMLAttributes,
} from 'react';
import type { SchemaForm } from '../lib/form';
import { Button, Card } from './ui';

/** Every full-width text control: sign-in and account forms, the widget editor. */
export const controlClass =
  'block w-full rounded-md border border-line-strong bg-card px-3 py-2 text-ink placeholder:text-ink-faint ' +
  'aria-invalid:border-bad aria-invalid:bg-bad-tint/40 disabled:bg-paper disabled:text-ink-soft';

interface FieldFrameProps {
  label: string;
  error?: string | undefined;
  hint?: ReactNode;
  children: (ids: { id: string; describedBy: string | undefined; invalid: boolean }) => ReactNode;
}

/** Label, control, hint and the field's own message, wired together for assistive technology. */
function FieldFrame({ label, error, hint, children }: FieldFrameProps) {
  const id = useId();
  const hintId = hint ? `${id}-hint` : undefined;
  const errorId = error ? `${id}-error` : undefined;
  const describedBy = [errorId, hintId].filter(Boolean).join(' ') || undefined;
  return (
    <div className="space-y-1.5">
      <label htmlFor={id} className="block text-sm font-semibold">
        {label}
      </label>
      {children({ id, describedBy, invalid: Boolean(error) })}
      {errorId ? <FieldProblem id={errorId} message={error} /> : null}
      {hint ? (
        <div id={hintId} className="text-sm text-ink-soft">
          {hint}
        </div>
      ) : null}
    </div>
  );
}

/** A field's own problem, beside it, referenced by the control's aria-describedby. */
export function FieldProblem({ id, message }: { id: string; message: string | undefined }) {
  if (!message) return null;
  return (
    <p id={id} className="flex items-start gap-1.5 text-sm font-semibold text-bad">
      <span aria-hidden="true">!</span>
      <span>{message}</span>
    </p>
  );
}

interface TextFieldProps extends Omit<InputHTMLAttributes<HTMLInputElement>, 'id'> {
  label: string;
  name: string;
  error?: string | undefined;
  hint?: ReactNode;
}

export function TextField({ label, error, hint, ...input }: TextFieldProps) {
  return (
    <FieldFrame label={label} error={error} hint={hint}>
      {({ id, describedBy, invalid }) => (
        <input
          id={id}
          aria-describedby={describedBy}
          aria-invalid={invalid || undefined}
          className={controlClass}
          {...input}
        />
      )}
    </FieldFrame>
  );
}

export function TextAreaField({
  label,
  error,
  hint,
  ...area
}: Omit<TextareaHTMLAttributes<HTMLTextAreaElement>, 'id'> & {
  label: string;
  error?: string | undefined;
  hint?: ReactNode;
}) {
  return (
    <FieldFrame label={label} error={error} hint={hint}>
      {({ id, describedBy, invalid }) => (
        <textarea
          id={id}
          aria-invalid={invalid || undefined}
          aria-describedby={describedBy}
          className={controlClass}
          {...area}
        />
      )}
    </FieldFrame>
  );
}

/** A password input with a button that shows what was typed, in place of a second "repeat" box. */
export function PasswordField({ label, error, hint, ...input }: Omit<TextFieldProps, 'type'>) {
  const [shown, setShown] = useState(false);
  return (
    <FieldFrame label={label} error={error} hint={hint}>
      {({ id, describedBy, invalid }) => (
        <div className="flex gap-2">
          <input
            id={id}
            type={shown ? 'text' : 'password'}
            aria-describedby={describedBy}
            aria-invalid={invalid || undefined}
            className={controlClass}
            spellCheck={false}
            autoCapitalize="off"
            {...input}
          />
          <Button
            size="sm"
            className="shrink-0"
            aria-pressed={shown}
            aria-controls={id}
            onClick={() => setShown((s) => !s)}
          >
            {shown ? 'Hide' : 'Show'}
            <span className="sr-only"> password</span>
          </Button>
        </div>
      )}
    </FieldFrame>
  );
}

interface SelectFieldProps extends Omit<SelectHTMLAttributes<HTMLSelectElement>, 'id'> {
  label: string;
  name: string;
  error?: string | undefined;
  hint?: ReactNode;
  options: readonly { value: string; label: string }[];
}

export function SelectField({ label, error, hint, options, ...select }: SelectFieldProps) {
  return (
    <FieldFrame label={label} error={error} hint={hint}>
      {({ id, describedBy, invalid }) => (
        <select
          id={id}
          aria-describedby={describedBy}
          aria-invalid={invalid || undefined}
          className={controlClass}
          {...select}
        >
          {options.map((o) => (
            <option key={o.value} value={o.value}>
              {o.label}
            </option>
          ))}
        </select>
      )}
    </FieldFrame>
  );
}

/** The form-level message: announced when it appears, since focus stays where it was. */
export function FormError({ message, className = '' }: { message: string | null; className?: string }) {
  return (
    <div role="alert" className={`empty:hidden ${className}`}>
      {message ? (
        <p className="rounded-md border border-bad/40 bg-bad-tint px-4 py-3 text-sm font-semibold text-bad">
          {message}
        </p>
      ) : null}
    </div>
  );
}

/** The `<form>` of a schema-checked form: not the browser's own validation, the form-level message first. */
export function SchemaFormView({
  form,
  className = 'space-y-4',
  labelledBy,
  errorClassName,
  children,
}: {
  form: SchemaForm;
  className?: string;
  labelledBy?: string;
  /** Where the form-level message sits in a grid form. */
  errorClassName?: string;
  children: ReactNode;
}) {
  const { formRef, onSubmit, formError } = form;
  return (
    <form ref={formRef} onSubmit={onSubmit} noValidate aria-labelledby={labelledBy} className={className}>
      <FormError message={formError} className={errorClassName} />
      {children}
    </form>
  );
}

/** A titled card around one form (account settings, the invite form). */
export function FormCard({
  title,
  lead,
  form,
  formClassName = 'mt-4 space-y-4',
  errorClassName,
  children,
}: {
  title: string;
  lead: ReactNode;
  form: SchemaForm;
  formClassName?: string;
  errorClassName?: string;
  children: ReactNode;
}) {
  const id = useId();
  return (
    <Card className="p-5">
      <h2 id={id} className="text-lg font-bold tracking-tight">
        {title}
      </h2>
      <p className="mt-1 text-sm text-ink-soft">{lead}</p>
      <SchemaFormView form={form} labelledBy={id} className={formClassName} errorClassName={errorClassName}>
        {children}
      </SchemaFormView>
    </Card>
  );
}

/** A password being chosen: the browser may suggest one, and the rules are said up front. */
export function NewPasswordField(props: Omit<TextFieldProps, 'type' | 'autoComplete' | 'hint'>) {
  return (
    <PasswordField
      autoComplete="new-password"
      hint="At least 8 characters. Very common passwords are refused."
      {...props}
    />
  );
}
