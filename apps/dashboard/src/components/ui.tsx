import type { ButtonHTMLAttributes, ReactNode, Ref } from 'react';
import { Link, type LinkProps } from 'react-router';

type Tone = 'primary' | 'quiet' | 'danger';

const tones: Record<Tone, string> = {
  primary: 'border-brand bg-brand text-card hover:border-brand-strong hover:bg-brand-strong',
  quiet: 'border-line-strong bg-card text-ink hover:bg-paper',
  danger: 'border-bad/50 bg-card text-bad hover:bg-bad-tint',
};

export function buttonClass(tone: Tone = 'quiet', size: 'md' | 'sm' = 'md') {
  return [
    'inline-flex items-center justify-center gap-2 rounded-md border font-semibold transition-colors',
    'disabled:cursor-not-allowed disabled:opacity-60',
    size === 'sm' ? 'px-2.5 py-1 text-sm' : 'px-4 py-2',
    tones[tone],
  ].join(' ');
}

interface ButtonProps extends ButtonHTMLAttributes<HTMLButtonElement> {
  ref?: Ref<HTMLButtonElement>;
  tone?: Tone;
  size?: 'md' | 'sm';
  /** While true the button is disabled and says so to assistive technology. */
  busy?: boolean;
}

export function Button({
  tone = 'quiet',
  size = 'md',
  busy = false,
  className = '',
  disabled,
  children,
  ...rest
}: ButtonProps) {
  return (
    <button
      type="button"
      {...rest}
      disabled={disabled || busy}
      aria-busy={busy || undefined}
      className={`${buttonClass(tone, size)} ${className}`}
    >
      {busy ? <Spinner /> : null}
      {children}
    </button>
  );
}

export function ButtonLink({ tone = 'quiet', className = '', ...rest }: LinkProps & { tone?: Tone }) {
  return <Link {...rest} className={`${buttonClass(tone)} ${className}`} />;
}

export function TextLink({ className = '', ...rest }: LinkProps) {
  return (
    <Link
      {...rest}
      className={`font-semibold text-brand underline decoration-brand/30 underline-offset-4 hover:decoration-brand ${className}`}
    />
  );
}

export function Spinner({ className = '' }: { className?: string }) {
  return (
    <span
      aria-hidden="true"
      className={`inline-block h-4 w-4 shrink-0 animate-spin rounded-full border-2 border-current border-r-transparent ${className}`}
    />
  );
}

export function Card({ children, className = '' }: { children: ReactNode; className?: string }) {
  return <div className={`rounded-lg border border-line bg-card ${className}`}>{children}</div>;
}

export function PageHeader({
  title,
  lead,
  actions,
}: {
  title: string;
  lead?: ReactNode;
  actions?: ReactNode;
}) {
  return (
    <div className="flex flex-wrap items-end justify-between gap-4 border-b border-line pb-5">
      <div className="min-w-0 space-y-1">
        <h1 className="text-2xl font-bold tracking-tight">{title}</h1>
        {lead ? <p className="max-w-2xl text-ink-soft">{lead}</p> : null}
      </div>
      {actions ? <div className="flex flex-wrap gap-2">{actions}</div> : null}
    </div>
  );
}

export type NoticeTone = 'info' | 'ok' | 'warn' | 'bad';

const noticeTones: Record<NoticeTone, string> = {
  info: 'border-brand/30 bg-brand-tint text-brand-strong',
  ok: 'border-ok/40 bg-ok-tint text-ok',
  warn: 'border-warn/40 bg-warn-tint text-warn',
  bad: 'border-bad/40 bg-bad-tint text-bad',
};

/** A boxed message. Give it `role` when it appears as the result of something the person did. */
export function Notice({
  tone = 'info',
  children,
  role,
  className = '',
}: {
  tone?: NoticeTone;
  children: ReactNode;
  role?: 'status' | 'alert';
  className?: string;
}) {
  return (
    <div role={role} className={`rounded-md border px-4 py-3 text-sm ${noticeTones[tone]} ${className}`}>
      {children}
    </div>
  );
}

