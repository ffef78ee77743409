/**
 * Courses in the database: loading them as engine heightfields (what trials read), listing, creating from
 * a recipe or an encoding, saving with a version check, and deleting. Every query is scoped to one team.
 */
import type { Knex } from 'knex';
import type { Db } from '../db';
import { HttpError, notFound } from '../errors';
import { CourseError, heightRange, type Heightfield } from '../../engine/course/heightfield';
import { decodeCourse, encodeCourse, type CourseEncoding } from '../../engine/course/encoding';
import { generateCourse, segmentLength } from '../../engine/course/generators';
import {
  COURSE_VERSION_CONFLICT,
  STORED_COURSE_LIMITS,
  type CourseDetail,
  type CourseGenerator,
  type CourseSummary,
} from '../../schemas/courses';

/** A course ready for the engine. */
export interface LoadedCourse {
  id: number;
  name: string;
  version: number;
  heightfield: Heightfield;
}

export interface CourseRow {
  id: number;
  team_id: number;
  name: string;
  encoding: string;
  generator: string | null;
  version: number;
  cols: number;
  rows: number;
  cell_size: number;
  min_height: number;
  max_height: number;
  created_by: number;
  updated_by: number | null;
  created_at: number;
  updated_at: number;
}

type Conn = Db | Knex.Transaction;

function loaded(row: Pick<CourseRow, 'id' | 'name' | 'version' | 'encoding'>): LoadedCourse {
  return { id: row.id, name: row.name, version: row.version, heightfield: decodeCourse(JSON.parse(row.encoding)) };
}

/** One course of a team, decoded; another team's course or a missing one is a 404. */
export async function loadCourse(db: Conn, teamId: number, courseId: number): Promise<LoadedCourse> {
  const row = await db('courses').where({ id: courseId, team_id: teamId }).first<CourseRow | undefined>('id', 'name', 'version', 'encoding');
  if (!row) throw notFound('That course');
  return loaded(row);
}

/** The courses of a team's suite in running order, decoded; a missing suite is a 404. */
export async function loadSuiteCourses(db: Conn, teamId: number, suiteId: number): Promise<LoadedCourse[]> {
  const suite = await db('suites').where({ id: suiteId, team_id: teamId }).first('id');
  if (!suite) throw notFound('That suite');
  const rows = await db('suite_courses as sc')
    .join('courses as c', 'c.id', 'sc.course_id')
    .where({ 'sc.suite_id': suiteId, 'c.team_id': teamId })
    .orderBy('sc.position')
    .select<CourseRow[]>('c.id', 'c.name', 'c.version', 'c.encoding');
  return rows.map(loaded);
}

/** The courses a trial, dial-in or suite run walks: a suite without any is a 400 saying so. */
export async function loadSuiteCoursesToRun(db: Conn, teamId: number, suiteId: number): Promise<LoadedCourse[]> {
  const courses = await loadSuiteCourses(db, teamId, suiteId);
  if (courses.length === 0) throw new HttpError(400, 'empty_suite', 'That suite has no courses yet; add one first.', { suiteId: 'This suite has no courses.' });
  return courses;
}

/** Courses by id, in that order (as a job's input lists them); one not the team's is a 404. */
export async function loadCourses(db: Conn, teamId: number, courseIds: readonly number[]): Promise<LoadedCourse[]> {
  const courses: LoadedCourse[] = [];
  for (const id of courseIds) courses.push(await loadCourse(db, teamId, id));
  return courses;
}

/** The grid figures kept beside the encoding. */
function figuresOf(hf: Heightfield) {
  const { min, max } = heightRange(hf);
  return { cols: hf.cols, rows: hf.rows, cell_size: hf.cellSize, min_height: min, max_height: max };
}

type SummaryRow = CourseRow & { creator_name: string; updater_name: string | null };

function summaryRows(db: Conn, teamId: number) {
  return db('courses as c')
    .join('users as u', 'u.id', 'c.created_by')
    .leftJoin('users as v', 'v.id', 'c.updated_by')
    .where('c.team_id', teamId)
    .select<SummaryRow[]>(
      'c.id', 'c.team_id', 'c.name', 'c.generator', 'c.version', 'c.cols', 'c.rows', 'c.cell_size', 'c.min_height', 'c.max_height',
      'c.created_by', 'c.updated_by', 'c.created_at', 'c.updated_at', 'u.name as creator_name', 'v.name as updater_name',
    );
}

