import { z } from 'zod';
import { unitSystems, originSchema } from './widgets.js';

/*
 * Usage (runs, summary) and leads: the analysts' part of the API. Every query, body and answer
 * of those routes is one of these schemas; the server validates with them, the dashboard takes
 * its types from them.
 */

const MAX_PAGE = 100_000;
/** Most days one summary may cover: ten years, so a year against the year before is easy. */
export const MAX_SUMMARY_DAYS = 3660;

/** A calendar day in UTC, `YYYY-MM-DD`; a range of them includes both ends. */
export const isoDaySchema = z.iso.date('Use a date as YYYY-MM-DD');
const queryBool = z.enum(['true', 'false'], 'Use true or false').transform((v) => v === 'true');
const id = z.coerce.number().int().positive().max(4_294_967_295);
const page = z.coerce.number().int().min(1).max(MAX_PAGE).default(1);
const pageSize = z.coerce.number().int().min(1).max(200, 'At most 200').default(50);
export const calculatorIdSchema = z.string().regex(/^[a-z][a-z0-9-]{0,59}$/, 'Not a calculator id');

function dayRangeIssue(
  v: { from?: string | undefined; to?: string | undefined },
  ctx: z.RefinementCtx,
  maxDays?: number,
) {
  if (!v.from || !v.to) return;
  const days = (Date.parse(v.to) - Date.parse(v.from)) / 86_400_000 + 1;
  if (days < 1) ctx.addIssue({ code: 'custom', path: ['to'], message: 'Must not be before from' });
  else if (maxDays !== undefined && days > maxDays)
    ctx.addIssue({ code: 'custom', path: ['to'], message: `At most ${maxDays} days from from` });
}

// ---- Runs ----

export const runSorts = ['-createdAt', 'createdAt'] as const;

/** The runs table's filters, shared by the page and the CSV export. */
const runFilterShape = {
  from: isoDaySchema.optional(),
  to: isoDaySchema.optional(),
  widgetId: id.optional(),
  calculatorId: calculatorIdSchema.optional(),
  /** The site the widget ran on: an exact origin such as https://www.brackenridge-ground.example. */
  origin: originSchema.optional(),
  hasWarning: queryBool.optional(),
  /** Whether the server's recomputation reproduced what the visitor's browser showed. */
  agreed: queryBool.optional(),
  sort: z.enum(runSorts).default('-createdAt'),
};
export const runListQuerySchema = z
  .strictObject({ ...runFilterShape, page, pageSize })
  .superRefine((v, ctx) => dayRangeIssue(v, ctx));
export type RunListQuery = z.output<typeof runListQuerySchema>;
export const runExportQuerySchema = z
  .strictObject(runFilterShape)
  .superRefine((v, ctx) => dayRangeIssue(v, ctx));
export type RunFilters = z.output<typeof runExportQuerySchema>;

export const runParamsSchema = z.strictObject({ orgId: id, runId: z.uuid('Not a run id') });

/**
 * One input or output as the widget shows it: `value` converted to the unit whose symbol is `unit`
 * (null for a choice or a pure number), and `text`, the same at four significant figures.
 */
export const shownValueSchema = z.object({
  id: z.string(),
  label: z.string(),
  value: z.union([z.number(), z.string()]).nullable(),
  unit: z.string().nullable(),
  text: z.string(),
  /** A table input (value null, text a one-line summary): its columns with unit symbols and every row in them. */
  table: z
    .object({
      columns: z.array(z.object({ id: z.string(), label: z.string(), unit: z.string() })),
      rows: z.array(z.array(z.number())),
    })
    .optional(),
});
export type ShownValue = z.infer<typeof shownValueSchema>;

