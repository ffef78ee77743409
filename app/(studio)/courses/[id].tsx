import { useLocalSearchParams, useRouter } from 'expo-router';
import { CourseEditor } from '../../../components/course/CourseEditor';
import { LoadingPage } from '../../../components/layout/LoadingPage';
import { useCan } from '../../../hooks/useCan';
import { useCourse, useCreateCourse, useDeleteCourse, useSaveCourse } from '../../../hooks/useCourses';

export default function CourseScreen() {
  const { id } = useLocalSearchParams<{ id: string }>();
  const courseId = Number(id);
  const router = useRouter();
  const mayEdit = useCan('courses.edit');
  const detail = useCourse(courseId);
  const save = useSaveCourse(courseId);
  const create = useCreateCourse();
  const remove = useDeleteCourse();
  if (detail.isPending) return <LoadingPage />;
  if (detail.isError) return <LoadingPage problem={detail.error.message} onRetry={() => detail.refetch()} />;
  return (
    <CourseEditor
      key={courseId}
      detail={detail.data}
      mayEdit={mayEdit}
      onSave={(update) => save.mutateAsync(update)}
      onReload={async () => {
        const fresh = await detail.refetch({ throwOnError: true });
        return fresh.data!;
      }}
      onSaveCopy={async (name, encoding) => {
        const made = await create.mutateAsync({ name, encoding });
        router.replace(`/courses/${made.course.id}`);
      }}
      onDelete={async () => {
        await remove.mutateAsync(courseId);
        router.replace('/courses');
      }}
    />
  );
}
