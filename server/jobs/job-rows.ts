/** The jobs table: reading a row into the API shape and the few writes the runner makes. */
import type { Db } from '../db';
import { notFound } from '../errors';
import type { Job, JobKind, JobStatus } from '../../schemas/jobs';

export interface JobRow {
  id: number;
  team_id: number;
  kind: JobKind;
  status: JobStatus;
  progress: number;
  input: string;
  result: string | null;
  error: string | null;
  created_by: number;
  created_at: number;
  started_at: number | null;
  finished_at: number | null;
  updated_at: number;
}

export function jobFromRow(r: JobRow): Job {
  const job: Job = {
    id: r.id,
    kind: r.kind,
    status: r.status,
    progress: r.progress,
    createdAt: Number(r.created_at),
    startedAt: r.started_at === null ? null : Number(r.started_at),
    finishedAt: r.finished_at === null ? null : Number(r.finished_at),
  };
  if (r.result !== null) job.result = JSON.parse(r.result);
  if (r.error !== null) job.error = r.error;
  return job;
}

export async function findJobRow(db: Db, teamId: number, jobId: number): Promise<JobRow> {
  const row = await db('jobs').where({ id: jobId, team_id: teamId }).first<JobRow | undefined>();
  if (!row) throw notFound('That job');
  return row;
}

export const CRASH_REASON = 'The server stopped while this job was running, so it did not finish. Nothing of it was kept; run it again.';

export const SHUTDOWN_REASON = 'The server shut down while this job was running, so it did not finish; run it again.';

/** Jobs a previous process left running can never finish: mark them failed with the reason. Returns how many. */
export async function failOrphanedJobs(db: Db, now: number): Promise<number> {
  return db('jobs').where({ status: 'running' }).update({ status: 'failed', error: CRASH_REASON, finished_at: now, updated_at: now });
}
