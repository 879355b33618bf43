import type { CalculatorDefinition } from '@wickstone/calc-core';
import type { Widget } from '@wickstone/contracts';
import { changeLabel, SettingValue } from './widget-history';
import { EditorSection } from './widget-fields';

/** The value at a dotted path of the widget (`settings.look.font`). */
function at(widget: Widget, path: string): unknown {
  return path.split('.').reduce<unknown>((v, key) => {
    if (typeof v !== 'object' || v === null) return undefined;
    return Object.hasOwn(v, key) ? (v as Record<string, unknown>)[key] : undefined;
  }, widget);
}

/**
 * What a widget is set to, for those who may read but not change it: the same labels and words as
 * the revisions, in a few short groups, rather than a form of greyed-out fields.
 */
export function WidgetSummary({ widget, calc }: { widget: Widget; calc: CalculatorDefinition }) {
  const system = widget.settings.units.system;
  const groups: { id: string; title: string; paths: string[] }[] = [
    {
      id: 'summary-basics',
      title: 'Name, status and units',
      paths: ['name', 'status', 'settings.units.system', 'settings.units.visitorMaySwitch'],
    },
    { id: 'summary-inputs', title: 'Inputs', paths: calc.inputs.map((i) => `settings.inputs.${i.id}`) },
    {
      id: 'summary-look',
      title: 'Look',
      paths: [
        'settings.look.colors.background',
        'settings.look.colors.text',
        'settings.look.colors.primary',
        'settings.look.colors.primaryText',
        'settings.look.font',
        'settings.look.corner',
        'settings.look.logoAssetId',
      ],
    },
    {
      id: 'summary-visitors',
      title: 'Cautions, requests and sheets',
      paths: [
        'settings.cautions',
        'settings.leadForm.enabled',
        'settings.leadForm.notify',
        'settings.sheet.enabled',
        'allowedOrigins',
      ],
    },
  ];
  return (
    <>
      {groups.map((g) => (
        <EditorSection key={g.id} id={g.id} title={g.title}>
          <dl className="divide-y divide-line" data-widget-summary={g.id}>
            {g.paths.map((path) => (
              <div key={path} className="grid gap-x-4 gap-y-0.5 py-2 text-sm @md:grid-cols-[14rem_1fr]">
                <dt className="font-semibold">{changeLabel(path, calc)}</dt>
                <dd className="min-w-0" data-summary={path}>
                  <SettingValue
                    path={path}
                    // An input the firm never configured is shown and editable, as the widget treats it.
                    value={
                      at(widget, path) ?? (path.startsWith('settings.inputs.') ? { mode: 'editable' } : null)
                    }
                    calc={calc}
                    system={system}
                  />
                </dd>
              </div>
            ))}
          </dl>
        </EditorSection>
      ))}
    </>
  );
}
