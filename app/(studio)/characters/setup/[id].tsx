import { useLocalSearchParams } from 'expo-router';
import { LoadingPage } from '../../../../components/layout/LoadingPage';
import { SetupPage } from '../../../../components/setup/SetupPage';
import { useCharacter } from '../../../../hooks/useCharacters';
import { canEditCourses } from '../../../../hooks/useCourses';
import { canDialIn } from '../../../../hooks/useDialIn';
import { canSaveLegSetups, useLegSetups } from '../../../../hooks/useLegSetups';
import { useMe } from '../../../../hooks/useSession';
import { canRunTrials } from '../../../../hooks/useTrials';

export default function LegSetupScreen() {
  const { id } = useLocalSearchParams<{ id: string }>();
  const characterId = Number(id);
  const me = useMe();
  const character = useCharacter(characterId);
  const list = useLegSetups(characterId);
  if (list.isPending) return <LoadingPage />;
  if (list.isError) return <LoadingPage problem={list.error.message} onRetry={() => list.refetch()} />;
  return (
    <SetupPage
      characterId={characterId}
      characterName={character.data?.character.name ?? 'Character'}
      list={list.data}
      mayEdit={canSaveLegSetups(me.data)}
      mayRun={canRunTrials(me.data)}
      mayDialIn={canDialIn(me.data)}
      mayEditCourses={canEditCourses(me.data)}
    />
  );
}
