import { useCallback, useMemo, useState } from 'react';
import type { CalculatorDefinition } from '@wickstone/calc-core';
import { hexColorPattern, type Widget } from '@wickstone/contracts';
import { useUpdateWidget } from '../queries/widgets';
import { describeError } from '../components/states';
import { ApiError } from './api';
import type { FieldErrors } from './form';
import { formatDateTime } from './labels';
import { useOrg } from './org-context';
import {
  draftBody,
  draftFromWidget,
  isDirty,
  previewWidget,
  serverFieldErrors,
  usableColors,
  validateDraft,
  type WidgetDraft,
} from './widget-draft';

/** A server error stays beside its field until the value it was about changes. */
interface ServerError {
  message: string;
  was: string;
}

function valueAt(body: unknown, key: string): string {
  let v: unknown = body;
  for (const part of key.split('.')) {
    v = typeof v === 'object' && v !== null ? (v as Record<string, unknown>)[part] : undefined;
  }
  return JSON.stringify(v ?? null);
}

export interface SaveOutcome {
  tone: 'ok' | 'bad';
  text: string;
}

/**
 * The widget editor's state: the draft against what is saved, the errors shown (the draft's own
 * once a save was attempted, the server's until their value changes), the preview, and save and
 * discard. `onProblem` is called with the keys of the fields named when a save is refused, so the
 * page can open their section and move focus to the field.
 */
export function useWidgetEditor(
  widget: Widget,
  calc: CalculatorDefinition,
  editable: boolean,
  onProblem: (keys: string[]) => void,
) {
  const { orgId } = useOrg();
  const update = useUpdateWidget(orgId, widget.id);
  const saved = useMemo(() => draftFromWidget(widget, calc), [widget, calc]);
  const [edited, setDraft] = useState<WidgetDraft>(saved);
  // Readers always see what is saved now; an editor keeps their own draft until it is saved.
  const draft = editable ? edited : saved;
  const [attempted, setAttempted] = useState(false);
  const [serverErrors, setServerErrors] = useState<Record<string, ServerError>>({});
  const [outcome, setOutcome] = useState<SaveOutcome | null>(null);

  const dirty = editable && isDirty(draft, saved);
  const checked = useMemo(() => validateDraft(draft, calc), [draft, calc]);
  const body = useMemo(() => draftBody(draft), [draft]);
  const errors: FieldErrors = useMemo(() => {
    const shown: FieldErrors = attempted && checked.errors ? { ...checked.errors } : {};
    for (const [key, e] of Object.entries(serverErrors)) {
      if (valueAt(body, key) === e.was) shown[key] ??= e.message;
    }
    return shown;
  }, [attempted, checked, serverErrors, body]);

  // The preview keeps the last complete set of colours while one is half typed (state adjusted
  // during render, as React documents for values derived from earlier renders).
  const colors = draft.settings.look.colors;
  const [fallbackColors, setFallbackColors] = useState(widget.settings.look.colors);
  if (colors !== fallbackColors && Object.values(colors).every((c) => hexColorPattern.test(c)))
    setFallbackColors(colors);
  const preview = useMemo(
    () => previewWidget(widget, draft, usableColors(colors, fallbackColors)),
    [widget, draft, colors, fallbackColors],
  );

  const onChange = useCallback((change: (d: WidgetDraft) => WidgetDraft) => {
    setDraft((d) => change(d));
    setOutcome((o) => (o?.tone === 'ok' ? null : o));
  }, []);

  const save = () => {
    if (!editable || update.isPending) return;
    setAttempted(true);
    if (!checked.body) {
      const n = Object.keys(checked.errors).length;
      setOutcome({
        tone: 'bad',
        text: `Not saved: ${n === 1 ? 'one setting needs' : `${n} settings need`} attention.`,
      });
      onProblem(Object.keys(checked.errors));
      return;
    }
    const sent = body;
    update.mutate(checked.body, {
      onSuccess: (next) => {
        setDraft(draftFromWidget(next, calc));
        setAttempted(false);
        setServerErrors({});
        setOutcome({
          tone: 'ok',
          text: `Saved at ${formatDateTime(next.updatedAt)}. The change is kept in the history.`,
        });
      },
      onError: (error) => {
        // The draft is left exactly as it was: only the messages change.
        const fields = error instanceof ApiError ? serverFieldErrors(error.fields) : {};
        const kept: Record<string, ServerError> = {};
        for (const [key, message] of Object.entries(fields)) kept[key] = { message, was: valueAt(sent, key) };
        setServerErrors(kept);
        const n = Object.keys(fields).length;
        setOutcome({
          tone: 'bad',
          text:
            n > 0
              ? `Not saved: the server refused ${n === 1 ? 'one setting' : `${n} settings`}. Your changes are still here.`
              : `Not saved: ${describeError(error)} Your changes are still here; try again.`,
        });
        if (n > 0) onProblem(Object.keys(fields));
      },
    });
  };

  /** A restore saved elsewhere on the page: the draft becomes what is saved now. */
  const adopt = (next: Widget, message: string) => {
    setDraft(draftFromWidget(next, calc));
    setAttempted(false);
    setServerErrors({});
    setOutcome({ tone: 'ok', text: message });
  };

  const discard = () => {
    setDraft(saved);
    setAttempted(false);
    setServerErrors({});
    setOutcome(null);
  };

  return {
    draft,
    saved,
    dirty,
    errors,
    attempted,
    outcome,
    preview,
    fallbackColors,
    saving: update.isPending,
    /** The last save's refusal, for a hint beside the outcome (a plan limit links to the plans). */
    saveError: update.error,
    onChange,
    save,
    discard,
    adopt,
  };
}
