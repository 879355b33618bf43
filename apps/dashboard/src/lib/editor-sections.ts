import type { FieldErrors } from './form';
import { draftBody, type WidgetDraft } from './widget-draft';

/*
 * The widget editor as sections a person works through one at a time. Each section has its own
 * address (`?section=<id>`, so the draft, which lives in the page, is kept while moving between
 * them), the DOM id of the section component it shows, the error keys it owns and the part of the
 * draft it changes.
 */

export type EditorSectionId =
  | 'name'
  | 'inputs'
  | 'units'
  | 'look'
  | 'cautions'
  | 'requests'
  | 'sheet'
  | 'sites'
  | 'embed'
  | 'release'
  | 'revisions'
  | 'settings';

export interface EditorSectionInfo {
  id: EditorSectionId;
  label: string;
  /** The id of the section's element (`EditorSection`'s), which the e2e tests and links use. */
  anchor: string;
  /** Whether the section edits the draft (and so has a changed / has-errors state). */
  edits: boolean;
  /** For one that does not: how its changes are made, for its title block. */
  saving?: string;
}

const section = (id: EditorSectionId, label: string, anchor: string, saving?: string): EditorSectionInfo => ({
  id,
  label,
  anchor,
  edits: saving === undefined,
  ...(saving === undefined ? {} : { saving }),
});

/** What an owner or admin works through, in order. */
export const editingSections: readonly EditorSectionInfo[] = [
  section('name', 'Name and status', 'widget-status'),
  section('inputs', 'Inputs', 'widget-inputs'),
  section('units', 'Units', 'widget-units'),
  section('look', 'Look', 'widget-look'),
  section('cautions', 'Cautions', 'widget-cautions'),
  section('requests', 'Request form', 'widget-lead-form'),
  section('sheet', 'Calculation sheet', 'widget-sheet'),
  section('sites', 'Sites', 'widget-sites'),
  section('embed', 'Embed code', 'widget-embed', 'Nothing to save: copy it'),
  section('release', 'Release', 'widget-release', 'Pinned here, on its own'),
  section('revisions', 'Revisions', 'widget-history', 'Restored here, on their own'),
];

/** What a reader sees: the readable summary, then the same last three. */
export const readingSections: readonly EditorSectionInfo[] = [
  section('settings', 'What it is set to', 'summary-basics', 'Read only'),
  ...editingSections.filter((s) => !s.edits),
];

/** The section an error key (`settings.look.colors.text`, `allowedOrigins.2`) belongs to. */
export function sectionOfKey(key: string): EditorSectionId {
  if (key.startsWith('allowedOrigins')) return 'sites';
  if (key.startsWith('settings.inputs')) return 'inputs';
  if (key.startsWith('settings.units') || key.startsWith('settings.result')) return 'units';
  if (key.startsWith('settings.look')) return 'look';
  if (key.startsWith('settings.cautions')) return 'cautions';
  if (key.startsWith('settings.leadForm')) return 'requests';
  if (key.startsWith('settings.sheet')) return 'sheet';
  return 'name';
}

/** The section named in the address, or the first one when it names none (or one this role lacks). */
export function sectionFromParam(
  param: string | null,
  sections: readonly EditorSectionInfo[],
): EditorSectionInfo {
  return sections.find((s) => s.id === param) ?? sections[0]!;
}

/** The part of the draft a section changes, as the save would send it. */
function part(draft: WidgetDraft, id: EditorSectionId): unknown {
  const body = draftBody(draft);
  switch (id) {
    case 'name':
      return [body.name, body.status];
    case 'inputs':
      return body.settings.inputs;
    case 'units':
      return [body.settings.units, body.settings.result];
    case 'look':
      return body.settings.look;
    case 'cautions':
      return body.settings.cautions;
    case 'requests':
      return body.settings.leadForm;
    case 'sheet':
      return body.settings.sheet;
    case 'sites':
      return body.allowedOrigins;
    default:
      return null;
  }
}

export type SectionState = 'errors' | 'changed' | 'here' | 'done' | 'open';

/**
 * Where a section stands: has errors (a refused or checked save named one of its fields), changed
 * (differs from what is saved), here (the one shown, being worked on), done (opened before and left
 * with nothing to fix), or not opened yet.
 * A default typed but not yet readable counts as a change of the inputs, as the save bar counts it.
 */
export function sectionState(
  s: EditorSectionInfo,
  p: {
    draft: WidgetDraft;
    saved: WidgetDraft;
    errors: FieldErrors;
    seen: ReadonlySet<EditorSectionId>;
    current: EditorSectionId;
  },
): SectionState {
  if (s.edits && Object.keys(p.errors).some((k) => sectionOfKey(k) === s.id)) return 'errors';
  if (s.edits) {
    const changed =
      JSON.stringify(part(p.draft, s.id)) !== JSON.stringify(part(p.saved, s.id)) ||
      (s.id === 'inputs' &&
        p.draft.settings.units.system === p.saved.settings.units.system &&
        JSON.stringify(p.draft.defaultTexts) !== JSON.stringify(p.saved.defaultTexts));
    if (changed) return 'changed';
  }
  if (s.id === p.current) return 'here';
  return p.seen.has(s.id) ? 'done' : 'open';
}

/** The words of each state, as the contents list and the section's title block print them. */
export const sectionStateLabel: Record<SectionState, string> = {
  errors: 'Needs a fix',
  changed: 'Changed, not saved',
  here: 'Open now',
  done: 'Done',
  open: 'Not opened yet',
};

/** The first of the error keys in the order of the sections, so a refusal opens the earliest one. */
export function firstErrorKey(keys: readonly string[]): string | undefined {
  const order = editingSections.map((s) => s.id);
  return [...keys].sort((a, b) => order.indexOf(sectionOfKey(a)) - order.indexOf(sectionOfKey(b)))[0];
}
