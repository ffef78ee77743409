import { useLocalSearchParams } from 'expo-router';
import { DialInPage } from '../../../../components/dialin/DialInPage';
import { useCharacter } from '../../../../hooks/useCharacters';
import { canDialIn } from '../../../../hooks/useDialIn';
import { useMe } from '../../../../hooks/useSession';

export default function DialInScreen() {
  const { id } = useLocalSearchParams<{ id: string }>();
  const me = useMe();
  const character = useCharacter(Number(id));
  return <DialInPage characterId={Number(id)} characterName={character.data?.character.name ?? 'Character'} mayRun={canDialIn(me.data)} />;
}
