import { useLocalSearchParams } from 'expo-router';
import { LoadingPage } from '../../../components/layout/LoadingPage';
import { TrialPage } from '../../../components/trial/TrialPage';
import { useCharacter } from '../../../hooks/useCharacters';
import { useMe } from '../../../hooks/useSession';
import { canRunTrials, useTrial } from '../../../hooks/useTrials';

export default function TrialScreen() {
  const { id } = useLocalSearchParams<{ id: string }>();
  const me = useMe();
  const detail = useTrial(Number(id));
  const character = useCharacter(detail.data?.trial.characterId ?? 0);
  if (detail.isPending) return <LoadingPage />;
  if (detail.isError) return <LoadingPage problem={detail.error.message} onRetry={() => detail.refetch()} />;
  return <TrialPage detail={detail.data} characterName={character.data?.character.name ?? 'Character'} mayRun={canRunTrials(me.data)} />;
}
