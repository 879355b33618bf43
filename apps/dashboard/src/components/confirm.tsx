import { useEffect, useRef, useState } from 'react';
import { Button } from './ui';

/**
 * A destructive action asked twice, in place: the first press shows the question and moves focus
 * to the safe answer, so a stray Enter does nothing harmful.
 */
export function ConfirmAction({
  label,
  question,
  confirmLabel,
  busy,
  onConfirm,
}: {
  label: string;
  question: string;
  confirmLabel: string;
  busy: boolean;
  onConfirm: () => void;
}) {
  const [asking, setAsking] = useState(false);
  const keepRef = useRef<HTMLButtonElement>(null);
  const startRef = useRef<HTMLButtonElement>(null);
  const wasAsking = useRef(false);
  useEffect(() => {
    if (asking) keepRef.current?.focus();
    else if (wasAsking.current) startRef.current?.focus();
    wasAsking.current = asking;
  }, [asking]);

  if (!asking) {
    return (
      <Button ref={startRef} size="sm" tone="danger" onClick={() => setAsking(true)}>
        {label}
      </Button>
    );
  }
  return (
    <div role="group" aria-label={question} className="flex flex-wrap items-center gap-2 sm:justify-end">
      <span className="text-sm font-semibold">{question}</span>
      <Button size="sm" tone="danger" busy={busy} onClick={onConfirm}>
        {confirmLabel}
      </Button>
      <Button ref={keepRef} size="sm" onClick={() => setAsking(false)}>
        Keep
      </Button>
    </div>
  );
}
