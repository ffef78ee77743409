import { useState } from 'react';
import { useRouter } from 'expo-router';
import { Screen } from '../../../components/layout/Screen';
import { EmptyState } from '../../../components/ui/EmptyState';
import { Button } from '../../../components/ui/Button';
import { Notice } from '../../../components/ui/Notice';
import { LoadingPage } from '../../../components/layout/LoadingPage';
import { CourseList } from '../../../components/course/CourseList';
import { GeneratorForm } from '../../../components/course/GeneratorForm';
import { SuitesSection } from '../../../components/course/SuitesSection';
import { StarterCourses } from '../../../components/course/StarterCourses';
import { useCan } from '../../../hooks/useCan';
import { useAddStarterCourses, useCourses, useCreateCourse, useCreateSuite, useDeleteSuite, useSuites, useUpdateSuite } from '../../../hooks/useCourses';

export default function CoursesScreen() {
  const router = useRouter();
  const courses = useCourses();
  const suites = useSuites();
  const create = useCreateCourse();
  const createSuite = useCreateSuite();
  const updateSuite = useUpdateSuite();
  const deleteSuite = useDeleteSuite();
  const addStarters = useAddStarterCourses();
  const mayEdit = useCan('courses.edit');
  const mayEditSuites = useCan('suites.edit');
  const [making, setMaking] = useState(false);
  const list = courses.data?.courses ?? [];
  return (
    <Screen
      title="Courses"
      lede="Strips of uneven test ground your characters walk over."
      actions={mayEdit && !making ? <Button label="New course" onPress={() => setMaking(true)} /> : null}
    >
      {making ? (
        <GeneratorForm
          onCancel={() => setMaking(false)}
          onCreate={async (input) => {
            const made = await create.mutateAsync(input);
            setMaking(false);
            router.push(`/courses/${made.course.id}`);
            return made;
          }}
        />
      ) : null}
      {courses.isPending ? <LoadingPage /> : null}
      {courses.isError ? <Notice message={courses.error.message} /> : null}
      {courses.isSuccess && list.length === 0 && !making ? (
        <StarterCourses mayEdit={mayEdit} add={addStarters} reason="No courses yet. Start with the starter set in one tap, or make your own from a generator." />
      ) : null}
      {courses.isSuccess && list.length === 0 && !making ? (
        <EmptyState
          heading="No courses yet"
          body={mayEdit ? 'Start from a generator (flat, ramp, stairs, rubble, curb, trench or a mix), then sculpt it with a finger or the mouse.' : 'An owner or designer builds courses; they will show here.'}
          points={['Raise, lower, smooth and flatten brushes', 'Side profile along the walking line', 'Suites: courses run together']}
        />
      ) : null}
      {list.length ? <CourseList courses={list} /> : null}
      {courses.isSuccess && suites.isSuccess ? (
        <SuitesSection
          suites={suites.data.suites}
          courses={list}
          mayEdit={mayEditSuites}
          onCreate={(s) => createSuite.mutateAsync(s)}
          onUpdate={(id, s) => updateSuite.mutateAsync({ id, ...s })}
          onDelete={(id) => deleteSuite.mutateAsync(id)}
        />
      ) : null}
    </Screen>
  );
}