/**
 * A polite live region that is always in the page, so a message put into it is announced
 * (a region created together with its text often is not).
 */
export function LiveMessage({ message, tone = 'ok' }: { message: string | null; tone?: NoticeTone }) {
  return (
    <div role="status" aria-live="polite" className="empty:hidden">
      {message ? <Notice tone={tone}>{message}</Notice> : null}
    </div>
  );
}

export function Badge({
  children,
  tone = 'neutral',
}: {
  children: ReactNode;
  tone?: 'neutral' | 'brand' | 'warn';
}) {
  const cls = {
    neutral: 'border-line-strong bg-paper text-ink-soft',
    brand: 'border-brand/30 bg-brand-tint text-brand-strong',
    warn: 'border-warn/40 bg-warn-tint text-warn',
  }[tone];
  return (
    <span className={`inline-flex items-center rounded-full border px-2 py-0.5 text-xs font-semibold ${cls}`}>
      {children}
    </span>
  );
}

/** The product mark and name, linking to the start. */
export function BrandLink({
  large = false,
  tone = 'dark',
  nameClassName = '',
}: {
  large?: boolean;
  /** `dark`: on the brand panel of the public pages; `light`: in the signed-in title block. */
  tone?: 'dark' | 'light';
  nameClassName?: string;
}) {
  return (
    <Link
      to="/"
      className="flex shrink-0 items-center gap-2 self-start rounded-md"
      aria-label="Wickstone, to the start"
    >
      <img src="/favicon.svg" alt="" className={large ? 'h-8 w-8' : 'h-7 w-7'} />
      <span
        className={`font-bold tracking-tight ${tone === 'dark' ? 'text-card' : 'text-ink'} ${large ? 'text-xl' : ''} ${nameClassName}`}
      >
        Wickstone
      </span>
    </Link>
  );
}

/**
 * An address, e-mail or URL that may wrap in a narrow table cell: it breaks only after its own
 * punctuation (`.`, `/`, `@`, `-`, `:`), never inside a word, which `break-all` did.
 */
export function Breakable({ text }: { text: string }) {
  const parts = text.split(/(?<=[./@:-])/);
  return (
    <>
      {parts.map((part, i) => (
        <span key={i}>
          {part}
          {i < parts.length - 1 ? <wbr /> : null}
        </span>
      ))}
    </>
  );
}

/** The number of an entry in a numbered contents (`03`), filled for the one shown. */
export function NumberBadge({ n, current }: { n: number; current: boolean }) {
  return (
    <span
      aria-hidden="true"
      className={`inline-flex h-6 w-7 shrink-0 items-center justify-center rounded-sm text-xs tabular-nums ${
        current ? 'bg-brand text-card' : 'border border-line-strong text-ink-soft'
      }`}
    >
      {String(n).padStart(2, '0')}
    </span>
  );
}

/** On a phone, a numbered contents folds behind one button naming where you are and how many entries there are. */
export function ContentsToggle({
  open,
  onToggle,
  controls,
  kicker,
  here,
  className,
}: {
  open: boolean;
  onToggle: () => void;
  controls: string;
  kicker: string;
  here: string;
  className: string;
}) {
  return (
    <button
      type="button"
      aria-expanded={open}
      aria-controls={controls}
      onClick={onToggle}
      className={`flex w-full items-center justify-between gap-3 text-left ${className}`}
    >
      <span className="min-w-0">
        <span className="block text-xs font-semibold tracking-wider text-ink-soft uppercase">{kicker}</span>
        <span className="block truncate font-bold">{here}</span>
      </span>
      <span aria-hidden="true" className="shrink-0 rounded-sm border border-line-strong px-2 py-0.5 text-sm">
        {open ? 'Close ▴' : 'All ▾'}
      </span>
    </button>
  );
}
