import { widgetStatuses, type WidgetStatus } from '@wickstone/contracts';
import { withUnitSystem } from '../lib/widget-draft';
import { TextAreaField, TextField } from './form';
import { CheckField, ChoiceCards, EditorSection, type SectionProps } from './widget-fields';
import { statusLabel } from './widget-status';

/* The editor's three short sections; the longer ones have a file each (widget-inputs, widget-look, …). */

const statusDetail: Record<WidgetStatus, string> = {
  draft: 'Being set up: shown on no site yet, so the embed code places nothing.',
  live: 'Working on the sites listed under Sites. Needs at least one site.',
  paused: 'Taken off every site for now; its settings and records stay as they are.',
};

export function StatusSection({ draft, onChange, errors, readOnly }: SectionProps) {
  return (
    <EditorSection id="widget-status" title="Name and status">
      <TextField
        label="Name"
        name="name"
        value={draft.name}
        disabled={readOnly}
        autoComplete="off"
        error={errors.name}
        hint="Shown above the calculator's title in the widget, and in your lists."
        onChange={(e) => {
          const name = e.target.value;
          onChange((d) => ({ ...d, name }));
        }}
      />
      <ChoiceCards
        legend="Status"
        name="widget-status"
        value={draft.status}
        disabled={readOnly}
        error={errors.status}
        onChange={(status) => onChange((d) => ({ ...d, status }))}
        options={widgetStatuses.map((s) => ({ value: s, label: statusLabel[s], detail: statusDetail[s] }))}
      />
    </EditorSection>
  );
}

export function UnitsSection({ draft, onChange, errors, readOnly, calc }: SectionProps) {
  const units = draft.settings.units;
  return (
    <EditorSection
      id="widget-units"
      title="Units"
      lead="The units the widget opens in. Defaults above are typed in these units and stored in SI."
    >
      <ChoiceCards
        legend="Unit system"
        name="widget-unit-system"
        value={units.system}
        disabled={readOnly}
        columns="@md:grid-cols-2"
        error={errors['settings.units.system']}
        onChange={(system) => onChange((d) => withUnitSystem(d, calc, system))}
        options={[
          { value: 'si', label: 'Metric (SI)', detail: 'mm, °C, mN/m, kPa' },
          { value: 'us', label: 'US customary', detail: 'in, ft, °F, psi' },
        ]}
      />
      <CheckField
        label="Visitors may switch units"
        detail="Shows a Metric / US switch in the widget's header."
        checked={units.visitorMaySwitch}
        disabled={readOnly}
        onChange={(visitorMaySwitch) =>
          onChange((d) => ({
            ...d,
            settings: { ...d.settings, units: { ...d.settings.units, visitorMaySwitch } },
          }))
        }
      />
      <CheckField
        label="Show supporting figures"
        detail="The capillary length and the ratios behind a result, folded under the working. Off: not shown to visitors."
        checked={(draft.settings.result?.secondary ?? 'folded') === 'folded'}
        disabled={readOnly}
        onChange={(shown) =>
          onChange((d) => ({
            ...d,
            settings: { ...d.settings, result: { secondary: shown ? 'folded' : 'hidden' } },
          }))
        }
      />
    </EditorSection>
  );
}

export function CautionsSection({ draft, onChange, errors, readOnly, calc }: SectionProps) {
  return (
    <EditorSection
      id="widget-cautions"
      title="Cautions"
      lead="Shown under every result. The calculator's own cautions always appear; yours are added after them."
    >
      <div className="grid gap-5 @3xl:grid-cols-2">
        <TextAreaField
          label="The firm's own cautions"
          rows={6}
          value={draft.settings.cautions}
          disabled={readOnly}
          maxLength={2000}
          error={errors['settings.cautions']}
          hint={`Plain text, up to 2000 characters (${draft.settings.cautions.length} so far). A blank line starts a new caution.`}
          onChange={(e) => {
            const cautions = e.target.value;
            onChange((d) => ({ ...d, settings: { ...d.settings, cautions } }));
          }}
        />
        <div className="space-y-2">
          <h3 className="text-sm font-semibold">Built into the calculator (always shown)</h3>
          <ul className="space-y-2" aria-label="The calculator's built-in cautions">
            {calc.cautions.map((c) => (
              <li
                key={c.code}
                data-builtin-caution={c.code}
                className="rounded-md border border-line bg-paper px-3 py-2 text-sm text-ink-soft"
              >
                {c.text}
              </li>
            ))}
          </ul>
        </div>
      </div>
    </EditorSection>
  );
}

export function SheetSection({ draft, onChange, errors, readOnly }: SectionProps) {
  const sheet = draft.settings.sheet;
  const setSheet = (change: Partial<typeof sheet>) =>
    onChange((d) => ({ ...d, settings: { ...d.settings, sheet: { ...d.settings.sheet, ...change } } }));
  return (
    <EditorSection
      id="widget-sheet"
      title="Calculation sheet"
      lead="A PDF of one result with its working, sources, cautions and a link anyone can use to verify it."
    >
      <CheckField
        label="Visitors may download the sheet"
        detail="Also attached to the copy of a result e-mailed to a visitor. Your team can always download it from the run."
        checked={sheet.enabled}
        disabled={readOnly}
        onChange={(enabled) => setSheet({ enabled })}
      />
      <ChoiceCards
        legend="Paper"
        name="widget-sheet-paper"
        value={sheet.paper}
        disabled={readOnly}
        columns="@md:grid-cols-2"
        error={errors['settings.sheet.paper']}
        onChange={(paper) => setSheet({ paper })}
        options={[
          { value: 'a4', label: 'A4', detail: '210 × 297 mm' },
          { value: 'letter', label: 'US Letter', detail: '8.5 × 11 in' },
        ]}
      />
    </EditorSection>
  );
}
