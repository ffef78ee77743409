import { z } from 'zod';

/** GET /api/dial-ins/allowance: the month's dial-in candidates, so the cost can be weighed before starting. */
export const dialInAllowanceSchema = z.object({
  planName: z.string(),
  used: z.number().int(),
  limit: z.number().int(),
  /** "2026-12": the UTC month the allowance counts. */
  month: z.string(),
});
export type DialInAllowance = z.infer<typeof dialInAllowanceSchema>;
