import { useId, type ReactNode } from 'react';

/** The frame of a signed-out page: its heading and lead, the content, and a line of ways out below. */
export function AuthPage({
  title,
  lead,
  eyebrow,
  footer,
  children,
}: {
  title: string;
  lead?: ReactNode;
  eyebrow?: string;
  footer?: ReactNode;
  children?: ReactNode;
}) {
  const id = useId();
  return (
    <section aria-labelledby={id} className="space-y-6">
      <div className="space-y-1">
        {eyebrow ? (
          <p className="text-sm font-semibold tracking-wider text-brand uppercase">{eyebrow}</p>
        ) : null}
        <h1 id={id} className="text-2xl font-bold tracking-tight">
          {title}
        </h1>
        {lead ? <div className="text-ink-soft">{lead}</div> : null}
      </div>
      {children}
      {footer ? <p className="border-t border-line pt-5 text-sm text-ink-soft">{footer}</p> : null}
    </section>
  );
}
