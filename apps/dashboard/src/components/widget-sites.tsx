import { checkSite, errorsUnder, lines } from '../lib/widget-draft';
import { Button } from './ui';
import { controlClass, TextAreaField } from './form';
import { EditorSection, type SectionProps } from './widget-fields';

/** The exact origins allowed to embed the widget, one a line, each checked with `originSchema` as typed. */
export function SitesSection({ draft, onChange, errors, readOnly }: SectionProps) {
  const typed = lines(draft.sitesText);
  const checks = typed.map((line) => ({ line, check: checkSite(line) }));
  const listErrors = errorsUnder(errors, 'allowedOrigins');
  const whole = listErrors.filter(([k]) => k === 'allowedOrigins').map(([, m]) => m);
  const bad = checks.filter((c) => !c.check.ok).length;
  // The server names a refused line by its place in the list; the live check covers the rest.
  const serverLine = (i: number) => errors[`allowedOrigins.${i}`];
  const replaceLine = (index: number, origin: string) =>
    onChange((d) => ({
      ...d,
      sitesText: lines(d.sitesText)
        .map((l, i) => (i === index ? origin : l))
        .join('\n'),
    }));

  return (
    <EditorSection
      id="widget-sites"
      title="Sites"
      lead="The exact origins whose pages may show this widget: scheme, host and port, nothing after. Any other site gets no widget and its runs are refused."
    >
      <TextAreaField
        label="Allowed origins"
        rows={Math.min(8, Math.max(3, typed.length + 1))}
        value={draft.sitesText}
        disabled={readOnly}
        spellCheck={false}
        autoComplete="off"
        autoCapitalize="off"
        placeholder={
          readOnly
            ? undefined
            : 'https://www.brackenridge-ground.example\nhttps://portal.brackenridge-ground.example'
        }
        className={`${controlClass} font-mono text-sm`}
        error={
          whole.length || bad
            ? [...whole, bad ? `${bad === 1 ? 'One line is' : `${bad} lines are`} not an origin` : '']
                .filter(Boolean)
                .join('. ')
            : undefined
        }
        hint="One a line, e.g. https://www.brackenridge-ground.example. A page on http://localhost:5181 needs exactly that line."
        onChange={(e) => {
          const sitesText = e.target.value;
          onChange((d) => ({ ...d, sitesText }));
        }}
      />
      {checks.length > 0 ? (
        <ul aria-label="How each line reads" className="flex flex-wrap gap-2">
          {checks.map(({ line, check }, i) => (
            <li
              key={`${i}-${line}`}
              data-site-check={check.ok && !serverLine(i) ? 'ok' : 'bad'}
              className={`inline-flex max-w-full flex-wrap items-center gap-2 rounded-md border px-3 py-1 text-sm ${
                check.ok && !serverLine(i)
                  ? 'border-ok/40 bg-ok-tint text-ok'
                  : 'border-bad/40 bg-bad-tint text-bad'
              }`}
            >
              <span aria-hidden="true">{check.ok && !serverLine(i) ? '✓' : '!'}</span>
              <span className="font-mono break-all">{check.ok ? check.origin : line}</span>
              {!check.ok ? <span className="font-semibold">{check.message}</span> : null}
              {check.ok && serverLine(i) ? <span className="font-semibold">{serverLine(i)}</span> : null}
              {!check.ok && check.suggestion && !readOnly ? (
                <Button size="sm" onClick={() => replaceLine(i, check.suggestion ?? line)}>
                  Use {check.suggestion}
                </Button>
              ) : null}
            </li>
          ))}
        </ul>
      ) : null}
    </EditorSection>
  );
}
