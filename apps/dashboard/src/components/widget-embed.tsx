import { useId, useRef, useState } from 'react';
import type { Widget } from '@wickstone/contracts';
import { Button, Notice } from './ui';
import { EditorSection } from './widget-fields';

/**
 * The saved widget's snippet, read-only, with a Copy button. Where the clipboard API is refused
 * (an insecure origin, a denied permission) the code is selected instead, ready for Ctrl+C.
 */
const variantLabels = {
  async: 'Async (recommended)',
  plain: 'Plain',
  nonce: 'With a CSP nonce',
} as const;
type Variant = keyof typeof variantLabels;

export function EmbedCodeSection({ widget, dirty }: { widget: Widget; dirty: boolean }) {
  const id = useId();
  const areaRef = useRef<HTMLTextAreaElement>(null);
  const [message, setMessage] = useState<string | null>(null);
  const [variant, setVariant] = useState<Variant>('async');
  const snippet = widget.embed.variants[variant] || widget.embed.snippet;
  const policy = widget.embed.csp.map((d) => `${d.directive} ${d.sources.join(' ')}`);

  const selectAll = () => {
    areaRef.current?.focus();
    areaRef.current?.select();
  };
  const copy = async () => {
    try {
      await navigator.clipboard.writeText(snippet);
      setMessage('Copied. Paste it into the page where the widget should appear.');
    } catch {
      selectAll();
      setMessage('The browser did not allow copying: the code is selected, press Ctrl+C (⌘C on a Mac).');
    }
  };

  return (
    <EditorSection
      id="widget-embed"
      title="Embed code"
      lead="One script tag places the widget where it stands in the page's HTML. Several widgets can share a page."
    >
      {snippet ? (
        <div className="space-y-3">
          <fieldset className="flex flex-wrap gap-x-5 gap-y-2 text-sm">
            <legend className="mb-1 font-semibold">Kind of code</legend>
            {(Object.keys(variantLabels) as Variant[]).map((v) => (
              <label key={v} className="inline-flex items-center gap-2">
                <input
                  type="radio"
                  name={`${id}-variant`}
                  value={v}
                  checked={variant === v}
                  onChange={() => {
                    setVariant(v);
                    setMessage(null);
                  }}
                />
                {variantLabels[v]}
              </label>
            ))}
          </fieldset>
          <label htmlFor={`${id}-code`} className="sr-only">
            Embed code for {widget.name}
          </label>
          <textarea
            id={`${id}-code`}
            ref={areaRef}
            readOnly
            rows={4}
            value={snippet}
            spellCheck={false}
            onFocus={(e) => e.currentTarget.select()}
            data-embed-snippet
            data-snippet-variant={variant}
            className="block w-full resize-none rounded-md border border-line-strong bg-paper px-3 py-2 font-mono text-xs break-all text-ink"
          />
          <div className="flex flex-wrap items-center gap-3">
            <Button tone="primary" size="sm" onClick={() => void copy()}>
              Copy the code
            </Button>
            <p role="status" aria-live="polite" className="text-sm text-ink-soft">
              {message}
            </p>
          </div>
          {variant === 'plain' ? (
            <p className="text-sm text-ink-soft">
              Without <code className="font-mono">async</code> the page waits for the script where it stands.
            </p>
          ) : null}
          {variant === 'nonce' ? (
            <div className="space-y-1 text-sm text-ink-soft">
              <p>
                Your server writes each page&rsquo;s nonce in place of{' '}
                <code className="font-mono">{'{{csp-nonce}}'}</code>, in the tag and in the policy. A strict{' '}
                <code className="font-mono">style-src</code> refuses inline styles, so this code holds no
                height for the widget: put this rule in the site&rsquo;s own style sheet so nothing moves when
                it appears.
              </p>
              <code
                className="block rounded-md bg-paper px-3 py-2 font-mono text-xs break-all text-ink"
                data-held-css
              >
                {widget.embed.variants.heldCss}
              </code>
            </div>
          ) : null}
          <div className="space-y-1 text-sm">
            <p className="font-semibold">Subresource Integrity hash</p>
            <code className="block font-mono text-xs break-all" data-sri>
              {widget.embed.integrity}
            </code>
          </div>
          <div className="space-y-1 text-sm" data-csp>
            <p className="font-semibold">Content-Security-Policy: what the site must allow</p>
            <p className="text-ink-soft">
              Add these sources to the site&rsquo;s policy (beside what the site itself needs). Its styles
              live in its own shadow root and need nothing.
            </p>
            <ul className="space-y-1 rounded-md bg-paper px-3 py-2 font-mono text-xs break-all">
              {policy.map((line) => (
                <li key={line}>{line};</li>
              ))}
            </ul>
          </div>
          <ul className="list-disc space-y-1 pl-5 text-sm text-ink-soft">
            <li>
              Paste it into the page&rsquo;s HTML at the spot the widget should fill, inside the{' '}
              <code className="font-mono">&lt;body&gt;</code>. Site builders call this an HTML or code block.
            </li>
            <li>
              The page&rsquo;s origin must be one of the widget&rsquo;s allowed sites, and the widget must be
              in service. Release <strong className="text-ink">{widget.release}</strong>; the{' '}
              <code className="font-mono">integrity</code> hash makes the browser refuse a changed file.
            </li>
            <li>Settings you save later reach the page without changing the code.</li>
          </ul>
          {widget.status !== 'live' ? (
            <Notice tone="warn">
              This widget is {widget.status === 'draft' ? 'in preparation' : 'on hold'}: the code places
              nothing until it is in service.
            </Notice>
          ) : null}
          {dirty ? (
            <Notice>The code shows what is saved; unsaved changes reach the page once saved.</Notice>
          ) : null}
        </div>
      ) : (
        <Notice tone="warn">
          The server has no build of release {widget.release} for this calculator, so there is no code to
          paste yet. Ask a developer to build the widget bundle.
        </Notice>
      )}
    </EditorSection>
  );
}
