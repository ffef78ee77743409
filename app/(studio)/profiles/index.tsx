import { Screen } from '../../../components/layout/Screen';
import { LoadingPage } from '../../../components/layout/LoadingPage';
import { EmptyState } from '../../../components/ui/EmptyState';
import { Notice } from '../../../components/ui/Notice';
import { ProfileList } from '../../../components/profiles/ProfileList';
import { PublishPanel } from '../../../components/profiles/PublishPanel';
import { useCan } from '../../../hooks/useCan';
import { usePublishProfile, useProfiles } from '../../../hooks/useProfiles';
import { useCharacters } from '../../../hooks/useCharacters';
import { useSuites } from '../../../hooks/useCourses';

export default function ProfilesScreen() {
  const profiles = useProfiles();
  const list = profiles.data?.profiles ?? [];
  const mayPublish = useCan('profiles.publish');
  const characters = useCharacters();
  const suites = useSuites();
  const publish = usePublishProfile();
  return (
    <Screen title="Profiles" lede="Published leg profiles: the versioned JSON your game's runtime reads.">
      {profiles.isPending ? <LoadingPage /> : null}
      {profiles.isError ? <Notice message={profiles.error.message} /> : null}
      {profiles.isSuccess && list.length === 0 ? (
        <EmptyState
          heading="No profiles published"
          body="Publish a tuned leg setup to get an immutable, versioned leg profile with its schema, a download and a command for build scripts."
        />
      ) : null}
      {list.length ? <ProfileList profiles={list} /> : null}
      {mayPublish ? <PublishPanel characters={characters.data?.characters ?? []} suites={suites.data?.suites ?? []} publish={publish} /> : null}
    </Screen>
  );
}