async function suitesByCourse(db: Conn, teamId: number, courseIds: number[]): Promise<Map<number, { id: number; name: string }[]>> {
  const rows = await db('suite_courses as sc')
    .join('suites as s', 's.id', 'sc.suite_id')
    .where('s.team_id', teamId)
    .whereIn('sc.course_id', courseIds)
    .orderBy('s.name')
    .select<{ course_id: number; id: number; name: string }[]>('sc.course_id', 's.id', 's.name');
  const map = new Map<number, { id: number; name: string }[]>();
  for (const r of rows) {
    const list = map.get(r.course_id) ?? [];
    if (!list.some((s) => s.id === r.id)) list.push({ id: r.id, name: r.name });
    map.set(r.course_id, list);
  }
  return map;
}

function summaryOf(row: SummaryRow, suites: { id: number; name: string }[]): CourseSummary {
  const generator = row.generator ? (JSON.parse(row.generator) as CourseGenerator) : null;
  const kinds = generator ? [...new Set(generator.segments.map((s) => s.kind))] : [];
  return {
    id: row.id,
    name: row.name,
    version: row.version,
    cols: row.cols,
    rows: row.rows,
    cellSize: row.cell_size,
    width: (row.cols - 1) * row.cell_size,
    length: (row.rows - 1) * row.cell_size,
    minHeight: row.min_height,
    maxHeight: row.max_height,
    generatorKinds: kinds,
    createdBy: { id: row.created_by, name: row.creator_name },
    updatedBy: { id: row.updated_by ?? row.created_by, name: row.updater_name ?? row.creator_name },
    createdAt: Number(row.created_at),
    updatedAt: Number(row.updated_at),
    suites,
  };
}

export async function listCourses(db: Conn, teamId: number): Promise<CourseSummary[]> {
  const rows = await summaryRows(db, teamId).orderBy('c.name').orderBy('c.id');
  const suites = await suitesByCourse(db, teamId, rows.map((r) => r.id));
  return rows.map((r) => summaryOf(r, suites.get(r.id) ?? []));
}

export async function courseSummary(db: Conn, teamId: number, courseId: number): Promise<CourseSummary> {
  const row = (await summaryRows(db, teamId).where('c.id', courseId))[0];
  if (!row) throw notFound('That course');
  const suites = await suitesByCourse(db, teamId, [courseId]);
  return summaryOf(row, suites.get(courseId) ?? []);
}

export async function courseDetail(db: Conn, teamId: number, courseId: number): Promise<CourseDetail> {
  const course = await courseSummary(db, teamId, courseId);
  const row = await db('courses').where({ id: courseId, team_id: teamId }).first<Pick<CourseRow, 'encoding' | 'generator'>>('encoding', 'generator');
  return {
    course,
    encoding: JSON.parse(row.encoding) as CourseEncoding,
    generator: row.generator ? (JSON.parse(row.generator) as CourseGenerator) : null,
  };
}

/** Strips the engine's "invalid course encoding:" preamble so a field message reads on its own. */
function plainMessage(err: CourseError): string {
  return err.message.replace(/^invalid [a-z ]+:\s*/i, '').replace(/^heights:\s*/, '');
}

/** Decodes an encoding from a request; heights out of bounds become a field message on `${field}.heights`. */
export function decodeRequestEncoding(encoding: unknown, field = 'encoding'): Heightfield {
  try {
    return decodeCourse(encoding);
  } catch (err) {
    if (!(err instanceof CourseError)) throw err;
    const message = plainMessage(err);
    throw new HttpError(400, 'invalid_course', `The course heights cannot be used: ${message}`, { [`${field}.heights`]: message });
  }
}

/** Grid a recipe would make, without making it. */
function recipeGrid(recipe: CourseGenerator): { cols: number; rows: number } {
  const length = recipe.segments.reduce((sum, s) => sum + segmentLength(s), 0);
  return {
    cols: Math.ceil(recipe.width / recipe.cellSize - 1e-9) + 1,
    rows: Math.ceil(length / recipe.cellSize - 1e-9) + 1,
  };
}

