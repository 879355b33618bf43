import { useId, useRef, useState } from 'react';
import type { Widget } from '@wickstone/contracts';
import { Button, Notice } from './ui';
import { EditorSection } from './widget-fields';

/**
 * The saved widget's snippet, read-only, with a Copy button. Where the clipboard API is refused
 * (an insecure origin, a denied permission) the code is selected instead, ready for Ctrl+C.
 */
export function EmbedCodeSection({ widget, dirty }: { widget: Widget; dirty: boolean }) {
  const id = useId();
  const areaRef = useRef<HTMLTextAreaElement>(null);
  const [message, setMessage] = useState<string | null>(null);
  const snippet = widget.embed.snippet;

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
          <ul className="list-disc space-y-1 pl-5 text-sm text-ink-soft">
            <li>
              Paste it into the page&rsquo;s HTML at the spot the widget should fill, inside the{' '}
              <code className="font-mono">&lt;body&gt;</code>. Site builders call this an HTML or code block.
            </li>
            <li>
              The page&rsquo;s origin must be one of the sites above, and the widget must be in service.
              Release <strong className="text-ink">{widget.release}</strong>; the{' '}
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
