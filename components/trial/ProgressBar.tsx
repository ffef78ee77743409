import { StyleSheet, Text, View } from 'react-native';
import { colors, fonts, radius, space, type } from '../../constants/theme';

/** A job's progress, 0–100, with its figure; `label` says what is running. */
export function ProgressBar({ progress, label }: { progress: number; label: string }) {
  const p = Math.max(0, Math.min(100, progress));
  return (
    <View style={styles.wrap} role="progressbar" aria-valuemin={0} aria-valuemax={100} aria-valuenow={p} aria-label={label} testID="job-progress">
      <View style={styles.head}>
        <Text style={styles.label}>{label}</Text>
        <Text style={styles.figure}>{p.toFixed(0)} %</Text>
      </View>
      <View style={styles.track}>
        <View style={[styles.fill, { width: `${p}%` }]} />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.xs },
  head: { flexDirection: 'row', justifyContent: 'space-between' },
  label: { ...type.small, color: colors.ink },
  figure: { fontFamily: fonts.mono, fontSize: 13, color: colors.ink },
  track: { height: 10, borderRadius: radius.sm, backgroundColor: colors.paperDeep, overflow: 'hidden', borderWidth: 1, borderColor: colors.rule },
  fill: { height: '100%', backgroundColor: colors.moss },
});
