import { useId, useRef, useState } from 'react';
import { cornerStyles, hexColorPattern, WCAG_AA_TEXT, widgetFonts } from '@wickstone/contracts';
import { isApiError } from '../lib/api';
import { useOrg } from '../lib/org-context';
import {
  colorPairs,
  formatRatio,
  pairRatio,
  usableColors,
  type ColorKey,
  type WidgetColors,
  type WidgetDraft,
} from '../lib/widget-draft';
import { useUploadLogo } from '../queries/widgets';
import { FieldProblem } from './form';
import { describeError } from './states';
import { Button, Spinner } from './ui';
import { ChoiceCards, EditorSection, smallControlClass, type SectionProps } from './widget-fields';

const colorLabel: Record<ColorKey, string> = {
  background: 'Background colour',
  text: 'Text colour',
  primary: 'Button colour',
  primaryText: 'Button text colour',
};

const colorHint: Record<ColorKey, string> = {
  background: 'Behind everything in the widget.',
  text: 'Labels, results and working.',
  primary: 'The Work it out and Send buttons, the selected unit.',
  primaryText: 'Words on the buttons.',
};

const MAX_LOGO_BYTES = 512 * 1024;
const logoTypes = ['image/png', 'image/jpeg', 'image/webp'];

function setColor(draft: WidgetDraft, key: ColorKey, value: string): WidgetDraft {
  const look = draft.settings.look;
  return {
    ...draft,
    settings: { ...draft.settings, look: { ...look, colors: { ...look.colors, [key]: value } } },
  };
}

function ColorRow({
  colorKey,
  colors,
  shown,
  onChange,
  error,
  readOnly,
}: {
  colorKey: ColorKey;
  colors: WidgetColors;
  /** The last complete colours, for the picker while the hex box holds half a value. */
  shown: WidgetColors;
  onChange: SectionProps['onChange'];
  error: string | undefined;
  readOnly: boolean;
}) {
  const id = useId();
  const label = colorLabel[colorKey];
  const value = colors[colorKey];
  return (
    <div className="space-y-1.5" data-color={colorKey}>
      <label htmlFor={`${id}-hex`} className="block text-sm font-semibold">
        {label}
      </label>
      <div className="flex items-center gap-2">
        <input
          type="color"
          aria-label={`${label}: colour picker`}
          value={shown[colorKey].toLowerCase()}
          disabled={readOnly}
          onChange={(e) => {
            const next = e.target.value;
            onChange((d) => setColor(d, colorKey, next));
          }}
          className="h-9 w-11 shrink-0 cursor-pointer rounded-md border border-line-strong bg-card p-0.5 disabled:cursor-default"
        />
        <input
          id={`${id}-hex`}
          type="text"
          value={value}
          maxLength={7}
          spellCheck={false}
          autoComplete="off"
          disabled={readOnly}
          aria-invalid={error ? true : undefined}
          aria-describedby={`${id}-hint${error ? ` ${id}-error` : ''}`}
          onChange={(e) => {
            let next = e.target.value.trim();
            if (/^[0-9a-fA-F]{6}$/.test(next)) next = `#${next}`;
            onChange((d) => setColor(d, colorKey, next));
          }}
          className={`${smallControlClass} w-28 font-mono uppercase`}
        />
      </div>
      <p id={`${id}-hint`} className="text-xs text-ink-soft">
        {colorHint[colorKey]}
      </p>
      <FieldProblem id={`${id}-error`} message={error} />
    </div>
  );
}