export const runListItemSchema = z.object({
  id: z.string(),
  createdAt: z.string(),
  widget: z.object({ id: z.number().int(), name: z.string() }),
  calculator: z.object({ id: z.string(), title: z.string() }),
  /** The widget's unit system today. */
  unitSystem: z.enum(unitSystems),
  /** The unit system the visitor had chosen when the run was made, in which `inputs` and `outputs` are shown. */
  visitorUnitSystem: z.enum(unitSystems),
  /** The inputs the visitor could set and sent (not those the firm fixed), in the calculator's order. */
  inputs: z.array(shownValueSchema),
  /** The outputs the visitor saw, in the calculator's order. */
  outputs: z.array(shownValueSchema),
  warningCodes: z.array(z.string()),
  origin: z.string(),
  pageUrl: z.string().nullable(),
  release: z.string(),
  agreed: z.boolean(),
  leadId: z.number().int().nullable(),
});
export type RunListItem = z.infer<typeof runListItemSchema>;
export const runListResponseSchema = z.object({ items: z.array(runListItemSchema), total: z.number().int() });
export type RunListResponse = z.infer<typeof runListResponseSchema>;

export const leadStatuses = ['new', 'contacted', 'qualified', 'closed'] as const;
export type LeadStatus = (typeof leadStatuses)[number];

/** The lead a run brought, as the run's page shows it. */
export const runLeadSchema = z.object({
  id: z.number().int(),
  status: z.enum(leadStatuses),
  name: z.string().nullable(),
  createdAt: z.string(),
  erasedAt: z.string().nullable(),
});

export const runDetailSchema = runListItemSchema.extend({
  calcVersion: z.string(),
  inputHash: z.string(),
  /** The inputs exactly as the visitor's browser sent them (canonical SI units). */
  sentInputs: z.record(
    z.string(),
    z.union([z.number(), z.string(), z.array(z.record(z.string(), z.unknown()))]),
  ),
  /** What the visitor's browser reported: outputs, warning codes, input hash, version. */
  clientResult: z.record(z.string(), z.unknown()),
  /** The server's recomputation as stored: inputs, outputs, warnings, working, band, version, hash. */
  serverResult: z.record(z.string(), z.unknown()).nullable(),
  /** Where the two differ (null when they agree). */
  mismatch: z.record(z.string(), z.unknown()).nullable(),
  lead: runLeadSchema.nullable(),
});
export type RunDetail = z.infer<typeof runDetailSchema>;

// ---- Usage summary ----

export const usageSummaryQuerySchema = z
  .strictObject({ from: isoDaySchema.optional(), to: isoDaySchema.optional(), widgetId: id.optional() })
  .superRefine((v, ctx) => dayRangeIssue(v, ctx, MAX_SUMMARY_DAYS));

const countsShape = {
  runs: z.number().int(),
  withWarning: z.number().int(),
  withLead: z.number().int(),
  /** Runs whose numbers the server's recomputation did not reproduce. */
  disagreed: z.number().int(),
};
export const usageCountsSchema = z.object(countsShape);
export type UsageCounts = z.infer<typeof usageCountsSchema>;

export const usageSummarySchema = z.object({
  from: z.string(),
  to: z.string(),
  widgetId: z.number().int().nullable(),
  totals: usageCountsSchema,
  /** The period of the same length just before `from`, for comparison. */
  previous: z.object({ from: z.string(), to: z.string(), totals: usageCountsSchema }),
  /** Every day of the period, oldest first, zeros included. */
  perDay: z.array(z.object({ day: z.string(), ...countsShape })),
  byWidget: z.array(
    z.object({ widgetId: z.number().int(), name: z.string(), calculatorId: z.string(), ...countsShape }),
  ),
  byCalculator: z.array(z.object({ calculatorId: z.string(), title: z.string(), ...countsShape })),
  bySite: z.array(z.object({ origin: z.string(), ...countsShape })),
  /** The validity warnings raised most often in the period, most frequent first (at most 10). */
  topWarnings: z.array(
    z.object({ code: z.string(), calculatorId: z.string(), summary: z.string(), runs: z.number().int() }),
  ),
});
export type UsageSummary = z.infer<typeof usageSummarySchema>;

// ---- Leads ----

