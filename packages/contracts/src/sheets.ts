import { z } from 'zod';
import { publicKeySchema } from './widgets.js';

// Calculation sheets (a PDF of one run) and the public verification of a run.

/** Printable text only: a control character (line breaks included) could forge lines on the sheet. */
const projectText = (max: number) =>
  z
    .string()
    .trim()
    .max(max, `At most ${max} characters`)
    // eslint-disable-next-line no-control-regex
    .refine((v) => !/[\u0000-\u001f\u007f-\u009f\u2028\u2029]/.test(v), 'Control characters are not allowed')
    .optional();

/** The block a visitor may fill before downloading: all optional, printed as given. */
export const sheetProjectSchema = z.strictObject({
  project: projectText(120),
  preparedFor: projectText(120),
  note: projectText(500),
});
export type SheetProject = z.infer<typeof sheetProjectSchema>;

export const embedSheetParamsSchema = z.strictObject({ runId: z.uuid('Not a run id') });
export const embedSheetQuerySchema = sheetProjectSchema.extend({ publicKey: publicKeySchema });
/** The visitor's download from the widget: the project block given here is stored with the run. */
export const embedSheetBodySchema = sheetProjectSchema.extend({ publicKey: publicKeySchema });
export type EmbedSheetBody = z.infer<typeof embedSheetBodySchema>;
export const orgSheetQuerySchema = sheetProjectSchema;

export const verifyParamsSchema = z.strictObject({ runId: z.uuid('Not a run id') });

/** What anyone holding a run id may see: the calculation, never who ran it or any lead. */
export const verifyResponseSchema = z.object({
  runId: z.string(),
  calculator: z.object({ id: z.string(), title: z.string() }),
  createdAt: z.string(),
  /** The engine version the run was stored with, and the one that re-ran it now. */
  engineVersion: z.object({ stored: z.string(), current: z.string() }),
  inputHash: z.object({ stored: z.string(), recomputed: z.string() }),
  inputs: z.array(z.object({ id: z.string(), label: z.string(), text: z.string() })),
  outputs: z.array(
    z.object({
      id: z.string(),
      label: z.string(),
      stored: z.string(),
      recomputed: z.string(),
      agrees: z.boolean(),
    }),
  ),
  agrees: z.boolean(),
});
export type VerifyResponse = z.infer<typeof verifyResponseSchema>;
