import { useLocalSearchParams } from 'expo-router';
import { LoadingPage } from '../../../../components/layout/LoadingPage';
import { SetupPage } from '../../../../components/setup/SetupPage';
import { useCharacter } from '../../../../hooks/useCharacters';
import { useCan } from '../../../../hooks/useCan';
import { useAddStarterCourses } from '../../../../hooks/useCourses';
import { useLegSetups, useSaveLegSetup } from '../../../../hooks/useLegSetups';
import { usePreviewCourse } from '../../../../hooks/usePreviewCourse';
import { useTrialRunner } from '../../../../hooks/useTrialRunner';

export default function LegSetupScreen() {
  const { id } = useLocalSearchParams<{ id: string }>();
  const characterId = Number(id);
  const mayEdit = useCan('leg-setups.save');
  const mayRun = useCan('trials.run');
  const mayDialIn = useCan('dial-ins.run');
  const mayEditCourses = useCan('courses.edit');
  const addStarters = useAddStarterCourses();
  const save = useSaveLegSetup(characterId);
  const runner = useTrialRunner();
  const previewCourse = usePreviewCourse();
  const character = useCharacter(characterId);
  const list = useLegSetups(characterId);
  if (list.isPending) return <LoadingPage />;
  if (list.isError) return <LoadingPage problem={list.error.message} onRetry={() => list.refetch()} />;
  return (
    <SetupPage
      characterId={characterId}
      characterName={character.data?.character.name ?? 'Character'}
      list={list.data}
      mayEdit={mayEdit}
      mayRun={mayRun}
      mayDialIn={mayDialIn}
      mayEditCourses={mayEditCourses}
      addStarters={addStarters}
      save={save}
      runner={runner}
      previewCourse={previewCourse}
    />
  );
}
