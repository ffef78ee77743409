/** API shape of GET /api/queue: where a team's trials and dial-ins run, for the owner's status view. */
import { z } from 'zod';

export const queueStatusSchema = z.object({
  /** `embedded`: threads inside the server process; `redis`: worker processes over a shared Redis queue. */
  runner: z.enum(['embedded', 'redis']),
  /** Workers connected (processes for `redis`, threads for `embedded`). */
  workers: z.array(z.object({ name: z.string(), address: z.string().optional() })),
  /** Tasks (one course of a trial or of a dial-in candidate), every team's, waiting for a worker and being worked on. */
  waiting: z.number().int().min(0),
  running: z.number().int().min(0),
  /** This team's jobs queued and running, from the server's own records. */
  jobsQueued: z.number().int().min(0),
  jobsRunning: z.number().int().min(0),
  /** Set when Redis is configured but the server cannot reach it at the moment. */
  problem: z.string().optional(),
});
export type QueueStatus = z.infer<typeof queueStatusSchema>;
