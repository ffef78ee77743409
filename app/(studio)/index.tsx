import { Screen } from '../../components/layout/Screen';
import { EmptyState } from '../../components/ui/EmptyState';
import { useMe } from '../../hooks/useSession';

export default function HomeScreen() {
  const me = useMe();
  return (
    <Screen title="Home" lede={me.data ? `${me.data.team.name}: how every character's footing is doing.` : undefined}>
      <EmptyState
        heading="No characters walking yet"
        body="Each character you bring will show here with its latest footing score and how it has moved since the last trial."
        points={['Upload a glTF character under Characters', 'Run it over a course', 'Watch the footing score trend here']}
      />
    </Screen>
  );
}
