/** Stored trials: reading them into the API shapes. Every query is scoped to one team. */
import type { Db } from '../db';
import { notFound } from '../errors';
import { LegSetupSchema } from '../../engine/gait/leg-setup';
import type { TrialDetail, TrialSummary } from '../../schemas/trials';
import type { Rig } from '../../engine/gait/rig';

interface TrialRow {
  id: number;
  character_id: number;
  leg_setup_id: number | null;
  leg_setup_version: number | null;
  setup: string;
  course_id: number | null;
  course_name: string;
  course_version: number;
  job_id: number | null;
  metrics: string;
  leg_names: string;
  series: string;
  footing_score: number;
  created_at: number;
  current_version: number | null;
  current_encoding: string | null;
}

const SUMMARY_COLUMNS = ['t.id', 't.character_id', 't.leg_setup_id', 's.version as leg_setup_version', 't.course_id', 't.course_name', 't.course_version', 't.job_id', 't.metrics', 't.leg_names', 't.footing_score', 't.created_at'];

const base = (db: Db, teamId: number) => db('trials as t').leftJoin('leg_setups as s', 's.id', 't.leg_setup_id').where('t.team_id', teamId);

function summaryOf(r: TrialRow): TrialSummary {
  return {
    id: r.id,
    characterId: r.character_id,
    legSetupId: r.leg_setup_id,
    legSetupVersion: r.leg_setup_version,
    courseId: r.course_id,
    courseName: r.course_name,
    courseVersion: r.course_version,
    jobId: r.job_id,
    footingScore: r.footing_score,
    metrics: JSON.parse(r.metrics),
    legNames: JSON.parse(r.leg_names),
    createdAt: Number(r.created_at),
  };
}

export async function listTrials(db: Db, teamId: number, filter: { characterId?: number; jobId?: number }): Promise<TrialSummary[]> {
  const q = base(db, teamId).select<TrialRow[]>(SUMMARY_COLUMNS).orderBy('t.id', 'desc').limit(200);
  if (filter.characterId !== undefined) q.where('t.character_id', filter.characterId);
  if (filter.jobId !== undefined) q.where('t.job_id', filter.jobId);
  return (await q).map(summaryOf);
}

export async function trialDetail(db: Db, teamId: number, id: number, rigOf: (characterId: number) => Promise<Rig>): Promise<TrialDetail> {
  const row = await base(db, teamId)
    .leftJoin('courses as c', function join() {
      this.on('c.id', '=', 't.course_id').andOn('c.team_id', '=', 't.team_id');
    })
    .where('t.id', id)
    .first<TrialRow | undefined>([...SUMMARY_COLUMNS, 't.setup', 't.series', 'c.version as current_version', 'c.encoding as current_encoding']);
  if (!row) throw notFound('That trial');
  return {
    trial: summaryOf(row),
    setup: LegSetupSchema.parse(JSON.parse(row.setup)),
    series: JSON.parse(row.series),
    course: row.current_encoding ? JSON.parse(row.current_encoding) : null,
    courseChanged: row.current_version !== null && row.current_version !== row.course_version,
    rig: await rigOf(row.character_id),
  };
}
