import { z } from 'zod';

/**
 * The plans a consultancy can be on, and what each allows: the one table the server enforces and
 * the dashboard shows. Prices are in minor units (pence) per month. `null` means no limit.
 */
export const planIds = ['bench', 'field', 'office'] as const;
export type PlanId = (typeof planIds)[number];
export const paidPlanIds = ['field', 'office'] as const satisfies readonly PlanId[];
export type PaidPlanId = (typeof paidPlanIds)[number];

export interface PlanLimits {
  /** Widgets a firm may have at all (drafts and paused ones included). */
  widgets: number;
  /** Widgets that may be live on the firm's sites at once. */
  liveWidgets: number;
  /** Runs logged per calendar month (UTC) before further runs are marked as over the allowance. */
  runsPerMonth: number;
  /** Calculation sheets (PDF) from logged runs. */
  sheets: boolean;
  /** Brand fonts shipped with the widget rather than the visitor's system font. */
  shippedFonts: boolean;
  /** The longest run and lead retention a firm may choose, in months. */
  retentionMonths: number;
}

export interface Plan {
  id: PlanId;
  name: string;
  /** One line on who the plan suits. */
  summary: string;
  monthlyPence: number;
  limits: PlanLimits;
}

export const plans: Record<PlanId, Plan> = {
  bench: {
    id: 'bench',
    name: 'Bench',
    summary: 'One calculator on one site, to try Wickstone with real visitors.',
    monthlyPence: 0,
    limits: {
      widgets: 3,
      liveWidgets: 1,
      runsPerMonth: 300,
      sheets: false,
      shippedFonts: false,
      retentionMonths: 3,
    },
  },
  field: {
    id: 'field',
    name: 'Field',
    summary: 'A practice with a few calculators across its site and client portal.',
    monthlyPence: 2900,
    limits: {
      widgets: 20,
      liveWidgets: 5,
      runsPerMonth: 5000,
      sheets: true,
      shippedFonts: true,
      retentionMonths: 24,
    },
  },
  office: {
    id: 'office',
    name: 'Office',
    summary: 'A firm with many calculators, sites and busy months.',
    monthlyPence: 9900,
    limits: {
      widgets: 100,
      liveWidgets: 25,
      runsPerMonth: 50000,
      sheets: true,
      shippedFonts: true,
      retentionMonths: 84,
    },
  },
};

export const planCurrency = 'gbp';

/** Share of the monthly run allowance at which the owner is told by e-mail. */
export const allowanceNoticeLevels = [80, 100] as const;

/** Where a firm's subscription stands, in our words (the provider's statuses map onto these). */
export const billingStates = [
  /** No paid subscription: the free plan. */
  'none',
  /** Paid and current. */
  'active',
  /** A renewal payment failed: paid features continue while the provider retries. */
  'grace',
  /** Payment retries ran out: the free plan's limits apply until the firm pays. */
  'lapsed',
  /** Cancelled: ends at the period's end, when the free plan's limits apply. */
  'ending',
] as const;
export type BillingState = (typeof billingStates)[number];

export const billingInvoiceSchema = z.object({
  id: z.string(),
  number: z.string().nullable(),
  status: z.string(),
  totalPence: z.number().int(),
  currency: z.string(),
  createdAt: z.string(),
  periodStart: z.string().nullable(),
  periodEnd: z.string().nullable(),
  /** The provider's page for the invoice; null when it has none. */
  url: z.string().nullable(),
  pdfUrl: z.string().nullable(),
});
export type BillingInvoice = z.infer<typeof billingInvoiceSchema>;

export const billingSummarySchema = z.object({
  /** The plan whose limits apply now. */
  plan: z.enum(planIds),
  /** The plan paid for (differs from `plan` when payment lapsed). */
  subscribedPlan: z.enum(planIds),
  state: z.enum(billingStates),
  currentPeriodEnd: z.string().nullable(),
  /** In grace: when the provider next tries the card. */
  nextPaymentAttempt: z.string().nullable(),
  usage: z.object({
    month: z.string(),
    runs: z.number().int(),
    runsOverAllowance: z.number().int(),
    widgets: z.number().int(),
    liveWidgets: z.number().int(),
  }),
});
export type BillingSummary = z.infer<typeof billingSummarySchema>;

export const billingInvoicesResponseSchema = z.object({ items: z.array(billingInvoiceSchema) });

export const checkoutBodySchema = z.strictObject({ plan: z.enum(paidPlanIds) });
export const checkoutResponseSchema = z.object({ url: z.string() });
export const changePlanBodySchema = z.strictObject({ plan: z.enum(paidPlanIds) });
export const checkoutReturnQuerySchema = z.strictObject({ session: z.string().min(1).max(200) });

/** The first N of a month's allowance: used against the allowance, rounded down, as a percentage. */
export function allowanceShare(used: number, allowance: number): number {
  return allowance <= 0 ? 100 : Math.floor((used * 100) / allowance);
}
