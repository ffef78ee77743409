import { Platform, StyleSheet, Text, View } from 'react-native';
import type { ProfileVersionSummary } from '../../schemas/profiles';
import { colors, fonts, radius, space, touchTarget, type } from '../../constants/theme';
import { profileDownloadUrl } from '../../hooks/useProfiles';
import { formatMoment } from '../ui/format';
import { scoreOf } from './scoreOf';

/** A real link on the web, so the browser downloads the file the server names (Content-Disposition: attachment). */
function DownloadLink({ href, label }: { href: string; label: string }) {
  const web = Platform.OS === 'web' ? ({ href, hrefAttrs: { download: true } } as object) : {};
  return (
    <Text role="link" accessibilityLabel={label} style={styles.download} {...web}>
      Download JSON
    </Text>
  );
}

/** Every published version, newest first: score, author, time, notes, and the file. */
export function VersionList({ profileId, characterName, versions }: { profileId: number; characterName: string; versions: ProfileVersionSummary[] }) {
  return (
    <View role="list" aria-label="Versions" style={styles.list}>
      {versions.map((v) => (
        <View key={v.version} role="listitem" aria-label={`Version ${v.version}`} style={styles.item}>
          <View style={styles.top}>
            <Text style={styles.version}>v{v.version}</Text>
            <Text style={styles.score}>
              {v.footingScore.toFixed(1)} <Text style={styles.unit}>footing score</Text>
            </Text>
          </View>
          <Text style={styles.of}>on {scoreOf(v)}</Text>
          {v.notes ? <Text style={styles.notes}>{v.notes}</Text> : null}
          <Text style={styles.meta}>
            {v.author.name} · {formatMoment(v.publishedAt)} · file {v.characterSha256.slice(0, 10)}…
          </Text>
          <DownloadLink href={profileDownloadUrl(profileId, v.version)} label={`Download ${characterName} version ${v.version} as JSON`} />
        </View>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  list: { gap: space.sm },
  item: { backgroundColor: colors.card, borderRadius: radius.md, borderWidth: 1, borderColor: colors.rule, padding: space.md, gap: space.xs },
  top: { flexDirection: 'row', justifyContent: 'space-between', alignItems: 'baseline' },
  version: { fontFamily: fonts.monoMedium, fontSize: 18, color: colors.ink },
  score: { fontFamily: fonts.monoMedium, fontSize: 16, color: colors.ink, textAlign: 'right' },
  unit: { fontFamily: fonts.body, fontSize: 13, color: colors.graphite },
  notes: { ...type.body, color: colors.ink },
  of: { ...type.small, fontFamily: fonts.bodyMedium, color: colors.ink },
  meta: { ...type.small, color: colors.graphite },
  download: {
    alignSelf: 'flex-start',
    minHeight: touchTarget,
    lineHeight: touchTarget,
    paddingHorizontal: space.md,
    borderRadius: radius.md,
    borderWidth: 1.5,
    borderColor: colors.ink,
    fontFamily: fonts.bodyStrong,
    fontSize: 15,
    color: colors.ink,
  },
});
