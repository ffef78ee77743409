import { useEffect, useMemo, useState } from 'react';
import { decodeCourse } from '../engine/course/encoding';
import type { Heightfield } from '../engine/course/heightfield';
import type { CourseList } from '../schemas/courses';
import { useCourse, useCourses } from './useCourses';

/** The course a live walk (preview or drive) is shown on: the studio's courses, the one picked, and its ground. */
export interface PreviewCourse {
  /** The list of courses has arrived (empty or not). */
  loaded: boolean;
  list: CourseList['courses'];
  courseId: string | undefined;
  setCourseId(id: string): void;
  /** The next course in the list (the phone's one-button picker). */
  next(): void;
  name: string | undefined;
  heightfield: Heightfield | null;
}

/** Picks the first course once the list arrives and decodes the picked one for the engine. */
export function usePreviewCourse(): PreviewCourse {
  const courses = useCourses();
  const [courseId, setCourseId] = useState<string | undefined>(undefined);
  useEffect(() => {
    if (!courseId && courses.data?.courses.length) setCourseId(String(courses.data.courses[0].id));
  }, [courseId, courses.data]);
  const course = useCourse(Number(courseId ?? 0));
  const heightfield = useMemo(() => (course.data ? decodeCourse(course.data.encoding) : null), [course.data]);
  const list = courses.data?.courses ?? [];
  return {
    loaded: courses.isSuccess,
    list,
    courseId,
    setCourseId,
    next: () => {
      const i = list.findIndex((c) => String(c.id) === courseId);
      if (list.length) setCourseId(String(list[(i + 1) % list.length].id));
    },
    name: list.find((c) => String(c.id) === courseId)?.name,
    heightfield,
  };
}