/** Builds a recipe's heightfield; recipes too big to store or out of the height bounds are a 400 naming why. */
export function generateFromRecipe(recipe: CourseGenerator, field = 'generator'): Heightfield {
  const { cols, rows } = recipeGrid(recipe);
  if (cols * rows > STORED_COURSE_LIMITS.maxCells) {
    const message = `This recipe makes ${cols} × ${rows} = ${(cols * rows).toLocaleString('en')} samples; a saved course has at most ${STORED_COURSE_LIMITS.maxCells.toLocaleString('en')}. Use larger cells or a shorter course.`;
    throw new HttpError(400, 'course_too_large', message, { [`${field}.cellSize`]: message });
  }
  try {
    return generateCourse(recipe);
  } catch (err) {
    if (!(err instanceof CourseError)) throw err;
    const message = plainMessage(err);
    throw new HttpError(400, 'invalid_course', `The recipe cannot be built: ${message}`, { [field]: message });
  }
}

export interface NewCourse {
  teamId: number;
  userId: number;
  name: string;
  heightfield: Heightfield;
  generator: CourseGenerator | null;
  now: number;
}

export async function insertCourse(db: Conn, c: NewCourse): Promise<number> {
  const [id] = await db('courses').insert({
    team_id: c.teamId,
    name: c.name,
    encoding: JSON.stringify(encodeCourse(c.heightfield)),
    generator: c.generator ? JSON.stringify(c.generator) : null,
    version: 1,
    ...figuresOf(c.heightfield),
    created_by: c.userId,
    updated_by: c.userId,
    created_at: c.now,
    updated_at: c.now,
  });
  return typeof id === 'object' ? (id as { id: number }).id : id;
}

export interface CourseEdit {
  teamId: number;
  userId: number;
  courseId: number;
  baseVersion: number;
  name?: string;
  heightfield?: Heightfield;
  now: number;
}

/**
 * Saves an edit only if the course is still at the version the edit started from (compare-and-set in one
 * UPDATE); otherwise answers 409 with the current version so the editor can reload or save a copy.
 */
export async function updateCourse(db: Db, e: CourseEdit): Promise<number> {
  return db.transaction(async (trx) => {
    const patch: Record<string, unknown> = { version: e.baseVersion + 1, updated_by: e.userId, updated_at: e.now };
    if (e.name !== undefined) patch.name = e.name;
    if (e.heightfield) Object.assign(patch, { encoding: JSON.stringify(encodeCourse(e.heightfield)), ...figuresOf(e.heightfield) });
    const changed = await trx('courses').where({ id: e.courseId, team_id: e.teamId, version: e.baseVersion }).update(patch);
    if (changed === 1) return e.baseVersion + 1;
    const current = await trx('courses as c')
      .join('users as u', 'u.id', trx.raw('coalesce(c.updated_by, c.created_by)'))
      .where({ 'c.id': e.courseId, 'c.team_id': e.teamId })
      .first<{ version: number; name: string } | undefined>('c.version', 'u.name');
    if (!current) throw notFound('That course');
    throw new HttpError(
      409,
      COURSE_VERSION_CONFLICT,
      `This course was saved by ${current.name} while you edited it (your edit started from version ${e.baseVersion}; it is now at version ${current.version}). Reload it, or save your edit as a copy.`,
      { baseVersion: `The course is now at version ${current.version}.` },
    );
  });
}

/**
 * Deletes a course unless a suite holds it: removing it silently would change what that suite measures,
 * so the refusal names the suites to edit first.
 */
export async function deleteCourse(db: Db, teamId: number, courseId: number): Promise<void> {
  await db.transaction(async (trx) => {
    const row = await trx('courses').where({ id: courseId, team_id: teamId }).first('id', 'name');
    if (!row) throw notFound('That course');
    const suites = await trx('suite_courses as sc')
      .join('suites as s', 's.id', 'sc.suite_id')
      .where({ 'sc.course_id': courseId, 's.team_id': teamId })
      .distinct('s.name')
      .orderBy('s.name');
    if (suites.length) {
      const names = suites.map((s: { name: string }) => `"${s.name}"`).join(', ');
      throw new HttpError(409, 'course_in_suite', `"${row.name}" is part of the suite${suites.length > 1 ? 's' : ''} ${names}. Take it out of ${suites.length > 1 ? 'them' : 'it'} first, then delete it.`);
    }
    try {
      await trx('courses').where({ id: courseId, team_id: teamId }).delete();
    } catch (err) {
      // Other tables (trials) may point at a course; SQLite refuses the delete then.
      if ((err as { code?: string }).code === 'SQLITE_CONSTRAINT_FOREIGNKEY') {
        throw new HttpError(409, 'course_in_use', `"${row.name}" has trials run over it, which keep their course. Rename it instead of deleting it.`);
      }
      throw err;
    }
  });
}

