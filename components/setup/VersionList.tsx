import { Pressable, StyleSheet, Text, View } from 'react-native';
import type { LegSetupVersion } from '../../schemas/leg-setups';
import { colors, fonts, space, touchTarget, type } from '../../constants/theme';
import { formatLocalMoment } from './local-dates';

/** Saved versions, newest first; picking one loads it into the form. */
export function VersionList({ versions, onPick }: { versions: LegSetupVersion[]; onPick(v: LegSetupVersion): void }) {
  if (!versions.length) return <Text style={styles.note}>No saved versions yet: the form shows the engine’s defaults.</Text>;
  return (
    <View>
      {versions.map((v) => (
        <Pressable key={v.id} onPress={() => onPick(v)} style={styles.row} accessibilityRole="button" accessibilityLabel={`Load version ${v.version}`}>
          <Text style={styles.version}>v{v.version}</Text>
          <View style={styles.text}>
            <Text style={styles.noteText} numberOfLines={2}>
              {v.note || (v.source === 'dial-in' ? 'From a dial-in' : 'Saved from the form')}
            </Text>
            <Text style={styles.meta}>
              {v.createdBy.name} · {formatLocalMoment(v.createdAt)}
            </Text>
          </View>
        </Pressable>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', gap: space.md, alignItems: 'center', minHeight: touchTarget, paddingVertical: space.sm, borderBottomWidth: 1, borderColor: colors.rule },
  version: { fontFamily: fonts.monoMedium, fontSize: 15, color: colors.ink, width: 40, textAlign: 'right' },
  text: { flex: 1 },
  noteText: { ...type.small, color: colors.ink },
  meta: { fontSize: 12, color: colors.graphite },
  note: { ...type.small, color: colors.graphite },
});