export const leadSorts = ['-createdAt', 'createdAt', '-updatedAt', 'updatedAt'] as const;
const leadFilterShape = {
  status: z.enum(leadStatuses).optional(),
  widgetId: id.optional(),
  /** A member's user id, or `none` for leads nobody has taken. */
  assigneeId: z.union([z.literal('none'), id]).optional(),
  from: isoDaySchema.optional(),
  to: isoDaySchema.optional(),
  /** Contained in the name, e-mail address or company (case-insensitive). */
  q: z.string().trim().min(1, 'Required').max(200, 'At most 200 characters').optional(),
  sort: z.enum(leadSorts).default('-createdAt'),
};
export const leadListQuerySchema = z
  .strictObject({ ...leadFilterShape, page, pageSize })
  .superRefine((v, ctx) => dayRangeIssue(v, ctx));
export type LeadListQuery = z.output<typeof leadListQuerySchema>;
export const leadExportQuerySchema = z
  .strictObject(leadFilterShape)
  .superRefine((v, ctx) => dayRangeIssue(v, ctx));
export type LeadFilters = z.output<typeof leadExportQuerySchema>;

export const leadParamsSchema = z.strictObject({ orgId: id, leadId: id });

export const MAX_LEAD_NOTE = 5000;
export const leadNoteSchema = z.object({
  id: z.number().int(),
  body: z.string(),
  createdAt: z.string(),
  /** Who wrote it; null once that member's account is gone. */
  author: z.object({ id: z.number().int(), name: z.string() }).nullable(),
});
export type LeadNote = z.infer<typeof leadNoteSchema>;
export const addLeadNoteBodySchema = z.strictObject({
  body: z.string().trim().min(1, 'Required').max(MAX_LEAD_NOTE, `At most ${MAX_LEAD_NOTE} characters`),
});
export type AddLeadNoteBody = z.infer<typeof addLeadNoteBodySchema>;

export const leadSchema = z.object({
  id: z.number().int(),
  createdAt: z.string(),
  updatedAt: z.string(),
  status: z.enum(leadStatuses),
  widget: z.object({ id: z.number().int(), name: z.string() }),
  /** Null once the run was purged. */
  runId: z.string().nullable(),
  name: z.string().nullable(),
  email: z.string().nullable(),
  company: z.string().nullable(),
  phone: z.string().nullable(),
  message: z.string().nullable(),
  siteAddress: z.string().nullable(),
  origin: z.string(),
  consentText: z.string(),
  consentAt: z.string(),
  sendCopy: z.boolean(),
  assignee: z.object({ id: z.number().int(), name: z.string(), email: z.string() }).nullable(),
  /** The firm's dated notes on the enquiry, oldest first. */
  notes: z.array(leadNoteSchema),
  /** When its personal data was erased (name, contact details, message, address, notes); null if never. */
  erasedAt: z.string().nullable(),
});
export type Lead = z.infer<typeof leadSchema>;
export const leadListResponseSchema = z.object({ items: z.array(leadSchema), total: z.number().int() });
export type LeadListResponse = z.infer<typeof leadListResponseSchema>;
export const leadDetailSchema = leadSchema.extend({ run: runDetailSchema.nullable() });
export type LeadDetail = z.infer<typeof leadDetailSchema>;

export const updateLeadBodySchema = z.strictObject({
  status: z.enum(leadStatuses).optional(),
  /** A member of the organisation, or null to leave the lead with nobody. */
  assigneeId: z.number().int().positive().max(4_294_967_295).nullable().optional(),
});
export type UpdateLeadBody = z.infer<typeof updateLeadBodySchema>;

// ---- Retention ----

export const retentionBodySchema = z.strictObject({
  /** Runs and leads older than this many months are deleted by the daily purge; null keeps them. */
  months: z.number().int('Whole months').min(1, 'At least 1').max(120, 'At most 120').nullable(),
});
export type RetentionBody = z.infer<typeof retentionBodySchema>;
export const retentionSchema = z.object({
  months: z.number().int().nullable(),
  /** Data created before this instant goes at the next purge (null when kept). */
  cutoff: z.string().nullable(),
});
export type Retention = z.infer<typeof retentionSchema>;
