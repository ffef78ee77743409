/**
 * API shapes of courses and suites. The heightfield itself travels as the engine's course encoding
 * (CourseEncodingSchema) and a generator recipe as the engine's course spec (CourseSpecSchema); neither is
 * redeclared here.
 */
import { z } from 'zod';
import { CourseEncodingSchema } from '../engine/course/encoding';
import { CourseSpecSchema } from '../engine/course/generators';

/**
 * Grid size a stored course may have: smaller than the engine's own bound so a course's encoding
 * (2 bytes a sample, base64) fits the API's 2 MB request limit with room to spare and a phone can draw it.
 */
export const STORED_COURSE_LIMITS = { maxCells: 250_000 } as const;

/** Most courses in one suite. */
export const MAX_SUITE_COURSES = 24;

const nameSchema = z
  .string({ error: 'Name it.' })
  .trim()
  .min(1, 'Name it.')
  .max(80, 'Use at most 80 characters.');

const idSchema = z.number({ error: 'Pick a course.' }).int().positive();

/** A recipe as stored: the engine's course spec. */
export const courseGeneratorSchema = CourseSpecSchema;
export type CourseGenerator = z.infer<typeof courseGeneratorSchema>;
export type CourseGeneratorInput = z.input<typeof courseGeneratorSchema>;

/** An encoding that also fits the stored-course limit. */
export const storedCourseEncodingSchema = CourseEncodingSchema.superRefine((e, ctx) => {
  if (e.cols * e.rows > STORED_COURSE_LIMITS.maxCells) {
    ctx.addIssue({
      code: 'custom',
      path: ['rows'],
      message: `A saved course has at most ${STORED_COURSE_LIMITS.maxCells.toLocaleString('en')} samples; ${e.cols} × ${e.rows} = ${(e.cols * e.rows).toLocaleString('en')}. Use larger cells or a shorter course.`,
    });
  }
});

const personSchema = z.object({ id: z.number().int(), name: z.string() });

/** A course in lists: its figures without the heights. */
export const courseSummarySchema = z.object({
  id: z.number().int(),
  name: z.string(),
  version: z.number().int(),
  cols: z.number().int(),
  rows: z.number().int(),
  cellSize: z.number(),
  /** Across the walk, m. */
  width: z.number(),
  /** Along the walk, m. */
  length: z.number(),
  minHeight: z.number(),
  maxHeight: z.number(),
  /** Kinds of the generator segments it was made from (empty when it was uploaded as an encoding). */
  generatorKinds: z.array(z.string()),
  createdBy: personSchema,
  updatedBy: personSchema,
  createdAt: z.number().int(),
  updatedAt: z.number().int(),
  /** Suites that hold this course. */
  suites: z.array(z.object({ id: z.number().int(), name: z.string() })),
});
export type CourseSummary = z.infer<typeof courseSummarySchema>;

export const courseListSchema = z.object({ courses: z.array(courseSummarySchema) });
export type CourseList = z.infer<typeof courseListSchema>;

/** GET /api/courses/:id. */
export const courseDetailSchema = z.object({
  course: courseSummarySchema,
  encoding: CourseEncodingSchema,
  generator: courseGeneratorSchema.nullable(),
});
export type CourseDetail = z.infer<typeof courseDetailSchema>;

/** POST /api/courses: from a generator recipe or from an encoding (exactly one). */
export const courseCreateSchema = z
  .object({
    name: nameSchema,
    generator: courseGeneratorSchema.optional(),
    encoding: storedCourseEncodingSchema.optional(),
  })
  .superRefine((c, ctx) => {
    if (!c.generator === !c.encoding) {
      ctx.addIssue({ code: 'custom', path: ['generator'], message: 'Send either a generator recipe or an encoding, not both or neither.' });
    }
  });
export type CourseCreate = z.infer<typeof courseCreateSchema>;
export type CourseCreateInput = z.input<typeof courseCreateSchema>;

/** PUT /api/courses/:id: the version the edit started from, and what changed. */
export const courseUpdateSchema = z
  .object({
    baseVersion: z.number({ error: 'Send the version this edit started from.' }).int().positive(),
    name: nameSchema.optional(),
    encoding: storedCourseEncodingSchema.optional(),
  })
  .superRefine((c, ctx) => {
    if (c.name === undefined && c.encoding === undefined) {
      ctx.addIssue({ code: 'custom', path: ['encoding'], message: 'Send a new name or new heights to save.' });
    }
  });
export type CourseUpdate = z.infer<typeof courseUpdateSchema>;

/** The body of a 409 on a stale save carries this code. */
export const COURSE_VERSION_CONFLICT = 'version_conflict';

const suiteCourseIdsSchema = z
  .array(idSchema, { error: 'Pick the courses of the suite.' })
  .min(1, 'Pick at least one course.')
  .max(MAX_SUITE_COURSES, `A suite holds at most ${MAX_SUITE_COURSES} courses.`)
  .superRefine((ids, ctx) => {
    const seen = new Set<number>();
    ids.forEach((id, i) => {
      if (seen.has(id)) ctx.addIssue({ code: 'custom', path: [i], message: 'This course is already in the suite.' });
      seen.add(id);
    });
  });

export const suiteSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  /** In running order. */
  courses: z.array(z.object({ id: z.number().int(), name: z.string(), version: z.number().int() })),
  createdBy: personSchema,
  createdAt: z.number().int(),
  updatedAt: z.number().int(),
});
export type Suite = z.infer<typeof suiteSchema>;

/** GET, POST and PUT /api/suites/:id. */
export const suiteResponseSchema = z.object({ suite: suiteSchema });
export type SuiteResponse = z.infer<typeof suiteResponseSchema>;

export const suiteListSchema = z.object({ suites: z.array(suiteSchema) });
export type SuiteList = z.infer<typeof suiteListSchema>;

export const suiteCreateSchema = z.object({ name: nameSchema, courseIds: suiteCourseIdsSchema });
export type SuiteCreate = z.infer<typeof suiteCreateSchema>;

export const suiteUpdateSchema = z
  .object({ name: nameSchema.optional(), courseIds: suiteCourseIdsSchema.optional() })
  .refine((s) => s.name !== undefined || s.courseIds !== undefined, { path: ['name'], message: 'Send a new name or new courses.' });
export type SuiteUpdate = z.infer<typeof suiteUpdateSchema>;
