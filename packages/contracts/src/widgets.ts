import { z } from 'zod';
import { contrastRatio, hexColorPattern, WCAG_AA_TEXT } from './color.js';
import { emailSchema } from './auth.js';
import { displayNameSchema, webUrlSchema } from './text.js';
import { isWidgetKey } from './keys.js';

export const widgetStatuses = ['draft', 'live', 'paused'] as const;
export type WidgetStatus = (typeof widgetStatuses)[number];
export const unitSystems = ['si', 'us'] as const;
export type UnitSystem = (typeof unitSystems)[number];
/** Fonts the widget bundle ships or can rely on: nothing is fetched from elsewhere. */
export const widgetFonts = ['manrope', 'system-sans', 'system-serif'] as const;
export const cornerStyles = ['square', 'soft', 'round'] as const;
export const inputModes = ['editable', 'locked', 'hidden'] as const;
export type InputMode = (typeof inputModes)[number];
export const leadFieldIds = ['name', 'email', 'company', 'phone', 'message', 'siteAddress'] as const;
export type LeadFieldId = (typeof leadFieldIds)[number];
export const leadFieldModes = ['off', 'optional', 'required'] as const;
export type LeadFieldMode = (typeof leadFieldModes)[number];

export const publicKeySchema = z.string().max(30).refine(isWidgetKey, 'Not a widget key');

/** An exact origin such as https://www.brackenridge-ground.example (no path, query or trailing slash). */
export const originSchema = z
  .string()
  .trim()
  .max(200, 'At most 200 characters')
  .refine((value) => {
    try {
      const u = new URL(value);
      return (
        (u.protocol === 'https:' || u.protocol === 'http:') && u.origin === value.toLowerCase() && !u.username
      );
    } catch {
      return false;
    }
  }, 'Not an origin: use scheme://host[:port] with nothing after it')
  .transform((v) => v.toLowerCase());

const hexColor = z.string().regex(hexColorPattern, 'Use a #rrggbb colour');

export const widgetColorsSchema = z
  .strictObject({
    background: hexColor,
    text: hexColor,
    primary: hexColor,
    primaryText: hexColor,
  })
  .superRefine((c, ctx) => {
    const pairs = [
      ['text', 'background', 'text and background'],
      ['primaryText', 'primary', 'button text and button colour'],
    ] as const;
    for (const [fg, bg, label] of pairs) {
      if (!hexColorPattern.test(c[fg]) || !hexColorPattern.test(c[bg])) continue;
      const ratio = contrastRatio(c[fg], c[bg]);
      if (ratio < WCAG_AA_TEXT) {
        ctx.addIssue({
          code: 'custom',
          path: [fg],
          message: `Contrast between ${label} is ${ratio.toFixed(2)}:1; WCAG AA needs at least ${WCAG_AA_TEXT}:1`,
          params: { ratio: Math.round(ratio * 100) / 100 },
        });
      }
    }
  });

/**
 * A table input's rows as sent: at most 200 rows of at most 10 cells. Cells are loosely typed here
 * so that calc-core, which knows the columns, names each bad cell by row and column.
 */
export const tableValueSchema = z
  .array(
    z
      .record(z.string().max(40), z.union([z.number().finite(), z.string().max(60), z.null()]))
      .refine((r) => Object.keys(r).length <= 10, 'At most 10 columns'),
  )
  .max(200, 'At most 200 rows');

export const inputSettingSchema = z.strictObject({
  mode: z.enum(inputModes),
  /** SI default (a choice value, or a table's rows) overriding the calculator's own. */
  default: z.union([z.number().finite(), z.string().max(60), tableValueSchema]).optional(),
  /**
   * For a choice: the options the firm offers, a subset of the calculator's (the server checks
   * each is one of them and that the default is among them). Absent: every option.
   */
  options: z
    .array(z.string().min(1).max(60))
    .min(1, 'Offer at least one option')
    .max(40, 'At most 40 options')
    .refine((o) => new Set(o).size === o.length, 'An option is listed twice')
    .optional(),
});

