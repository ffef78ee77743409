/** Suites in the database: named, ordered sets of one team's courses. */
import type { Knex } from 'knex';
import type { Db } from '../db';
import { HttpError, notFound } from '../errors';
import type { Suite } from '../../schemas/courses';

type Conn = Db | Knex.Transaction;

interface SuiteRow {
  id: number;
  name: string;
  created_by: number;
  creator_name: string;
  created_at: number;
  updated_at: number;
}

async function suitesOf(db: Conn, teamId: number, suiteId?: number): Promise<Suite[]> {
  const q = db('suites as s').join('users as u', 'u.id', 's.created_by').where('s.team_id', teamId);
  if (suiteId !== undefined) q.where('s.id', suiteId);
  const rows = await q.orderBy('s.name').orderBy('s.id').select<SuiteRow[]>('s.id', 's.name', 's.created_by', 'u.name as creator_name', 's.created_at', 's.updated_at');
  const members = await db('suite_courses as sc')
    .join('courses as c', 'c.id', 'sc.course_id')
    .whereIn('sc.suite_id', rows.map((r) => r.id))
    .orderBy('sc.position')
    .select<{ suite_id: number; id: number; name: string; version: number }[]>('sc.suite_id', 'c.id', 'c.name', 'c.version');
  return rows.map((r) => ({
    id: r.id,
    name: r.name,
    courses: members.filter((m) => m.suite_id === r.id).map((m) => ({ id: m.id, name: m.name, version: m.version })),
    createdBy: { id: r.created_by, name: r.creator_name },
    createdAt: Number(r.created_at),
    updatedAt: Number(r.updated_at),
  }));
}

export const listSuites = (db: Conn, teamId: number) => suitesOf(db, teamId);

export async function findSuite(db: Conn, teamId: number, suiteId: number): Promise<Suite> {
  const [suite] = await suitesOf(db, teamId, suiteId);
  if (!suite) throw notFound('That suite');
  return suite;
}

/** Every id must be one of the team's courses; the field message points at the first that is not. */
async function checkCourses(trx: Conn, teamId: number, courseIds: number[]): Promise<void> {
  const found = new Set(
    (await trx('courses').where('team_id', teamId).whereIn('id', courseIds).select<{ id: number }[]>('id')).map((r) => r.id),
  );
  const missing = courseIds.findIndex((id) => !found.has(id));
  if (missing >= 0) {
    const message = `Course ${courseIds[missing]} is not one of this team's courses.`;
    throw new HttpError(400, 'invalid_input', message, { [`courseIds.${missing}`]: message });
  }
}

async function writeMembers(trx: Knex.Transaction, suiteId: number, courseIds: number[]): Promise<void> {
  await trx('suite_courses').where('suite_id', suiteId).delete();
  await trx('suite_courses').insert(courseIds.map((course_id, position) => ({ suite_id: suiteId, course_id, position })));
}

export async function createSuite(db: Db, s: { teamId: number; userId: number; name: string; courseIds: number[]; now: number }): Promise<number> {
  return db.transaction(async (trx) => {
    await checkCourses(trx, s.teamId, s.courseIds);
    const [id] = await trx('suites').insert({ team_id: s.teamId, name: s.name, created_by: s.userId, created_at: s.now, updated_at: s.now });
    await writeMembers(trx, id, s.courseIds);
    return id;
  });
}

export async function updateSuite(db: Db, s: { teamId: number; suiteId: number; name?: string; courseIds?: number[]; now: number }): Promise<void> {
  await db.transaction(async (trx) => {
    const row = await trx('suites').where({ id: s.suiteId, team_id: s.teamId }).first('id');
    if (!row) throw notFound('That suite');
    if (s.courseIds) {
      await checkCourses(trx, s.teamId, s.courseIds);
      await writeMembers(trx, s.suiteId, s.courseIds);
    }
    await trx('suites').where({ id: s.suiteId }).update({ ...(s.name !== undefined ? { name: s.name } : {}), updated_at: s.now });
  });
}

export async function deleteSuite(db: Db, teamId: number, suiteId: number): Promise<void> {
  await db.transaction(async (trx) => {
    const row = await trx('suites').where({ id: suiteId, team_id: teamId }).first('id', 'name');
    if (!row) throw notFound('That suite');
    try {
      await trx('suites').where({ id: suiteId }).delete();
    } catch (err) {
      if ((err as { code?: string }).code === 'SQLITE_CONSTRAINT_FOREIGNKEY') {
        throw new HttpError(409, 'suite_in_use', `"${row.name}" has trials or dial-ins run over it, which keep their suite. Rename it instead of deleting it.`);
      }
      throw err;
    }
  });
}
