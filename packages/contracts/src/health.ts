import { z } from 'zod';

export const healthResponseSchema = z.object({
  status: z.literal('ok'),
  version: z.string(),
  uptimeS: z.number(),
  database: z.object({
    status: z.literal('up'),
    roundTripMs: z.number(),
  }),
});
export type HealthResponse = z.infer<typeof healthResponseSchema>;