/** How secondary outputs (capillary length, dimensionless ratios) are shown: folded under the working, or not at all. */
export const secondaryOutputModes = ['folded', 'hidden'] as const;
export type SecondaryOutputMode = (typeof secondaryOutputModes)[number];
export const resultSettingsSchema = z.strictObject({
  secondary: z.enum(secondaryOutputModes),
});

export const leadFormSchema = z.strictObject({
  enabled: z.boolean(),
  fields: z.strictObject(
    Object.fromEntries(leadFieldIds.map((id) => [id, z.enum(leadFieldModes)])) as Record<
      LeadFieldId,
      z.ZodEnum<{ off: 'off'; optional: 'optional'; required: 'required' }>
    >,
  ),
  consentText: z.string().trim().min(10, 'At least 10 characters').max(600, 'At most 600 characters'),
  /** Who in the firm is e-mailed about each new lead. */
  notify: z.array(emailSchema).max(10, 'At most 10 recipients'),
});

export const paperSizes = ['a4', 'letter'] as const;
export type PaperSize = (typeof paperSizes)[number];
export const sheetSettingsSchema = z.strictObject({
  enabled: z.boolean(),
  paper: z.enum(paperSizes),
});

export const widgetSettingsSchema = z.strictObject({
  inputs: z.record(z.string().regex(/^[a-zA-Z][a-zA-Z0-9]{0,39}$/), inputSettingSchema),
  units: z.strictObject({ system: z.enum(unitSystems), visitorMaySwitch: z.boolean() }),
  look: z.strictObject({
    colors: widgetColorsSchema,
    font: z.enum(widgetFonts),
    corner: z.enum(cornerStyles),
    logoAssetId: z.number().int().positive().nullable(),
  }),
  /** The firm's own cautions, shown under every result beside the calculator's built-in ones. */
  cautions: z.string().trim().max(2000, 'At most 2000 characters'),
  leadForm: leadFormSchema,
  /** The calculation sheet (a PDF of one run) visitors and analysts may download; on unless turned off. */
  sheet: sheetSettingsSchema.default({ enabled: true, paper: 'a4' }),
  /** How the result is shown to visitors; secondary outputs folded unless the firm hides them. */
  result: resultSettingsSchema.default({ secondary: 'folded' }),
});
export type WidgetSettings = z.infer<typeof widgetSettingsSchema>;

export function defaultWidgetSettings(): WidgetSettings {
  return {
    inputs: {},
    units: { system: 'si', visitorMaySwitch: true },
    look: {
      colors: { background: '#ffffff', text: '#1b2a30', primary: '#1d4e5f', primaryText: '#ffffff' },
      font: 'manrope',
      corner: 'soft',
      logoAssetId: null,
    },
    cautions: '',
    leadForm: {
      enabled: true,
      fields: {
        name: 'required',
        email: 'required',
        company: 'optional',
        phone: 'optional',
        message: 'optional',
        siteAddress: 'optional',
      },
      consentText:
        'I agree that the firm may contact me about this request and keep my details for that purpose.',
      notify: [],
    },
    sheet: { enabled: true, paper: 'a4' },
    result: { secondary: 'folded' },
  };
}

export const widgetNameSchema = displayNameSchema(120);

export const createWidgetBodySchema = z.strictObject({
  name: widgetNameSchema,
  calculatorId: z.string().min(1).max(60),
  allowedOrigins: z.array(originSchema).max(20).optional(),
  settings: widgetSettingsSchema.optional(),
});
export const updateWidgetBodySchema = z.strictObject({
  name: widgetNameSchema.optional(),
  status: z.enum(widgetStatuses).optional(),
  allowedOrigins: z.array(originSchema).max(20, 'At most 20 origins').optional(),
  settings: widgetSettingsSchema.optional(),
});
export const widgetParamsSchema = z.strictObject({
  orgId: z.coerce.number().int().positive(),
  widgetId: z.coerce.number().int().positive(),
});
export const widgetRevisionParamsSchema = widgetParamsSchema.extend({
  revisionId: z.coerce.number().int().positive(),
});

