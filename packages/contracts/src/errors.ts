import { z } from 'zod';

/**
 * Every error code the API can answer with, and the HTTP status it maps to.
 * One table, so the server and its clients agree on what a code means.
 */
export const errorStatus = {
  validation_failed: 400,
  bad_request: 400,
  unauthenticated: 401,
  /** The plan does not allow it (a widget over the plan's count): upgrading does. */
  plan_limit: 402,
  /** The payments provider declined the card. */
  payment_failed: 402,
  forbidden: 403,
  csrf_failed: 403,
  not_found: 404,
  conflict: 409,
  /** A widget key a rotation replaced, past the date it was served until. */
  key_replaced: 410,
  payload_too_large: 413,
  unsupported_media_type: 415,
  rate_limited: 429,
  internal: 500,
  service_unavailable: 503,
} as const;

export type ErrorCode = keyof typeof errorStatus;

export const errorCodes = Object.keys(errorStatus) as [ErrorCode, ...ErrorCode[]];

/** One problem with one field of a request: `field` is a dotted path such as `body.email`. */
export const fieldIssueSchema = z.object({
  field: z.string(),
  message: z.string(),
});
export type FieldIssue = z.infer<typeof fieldIssueSchema>;

/** The one error shape every route answers with. */
export const errorBodySchema = z.object({
  error: z.object({
    code: z.enum(errorCodes),
    message: z.string(),
    details: z.unknown(),
  }),
});
export type ErrorBody = z.infer<typeof errorBodySchema>;
