import { z } from 'zod';

/** POST /api/courses/starter: what the one tap added (names), and the starter suite's id. */
export const starterCoursesResponseSchema = z.object({
  added: z.array(z.string()),
  suiteId: z.number().int(),
  suiteAdded: z.boolean(),
});
export type StarterCoursesResponse = z.infer<typeof starterCoursesResponseSchema>;
