/** API shape of a background job (a trial or a dial-in) as GET /api/jobs/:id answers it. */
import { z } from 'zod';

export const JOB_KINDS = ['trial', 'dial-in'] as const;
export const jobKindSchema = z.enum(JOB_KINDS);
export type JobKind = z.infer<typeof jobKindSchema>;

export const JOB_STATUSES = ['queued', 'running', 'done', 'failed', 'cancelled'] as const;
export const jobStatusSchema = z.enum(JOB_STATUSES);
export type JobStatus = z.infer<typeof jobStatusSchema>;

/** Statuses a job never leaves. */
export const FINISHED_STATUSES: readonly JobStatus[] = ['done', 'failed', 'cancelled'];

export const jobSchema = z.object({
  id: z.number().int(),
  kind: jobKindSchema,
  status: jobStatusSchema,
  /** 0–100, never goes down. */
  progress: z.number().int().min(0).max(100),
  /** The kind's result once done (trial: TrialJobResult; dial-in: DialInResult), and a dial-in's best so far while it runs. */
  result: z.unknown().optional(),
  error: z.string().optional(),
  createdAt: z.number().int(),
  startedAt: z.number().int().nullable(),
  finishedAt: z.number().int().nullable(),
});
export type Job = z.infer<typeof jobSchema>;

/** 202 answer of the routes that start a job. */
export const jobAcceptedSchema = z.object({ job: jobSchema });
export type JobAccepted = z.infer<typeof jobAcceptedSchema>;
