import type { AppDeps } from '../deps';
import { parseWith } from '../errors';
import { viewerOf } from '../middleware/auth';
import { courseCreateSchema, courseUpdateSchema, type CourseDetail, type CourseList } from '../../schemas/courses';
import {
  courseDetail,
  courseSummary,
  decodeRequestEncoding,
  deleteCourse,
  generateFromRecipe,
  insertCourse,
  listCourses,
  updateCourse,
} from '../services/courses';
import { addStarterCourses } from '../services/starter-courses';
import type { StarterCoursesResponse } from '../../schemas/starter-courses';
import { EDITORS } from '../role-sets';
import { declareRoutes, idOf, permission } from './declare';

/** Editors shape the ground, everyone reads it; suites (routes/suites.ts) are read under the same action. */
export const READ_COURSES = permission('courses.read', 'See courses and suites', 'member');
const EDIT = permission('courses.edit', 'Make and edit courses', EDITORS);

/** Courses: list, read (with the encoding), create from a recipe or an encoding, add the starter set, save with a version check, delete. */
export function coursesRoutes(deps: AppDeps) {
  const routes = declareRoutes('/courses');
  routes.id('id', 'That course');

  routes.get('/', READ_COURSES, async (req, res) => {
    const body: CourseList = { courses: await listCourses(deps.db, viewerOf(req).team.id) };
    res.json(body);
  });

  routes.get('/:id', READ_COURSES, async (req, res) => {
    const body: CourseDetail = await courseDetail(deps.db, viewerOf(req).team.id, idOf(req));
    res.json(body);
  });

  routes.post('/', EDIT, async (req, res) => {
    const { team, user } = viewerOf(req);
    const input = parseWith(courseCreateSchema, req.body);
    const heightfield = input.generator ? generateFromRecipe(input.generator) : decodeRequestEncoding(input.encoding);
    const id = await insertCourse(deps.db, {
      teamId: team.id,
      userId: user.id,
      name: input.name,
      heightfield,
      generator: input.generator ?? null,
      now: deps.clock.now(),
    });
    res.status(201).json(await courseDetail(deps.db, team.id, id));
  });

  // One tap for a new studio: the starter courses and suite it is missing (nothing of its own is touched).
  routes.post('/starter', EDIT, async (req, res) => {
    const { team, user } = viewerOf(req);
    const body: StarterCoursesResponse = await addStarterCourses(deps.db, team.id, user.id, deps.clock.now());
    res.status(body.added.length || body.suiteAdded ? 201 : 200).json(body);
  });

  routes.put('/:id', EDIT, async (req, res) => {
    const { team, user } = viewerOf(req);
    const id = idOf(req);
    // 404 before 400: another team's course is not there at all.
    await courseSummary(deps.db, team.id, id);
    const input = parseWith(courseUpdateSchema, req.body);
    const heightfield = input.encoding ? decodeRequestEncoding(input.encoding) : undefined;
    await updateCourse(deps.db, { teamId: team.id, userId: user.id, courseId: id, baseVersion: input.baseVersion, name: input.name, heightfield, now: deps.clock.now() });
    res.json(await courseDetail(deps.db, team.id, id));
  });

  routes.delete('/:id', EDIT, async (req, res) => {
    await deleteCourse(deps.db, viewerOf(req).team.id, idOf(req));
    res.status(204).end();
  });

  return routes;
}