/** One pair's live contrast: a sample drawn in the firm's colours (data), the ratio and the verdict. */
function ContrastCheck({ colors, pair }: { colors: WidgetColors; pair: (typeof colorPairs)[number] }) {
  const ratio = pairRatio(colors, pair);
  const passes = ratio !== null && ratio >= WCAG_AA_TEXT;
  const name = pair.fg === 'text' ? 'Text on background' : 'Button text on button colour';
  return (
    <div
      data-contrast={pair.fg}
      data-passes={ratio === null ? undefined : passes ? 'yes' : 'no'}
      className={`flex items-center gap-3 rounded-md border px-3 py-2 ${
        ratio === null ? 'border-line' : passes ? 'border-ok/40 bg-ok-tint/60' : 'border-bad/40 bg-bad-tint'
      }`}
    >
      <span
        aria-hidden="true"
        className="flex h-10 w-14 shrink-0 items-center justify-center rounded border border-line font-bold"
        style={
          hexColorPattern.test(colors[pair.fg]) && hexColorPattern.test(colors[pair.bg])
            ? { color: colors[pair.fg], backgroundColor: colors[pair.bg] }
            : undefined
        }
      >
        Aa
      </span>
      <p className="text-sm" aria-live="polite">
        <span className="block font-semibold">{name}</span>
        {ratio === null ? (
          <span className="text-ink-soft">Complete both colours to see the contrast.</span>
        ) : passes ? (
          <span className="text-ok">
            <strong data-ratio>{formatRatio(ratio)}</strong> · meets WCAG AA ({WCAG_AA_TEXT}:1)
          </span>
        ) : (
          <span className="text-bad">
            <strong data-ratio>{formatRatio(ratio)}</strong> · below the WCAG AA minimum of {WCAG_AA_TEXT}:1;
            not saved like this
          </span>
        )}
      </p>
    </div>
  );
}

function LogoField({ draft, onChange, errors, readOnly }: SectionProps) {
  const { orgId } = useOrg();
  const upload = useUploadLogo(orgId);
  const fileRef = useRef<HTMLInputElement>(null);
  const id = useId();
  const [problem, setProblem] = useState<string | null>(null);
  const [note, setNote] = useState<string | null>(null);
  const error = problem ?? errors['settings.look.logoAssetId'];
  const colors = draft.settings.look.colors;

  const choose = (file: File | undefined) => {
    setProblem(null);
    setNote(null);
    if (!file) return;
    // Said at once rather than after the upload; the server checks the bytes themselves.
    if (file.type && !logoTypes.includes(file.type)) {
      setProblem('Use a PNG, JPEG or WebP image (SVG is not accepted)');
    } else if (file.size > MAX_LOGO_BYTES) {
      setProblem(`The image is ${Math.ceil(file.size / 1024)} KB; at most 512 KB`);
    } else {
      upload.mutate(file, {
        onSuccess: (asset) => {
          onChange((d) => ({
            ...d,
            logoUrl: asset.url,
            settings: { ...d.settings, look: { ...d.settings.look, logoAssetId: asset.id } },
          }));
          const size = asset.width && asset.height ? `${asset.width} × ${asset.height} px, ` : '';
          setNote(
            `Uploaded ${file.name} (${size}${Math.max(1, Math.round(asset.bytes / 1024))} KB). It is used once you save.`,
          );
        },
        onError: (err) => {
          const field = isApiError(err) ? err.fields.find((f) => f.field === 'file') : undefined;
          setProblem(field?.message ?? describeError(err));
        },
      });
    }
    if (fileRef.current) fileRef.current.value = '';
  };

  return (
    <div className="space-y-2" data-logo-field>
      <p id={`${id}-label`} className="text-sm font-semibold">
        Logo
      </p>
      <div className="flex flex-wrap items-center gap-4">
        <div
          className="flex h-16 w-40 items-center justify-center overflow-hidden rounded-md border border-line"
          style={hexColorPattern.test(colors.background) ? { backgroundColor: colors.background } : undefined}
        >
          {draft.logoUrl ? (
            <img
              src={draft.logoUrl}
              alt="The widget's logo"
              className="max-h-14 max-w-36 object-contain"
              data-logo-preview
            />
          ) : (
            <span className="text-sm text-ink-faint">No logo</span>
          )}
        </div>
        {readOnly ? null : (
          <div className="flex flex-wrap items-center gap-2">
            <label
              htmlFor={`${id}-file`}
              className="inline-flex cursor-pointer items-center gap-2 rounded-md border border-line-strong bg-card px-2.5 py-1 text-sm font-semibold hover:bg-paper has-focus-visible:outline-2 has-focus-visible:outline-offset-2 has-focus-visible:outline-accent"
            >
              {upload.isPending ? <Spinner /> : null}
              {draft.logoUrl ? 'Replace logo…' : 'Upload a logo…'}
              <input
                id={`${id}-file`}
                ref={fileRef}
                type="file"
                accept={logoTypes.join(',')}
                aria-describedby={`${id}-hint${error ? ` ${id}-error` : ''}`}
                aria-invalid={error ? true : undefined}
                disabled={upload.isPending}
                onChange={(e) => choose(e.target.files?.[0])}
                className="sr-only"
              />
            </label>
            {draft.logoUrl ? (
              <Button
                size="sm"
                tone="danger"
                onClick={() => {
                  setNote('The logo is taken off once you save.');
                  onChange((d) => ({
                    ...d,
                    logoUrl: null,
                    settings: { ...d.settings, look: { ...d.settings.look, logoAssetId: null } },
                  }));
                }}
              >
                Remove logo
              </Button>
            ) : null}
          </div>
        )}
      </div>
      <p id={`${id}-hint`} className="text-xs text-ink-soft">
        PNG, JPEG or WebP, at most 512 KB; checked by its content, not its name. Shown in the widget&rsquo;s
        header.
      </p>
      <div aria-live="polite">{note && !error ? <p className="text-sm text-ok">{note}</p> : null}</div>
      <FieldProblem id={`${id}-error`} message={error} />
    </div>
  );
}

