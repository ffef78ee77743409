import { Screen } from '../../../components/layout/Screen';
import { EmptyState } from '../../../components/ui/EmptyState';

export default function ProfilesScreen() {
  return (
    <Screen title="Profiles" lede="Published leg profiles: the versioned JSON your game's runtime reads.">
      <EmptyState
        heading="No profiles published"
        body="Publish a tuned leg setup to get an immutable, versioned leg profile with its schema, a download and a command for build scripts."
      />
    </Screen>
  );
}