export const widgetSchema = z.object({
  id: z.number().int(),
  publicKey: z.string(),
  name: z.string(),
  calculatorId: z.string(),
  status: z.enum(widgetStatuses),
  allowedOrigins: z.array(z.string()),
  settings: widgetSettingsSchema,
  /** The release the snippet points at: the pin resolved. */
  release: z.string(),
  /** What the developer pinned (`0.1.0`, `~0.2`); null when the widget stays on the release it was made with. */
  releasePin: z.string().nullable(),
  logoUrl: z.string().nullable(),
  embed: z.object({
    scriptUrl: z.string(),
    integrity: z.string(),
    /** The default snippet (the `async` variant). */
    snippet: z.string(),
    /** The snippet's variants; `nonce` carries `{{csp-nonce}}` for the page's nonce. */
    variants: z.object({ plain: z.string(), async: z.string(), nonce: z.string(), heldCss: z.string() }),
    /** The sources the firm's Content-Security-Policy must allow for the widget, per directive. */
    csp: z.array(z.object({ directive: z.string(), sources: z.array(z.string()) })),
  }),
  /** The key the last rotation replaced: served until `validUntil`, refused as replaced after. */
  previousKey: z
    .object({ publicKey: z.string(), replacedAt: z.string(), validUntil: z.string(), served: z.boolean() })
    .nullable(),
  /** The kind of key a rotation would issue now: releases before 0.3.0 read only older `wk_` keys. */
  nextKeyKind: z.enum(['reference', 'older']),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Widget = z.infer<typeof widgetSchema>;
export const widgetListSchema = z.object({ items: z.array(widgetSchema), total: z.number().int() });

export const widgetRevisionSchema = z.object({
  id: z.number().int(),
  widgetId: z.number().int(),
  author: z.object({ id: z.number().int(), name: z.string() }).nullable(),
  changes: z.array(z.object({ path: z.string(), before: z.unknown(), after: z.unknown() })),
  createdAt: z.string(),
});
export type WidgetRevision = z.infer<typeof widgetRevisionSchema>;
export const widgetRevisionListSchema = z.object({
  items: z.array(widgetRevisionSchema),
  total: z.number().int(),
});

/** The image types a logo may be (checked by content, not by name). */
export const imageTypes = ['image/png', 'image/jpeg', 'image/webp'] as const;
export type ImageType = (typeof imageTypes)[number];

export const assetSchema = z.object({
  id: z.number().int(),
  url: z.string(),
  contentType: z.enum(imageTypes),
  bytes: z.number().int(),
  width: z.number().int().nullable(),
  height: z.number().int().nullable(),
});
export type Asset = z.infer<typeof assetSchema>;

// ---- The public embed API (no cookies; CORS only for a widget's allowed origins) ----

/** What a live widget needs to render: never the firm's notification list or origins. */
export const embedWidgetSchema = z.object({
  publicKey: z.string(),
  name: z.string(),
  calculatorId: z.string(),
  release: z.string(),
  settings: z.object({
    inputs: widgetSettingsSchema.shape.inputs,
    units: widgetSettingsSchema.shape.units,
    look: z.object({
      colors: z.object({
        background: z.string(),
        text: z.string(),
        primary: z.string(),
        primaryText: z.string(),
      }),
      font: z.enum(widgetFonts),
      corner: z.enum(cornerStyles),
      logoUrl: z.string().nullable(),
    }),
    cautions: z.string(),
    leadForm: z.object({
      enabled: z.boolean(),
      fields: leadFormSchema.shape.fields,
      consentText: z.string(),
    }),
    /** Whether the widget offers its calculation sheet after a result (the paper stays the server's). */
    sheet: z.object({ enabled: z.boolean() }),
    /** Absent from an answer made before it existed: secondary outputs folded. */
    result: resultSettingsSchema.optional(),
  }),
});
export type EmbedWidget = z.infer<typeof embedWidgetSchema>;

const inputValue = z.union([z.number().finite(), z.string().max(60), tableValueSchema]);

export const embedRunBodySchema = z.strictObject({
  /** Made in the browser, so a retried report is stored once. */
  id: z.uuid(),
  publicKey: publicKeySchema,
  inputs: z
    .record(z.string().max(40), inputValue)
    .refine((r) => Object.keys(r).length <= 40, 'At most 40 inputs'),
  unitSystem: z.enum(unitSystems),
  result: z.strictObject({
    outputs: z.record(z.string().max(40), z.number().finite().nullable()),
    warnings: z.array(z.string().max(60)).max(50),
    inputHash: z.string().max(128),
    version: z.string().max(40),
  }),
  pageUrl: webUrlSchema.max(2000).optional(),
  /**
   * The widget release whose script ran the calculation (the server recomputes with that release's
   * engine); reports without it are taken as made by the widget's current release.
   */
  release: z.string().max(40).optional(),
});
export type EmbedRunBody = z.infer<typeof embedRunBodySchema>;
export const embedRunResponseSchema = z.object({
  id: z.string(),
  agreed: z.boolean(),
  duplicate: z.boolean(),
});

const leadText = (max: number) => z.string().trim().min(1, 'Required').max(max, `At most ${max} characters`);
export const embedLeadBodySchema = z.strictObject({
  runId: z.uuid(),
  publicKey: publicKeySchema,
  fields: z.strictObject({
    name: displayNameSchema(120).optional(),
    email: emailSchema.optional(),
    company: leadText(160).optional(),
    phone: z
      .string()
      .trim()
      .regex(/^[+0-9 ()./-]{5,32}$/, 'Enter a phone number')
      .optional(),
    message: leadText(2000).optional(),
    siteAddress: leadText(300).optional(),
  }),
  consent: z.literal(true, 'Consent is required'),
  sendCopy: z.boolean().default(false),
});
export type EmbedLeadBody = z.infer<typeof embedLeadBodySchema>;
export const embedLeadResponseSchema = z.object({ id: z.number().int() });

// ---- Embed access: the sites allowed to embed a widget, and the ones refused ----

/** `PUT /orgs/:orgId/widgets/:widgetId/origins`: the whole list, replacing the old one. */
export const setOriginsBodySchema = z.strictObject({
  origins: z.array(originSchema).max(20, 'At most 20 origins'),
});
export type SetOriginsBody = z.infer<typeof setOriginsBodySchema>;

const isoDate = z.iso.date();
const isoDateTime = z.iso.datetime({ offset: true });

/**
 * `POST /orgs/:orgId/widgets/:widgetId/key-rotations`: when the replaced key stops being served.
 * A date alone (`2026-12-20`) means through that day (UTC); a time with its offset is exact.
 * The server also refuses a moment already past and one more than MAX_KEY_OVERLAP_DAYS ahead.
 */
export const keyRotationBodySchema = z.strictObject({
  oldKeyValidUntil: z
    .string()
    .max(40)
    .refine(
      (v) => isoDate.safeParse(v).success || isoDateTime.safeParse(v).success,
      'Not a date: use 2026-12-20 or 2026-12-20T17:00:00Z',
    ),
});
export type KeyRotationBody = z.infer<typeof keyRotationBodySchema>;

/** The moment a rotation's `oldKeyValidUntil` stands for (a date alone: the end of that UTC day). */
export function keyValidUntil(value: string): Date {
  if (isoDate.safeParse(value).success) return new Date(Date.parse(`${value}T00:00:00Z`) + 86_400_000);
  return new Date(value);
}

/** One origin's refusals: how many, and the last day one was counted (`YYYY-MM-DD`). */
const refusedOrigin = z.object({ origin: z.string(), refusals: z.number().int(), lastDay: z.string() });

/** Refusals (403: origin not allowed) per origin over the last `days` days, most refused first. */
export const refusedOriginsSchema = z.object({
  days: z.number().int(),
  items: z.array(
    refusedOrigin.extend({
      /** Per day, oldest first: `YYYY-MM-DD` and the count. */
      byDay: z.array(z.object({ day: z.string(), refusals: z.number().int() })),
    }),
  ),
});
export type RefusedOrigins = z.infer<typeof refusedOriginsSchema>;

/**
 * `GET /orgs/:orgId/refused-origins`: the same refusals across the organisation's widgets, per
 * origin (most refused first), each with the widgets it asked for and how often.
 */
export const orgRefusedOriginsSchema = z.object({
  days: z.number().int(),
  items: z.array(
    refusedOrigin.extend({
      widgets: z.array(z.object({ id: z.number().int(), name: z.string(), refusals: z.number().int() })),
    }),
  ),
});
export type OrgRefusedOrigins = z.infer<typeof orgRefusedOriginsSchema>;