const fontLabel: Record<(typeof widgetFonts)[number], { label: string; detail: string; sample: string }> = {
  manrope: { label: 'Manrope', detail: 'Shipped with the widget', sample: 'font-sans' },
  'system-sans': {
    label: 'System sans',
    detail: "The visitor's own sans-serif",
    sample: 'font-[system-ui,sans-serif]',
  },
  'system-serif': { label: 'System serif', detail: "The visitor's own serif", sample: 'font-serif' },
};

const cornerLabel: Record<(typeof cornerStyles)[number], { label: string; sample: string }> = {
  square: { label: 'Square', sample: 'rounded-none' },
  soft: { label: 'Soft', sample: 'rounded-md' },
  round: { label: 'Round', sample: 'rounded-xl' },
};

export function LookSection(props: SectionProps & { fallbackColors: WidgetColors }) {
  const { draft, onChange, errors, readOnly, fallbackColors } = props;
  const look = draft.settings.look;
  const shown = usableColors(look.colors, fallbackColors);
  return (
    <EditorSection
      id="widget-look"
      title="Look"
      lead="The firm's colours, logo, font and corners. Both colour pairs must reach the WCAG AA contrast of 4.5:1 for text."
    >
      <div className="grid gap-4 sm:grid-cols-2">
        {(['background', 'text', 'primary', 'primaryText'] as const).map((k) => (
          <ColorRow
            key={k}
            colorKey={k}
            colors={look.colors}
            shown={shown}
            onChange={onChange}
            error={errors[`settings.look.colors.${k}`]}
            readOnly={readOnly}
          />
        ))}
      </div>
      <div className="grid gap-2 sm:grid-cols-2">
        {colorPairs.map((pair) => (
          <ContrastCheck key={pair.fg} colors={look.colors} pair={pair} />
        ))}
      </div>
      <LogoField {...props} />
      <ChoiceCards
        legend="Font"
        name="widget-font"
        value={look.font}
        disabled={readOnly}
        error={errors['settings.look.font']}
        onChange={(font) =>
          onChange((d) => ({ ...d, settings: { ...d.settings, look: { ...d.settings.look, font } } }))
        }
        options={widgetFonts.map((f) => ({
          value: f,
          label: fontLabel[f].label,
          // Each name is set in its own font: the sample is the label.
          labelClassName: `text-base ${fontLabel[f].sample}`,
          detail: fontLabel[f].detail,
        }))}
      />
      <ChoiceCards
        legend="Corners"
        name="widget-corner"
        value={look.corner}
        disabled={readOnly}
        error={errors['settings.look.corner']}
        onChange={(corner) =>
          onChange((d) => ({ ...d, settings: { ...d.settings, look: { ...d.settings.look, corner } } }))
        }
        options={cornerStyles.map((c) => ({
          value: c,
          label: cornerLabel[c].label,
          sample: (
            <span
              aria-hidden="true"
              className={`inline-block h-5 w-7 border-2 border-brand bg-brand-tint ${cornerLabel[c].sample}`}
            />
          ),
        }))}
      />
    </EditorSection>
  );
}
