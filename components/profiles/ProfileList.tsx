import { Pressable, StyleSheet, Text, View } from 'react-native';
import { useRouter } from 'expo-router';
import type { ProfileSummary } from '../../schemas/profiles';
import { colors, fonts, radius, space, type } from '../../constants/theme';
import { useIsWide } from '../../hooks/useLayout';
import { formatDay } from '../ui/format';
import { scoreOf } from './scoreOf';

/** Each character's leg profile: the latest version, its footing score and who published it. */
export function ProfileList({ profiles }: { profiles: ProfileSummary[] }) {
  const router = useRouter();
  const wide = useIsWide();
  return (
    <View style={[styles.list, wide && styles.grid]} role="list" aria-label="Leg profiles">
      {profiles.map((p) => (
        <View key={p.id} role="listitem" style={wide ? styles.gridItem : undefined}>
          <Pressable
            role="link"
            accessibilityLabel={`Open the leg profile of ${p.character.name}`}
            onPress={() => router.push(`/profiles/${p.id}`)}
            style={({ pressed }) => [styles.card, pressed && styles.pressed]}
          >
            <View style={styles.top}>
              <Text style={styles.name}>{p.character.name}</Text>
              <Text style={styles.version}>{p.latest ? `profile v${p.latest.version}` : '—'}</Text>
            </View>
            {p.latest ? (
              <>
                <View style={styles.figures}>
                  <View>
                    <Text style={styles.figure}>{p.latest.footingScore.toFixed(1)}</Text>
                    <Text style={styles.figureLabel}>suite footing score</Text>
                  </View>
                  <View>
                    <Text style={styles.figure}>{p.versionCount}</Text>
                    <Text style={styles.figureLabel}>{p.versionCount === 1 ? 'version' : 'versions'}</Text>
                  </View>
                </View>
                <Text style={styles.of}>On {scoreOf(p.latest)}</Text>
                <Text style={styles.meta}>
                  {p.latest.author.name} · {formatDay(p.latest.publishedAt)}
                </Text>
              </>
            ) : (
              <Text style={styles.meta}>No version published yet.</Text>
            )}
          </Pressable>
        </View>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  list: { gap: space.md },
  grid: { flexDirection: 'row', flexWrap: 'wrap' },
  gridItem: { width: '32%', minWidth: 260, flexGrow: 1 },
  card: { backgroundColor: colors.card, borderRadius: radius.lg, borderWidth: 1, borderColor: colors.rule, padding: space.lg, gap: space.sm },
  pressed: { backgroundColor: colors.paperDeep },
  top: { flexDirection: 'row', justifyContent: 'space-between', alignItems: 'baseline' },
  name: { ...type.heading, color: colors.ink },
  version: { fontFamily: fonts.monoMedium, fontSize: 15, color: colors.ink },
  figures: { flexDirection: 'row', gap: space.xl },
  figure: { fontFamily: fonts.monoMedium, fontSize: 22, color: colors.ink },
  figureLabel: { ...type.small, color: colors.graphite },
  meta: { ...type.small, color: colors.graphite },
  of: { ...type.small, fontFamily: fonts.bodyMedium, color: colors.ink },
});
