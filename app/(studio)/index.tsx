import { HomeOverview } from '../../components/home/HomeOverview';
import { LoadingPage } from '../../components/layout/LoadingPage';
import { useCan } from '../../hooks/useCan';
import { useCharacters } from '../../hooks/useCharacters';
import { useAddStarterCourses, useCourses } from '../../hooks/useCourses';
import { useRecentTrials } from '../../hooks/useHome';
import { useMe } from '../../hooks/useSession';

export default function HomeScreen() {
  const me = useMe();
  const characters = useCharacters();
  const trials = useRecentTrials();
  const courses = useCourses();
  const mayEditCourses = useCan('courses.edit');
  const addStarters = useAddStarterCourses();
  if (characters.isPending || trials.isPending) return <LoadingPage />;
  if (characters.isError) return <LoadingPage problem={characters.error.message} onRetry={() => characters.refetch()} />;
  return (
    <HomeOverview
      teamName={me.data?.team.name}
      characters={characters.data.characters}
      trials={trials.data?.trials ?? []}
      courseCount={courses.data?.courses.length}
      mayEditCourses={mayEditCourses}
      addStarters={addStarters}
    />
  );
}
