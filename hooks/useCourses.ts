import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { CourseCreateInput, CourseDetail, CourseList, CourseUpdate, SuiteCreate, SuiteList, SuiteResponse, SuiteUpdate } from '../schemas/courses';
import type { StarterCoursesResponse } from '../schemas/starter-courses';
import { api, ApiError } from './api';

export const coursesKey = ['courses'] as const;
const courseKey = (id: number) => ['courses', id] as const;
export const suitesKey = ['suites'] as const;

/** The actions behind the course and suite buttons (server/routes/courses.rules.ts, suites.rules.ts). */

export function useCourses() {
  return useQuery({ queryKey: coursesKey, queryFn: () => api<CourseList>('/courses') });
}

export function useCourse(id: number) {
  return useQuery({ queryKey: courseKey(id), queryFn: () => api<CourseDetail>(`/courses/${id}`), enabled: Number.isInteger(id) && id > 0 });
}

export function useCreateCourse() {
  const client = useQueryClient();
  return useMutation<CourseDetail, ApiError, CourseCreateInput>({
    mutationFn: (body) => api<CourseDetail>('/courses', { method: 'POST', body }),
    onSuccess: (made) => {
      client.setQueryData(courseKey(made.course.id), made);
      return client.invalidateQueries({ queryKey: coursesKey });
    },
  });
}

/** Saves with the version the edit started from; a stale one rejects with ApiError status 409. */
export function useSaveCourse(id: number) {
  const client = useQueryClient();
  return useMutation<CourseDetail, ApiError, CourseUpdate>({
    mutationFn: (body) => api<CourseDetail>(`/courses/${id}`, { method: 'PUT', body }),
    onSuccess: (saved) => {
      client.setQueryData(courseKey(id), saved);
      return client.invalidateQueries({ queryKey: coursesKey, exact: true });
    },
  });
}

export function useDeleteCourse() {
  const client = useQueryClient();
  return useMutation<unknown, ApiError, number>({
    mutationFn: (id) => api(`/courses/${id}`, { method: 'DELETE' }),
    onSuccess: () => client.invalidateQueries({ queryKey: coursesKey }),
  });
}

export function useSuites() {
  return useQuery({ queryKey: suitesKey, queryFn: () => api<SuiteList>('/suites') });
}

function useSuiteChange<V>(call: (v: V) => Promise<unknown>) {
  const client = useQueryClient();
  return useMutation<unknown, ApiError, V>({
    mutationFn: call,
    onSuccess: async () => {
      await client.invalidateQueries({ queryKey: suitesKey });
      await client.invalidateQueries({ queryKey: coursesKey });
    },
  });
}

export const useCreateSuite = () => useSuiteChange((body: SuiteCreate) => api<SuiteResponse>('/suites', { method: 'POST', body }));
export const useUpdateSuite = () =>
  useSuiteChange(({ id, ...body }: SuiteUpdate & { id: number }) => api<SuiteResponse>(`/suites/${id}`, { method: 'PUT', body }));
export const useDeleteSuite = () => useSuiteChange((id: number) => api(`/suites/${id}`, { method: 'DELETE' }));

/** One tap: the starter courses and suite the studio is missing (server/services/starter-courses.ts). */
export function useAddStarterCourses() {
  const client = useQueryClient();
  return useMutation<StarterCoursesResponse, ApiError, void>({
    mutationFn: () => api<StarterCoursesResponse>('/courses/starter', { method: 'POST', body: {} }),
    onSuccess: async () => {
      await client.invalidateQueries({ queryKey: coursesKey });
      await client.invalidateQueries({ queryKey: suitesKey });
    },
  });
}
