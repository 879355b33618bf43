import { useState } from 'react';
import { can, type Role, type Widget } from '@wickstone/contracts';
import { checkSite, errorsUnder, lines } from '../lib/widget-draft';
import { isApiError } from '../lib/api';
import { useSetOrigins } from '../queries/embed-access';
import { describeError } from './states';
import { Button, LiveMessage, Notice } from './ui';
import { controlClass, TextAreaField, TextField } from './form';
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

/**
 * The developer's list of allowed sites (`PUT …/origins`): add one, remove one. The server checks
 * each origin; its refusals are shown on the line they name (`body.origins.2`) or for the list.
 */
export function AllowedOriginsPanel({ orgId, widget, role }: { orgId: number; widget: Widget; role: Role }) {
  const mayEdit = can(role, 'embed:manage');
  const save = useSetOrigins(orgId, widget.id);
  const [typed, setTyped] = useState('');
  const [sent, setSent] = useState<string[] | null>(null);
  const issues = isApiError(save.error) ? save.error.fields : [];
  const listIssue = issues.find((f) => f.field === 'body.origins')?.message;
  const issueAt = (i: number) => issues.find((f) => f.field === `body.origins.${i}`)?.message;
  const added = sent && sent.length > widget.allowedOrigins.length ? sent.length - 1 : -1;
  const typedIssue = added >= 0 ? issueAt(added) : undefined;
  const put = (origins: string[]) => {
    setSent(origins);
    save.mutate(origins, { onSuccess: () => setTyped('') });
  };

  return (
    <div className="space-y-3" data-allowed-origins>
      <h3 className="font-semibold">Sites allowed to embed it</h3>
      {widget.allowedOrigins.length === 0 ? (
        <p className="text-sm text-ink-soft">No site yet: the widget shows on no page.</p>
      ) : (
        <ul className="space-y-1 text-sm">
          {widget.allowedOrigins.map((o, i) => (
            <li key={o} className="flex flex-wrap items-center gap-2">
              <code className="font-mono break-all">{o}</code>
              {mayEdit ? (
                <Button
                  size="sm"
                  disabled={save.isPending}
                  onClick={() => put(widget.allowedOrigins.filter((x) => x !== o))}
                >
                  Remove<span className="sr-only"> {o}</span>
                </Button>
              ) : null}
              {issueAt(i) ? <span className="font-semibold text-bad">{issueAt(i)}</span> : null}
            </li>
          ))}
        </ul>
      )}
      {mayEdit ? (
        <form
          className="flex flex-wrap items-end gap-3"
          onSubmit={(e) => {
            e.preventDefault();
            if (typed.trim()) put([...widget.allowedOrigins, typed.trim()]);
          }}
        >
          <div className="min-w-0 flex-1 basis-64">
            <TextField
              label="Add a site"
              name="origin"
              value={typed}
              onChange={(e) => setTyped(e.target.value)}
              placeholder="https://www.brackenridge-ground.example"
              spellCheck={false}
              autoCapitalize="off"
              autoComplete="off"
              error={typedIssue ?? listIssue}
              hint="Scheme, host and port only: nothing after them."
              data-add-origin
            />
          </div>
          <Button type="submit" size="sm" disabled={save.isPending}>
            Allow this site
          </Button>
        </form>
      ) : (
        <Notice>Developers, owners and admins change the sites allowed to embed a widget.</Notice>
      )}
      <LiveMessage
        message={
          save.isError && !issues.length
            ? `The list was not changed: ${describeError(save.error)}`
            : save.isSuccess
              ? `Saved: ${save.data.allowedOrigins.length} ${save.data.allowedOrigins.length === 1 ? 'site' : 'sites'} allowed.`
              : null
        }
        tone={save.isError ? 'bad' : 'ok'}
      />
    </div>
  );
}
