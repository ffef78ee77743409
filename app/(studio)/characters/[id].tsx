import { useLocalSearchParams } from 'expo-router';
import { CharacterPage } from '../../../components/characters/CharacterPage';
import { LoadingPage } from '../../../components/layout/LoadingPage';
import { useCan } from '../../../hooks/useCan';
import { characterFileUrl, useCharacter, useSaveLegs, useSetUnitScale } from '../../../hooks/useCharacters';

export default function CharacterScreen() {
  const { id } = useLocalSearchParams<{ id: string }>();
  const characterId = Number(id);
  const mayEdit = useCan('characters.legs.edit');
  const mayDialIn = useCan('dial-ins.run');
  const detail = useCharacter(characterId);
  const save = useSaveLegs(characterId);
  const setUnitScale = useSetUnitScale(characterId);
  if (detail.isPending) return <LoadingPage />;
  if (detail.isError) return <LoadingPage problem={detail.error.message} onRetry={() => detail.refetch()} />;
  return (
    <CharacterPage
      detail={detail.data}
      fileUrl={characterFileUrl(characterId)}
      mayEdit={mayEdit}
      mayDialIn={mayDialIn}
      setUnitScale={setUnitScale}
      onSaveLegs={async (legs) => {
        await save.mutateAsync(legs);
        await detail.refetch();
      }}
    />
  );
}
