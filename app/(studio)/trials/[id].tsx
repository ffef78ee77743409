import { useLocalSearchParams } from 'expo-router';
import { LoadingPage } from '../../../components/layout/LoadingPage';
import { TrialPage } from '../../../components/trial/TrialPage';
import { useCharacter } from '../../../hooks/useCharacters';
import { useCan } from '../../../hooks/useCan';
import { useCharacterMesh } from '../../../hooks/useCharacterMesh';
import { useTrialRunner } from '../../../hooks/useTrialRunner';
import { useTrial } from '../../../hooks/useTrials';

export default function TrialScreen() {
  const { id } = useLocalSearchParams<{ id: string }>();
  const mayRun = useCan('trials.run');
  const detail = useTrial(Number(id));
  const character = useCharacter(detail.data?.trial.characterId ?? 0);
  const mesh = useCharacterMesh(detail.data?.trial.characterId ?? 0);
  const runner = useTrialRunner();
  if (detail.isPending) return <LoadingPage />;
  if (detail.isError) return <LoadingPage problem={detail.error.message} onRetry={() => detail.refetch()} />;
  return <TrialPage detail={detail.data} characterName={character.data?.character.name ?? 'Character'} mayRun={mayRun} mesh={mesh} runner={runner} />;
}
