import { StyleSheet, View } from 'react-native';
import type { ProfileDetail } from '../../schemas/profiles';
import { space } from '../../constants/theme';
import { useIsWide } from '../../hooks/useLayout';
import { Card } from '../ui/Card';
import { SectionHeading } from '../ui/SectionHeading';
import { BuildUse } from './BuildUse';
import { VersionDiff } from './VersionDiff';
import { VersionList } from './VersionList';

/** One character's profile: versions and downloads, what changed, and how a build uses it. Wide: two columns. */
export function ProfilePage({ detail, mayManageTokens }: { detail: ProfileDetail; mayManageTokens: boolean }) {
  const wide = useIsWide();
  const { profile, versions } = detail;
  const fileName = `${profile.character.name.toLowerCase().replace(/[^a-z0-9]+/g, '-')}.leg-profile.json`;
  return (
    <View style={[styles.cols, wide && styles.wide]}>
      <View style={[styles.col, wide && styles.colWide]}>
        <Card>
          <SectionHeading>Versions</SectionHeading>
          <VersionList profileId={profile.id} characterName={profile.character.name} versions={versions} />
        </Card>
        <Card>
          <SectionHeading>What changed</SectionHeading>
          <VersionDiff profileId={profile.id} versions={versions} />
        </Card>
      </View>
      <View style={[styles.col, wide && styles.colWide]}>
        <Card>
          <SectionHeading>Use it in a build</SectionHeading>
          <BuildUse profileId={profile.id} fileName={fileName} mayManageTokens={mayManageTokens} />
        </Card>
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  cols: { gap: space.lg },
  wide: { flexDirection: 'row', alignItems: 'flex-start' },
  col: { gap: space.lg },
  colWide: { flex: 1, minWidth: 0 },
});
