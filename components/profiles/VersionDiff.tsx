import { StyleSheet, Text, View } from 'react-native';
import type { ProfileVersionSummary } from '../../schemas/profiles';
import type { MetricDelta } from '../../engine/profile/metric-rows';
import type { ValueChange } from '../../engine/profile/diff';
import { colors, fonts, space, type } from '../../constants/theme';
import type { ProfileDiffQuery } from '../../hooks/useProfiles';
import { ChoiceChips } from '../ui/ChoiceChips';
import { Notice } from '../ui/Notice';

const show = (v: unknown) => (v === undefined ? '—' : typeof v === 'number' ? String(Number(v.toPrecision(6))) : JSON.stringify(v));
const num = (v: number | null) => (v === null ? '—' : String(Number(v.toFixed(3))));

function Changes({ title, changes }: { title: string; changes: ValueChange[] }) {
  return (
    <View style={styles.block}>
      <Text style={styles.blockTitle}>{title}</Text>
      {changes.length === 0 ? <Text style={styles.none}>No change.</Text> : null}
      {changes.map((c) => (
        <View key={c.path} style={styles.change}>
          <Text style={styles.path}>{c.path}</Text>
          <Text style={styles.values}>
            {show(c.before)} → {show(c.after)}
          </Text>
        </View>
      ))}
    </View>
  );
}

function MetricChanges({ deltas }: { deltas: MetricDelta[] }) {
  return (
    <View style={styles.block} role="table" aria-label="Metric changes">
      <Text style={styles.blockTitle}>Metrics</Text>
      {deltas.map((d) => (
        <View key={d.key} role="row" style={styles.metricRow}>
          <Text role="cell" style={styles.metricLabel}>
            {d.label}
            {d.unit ? ` (${d.unit})` : ''}
          </Text>
          <Text role="cell" style={styles.metricValue}>
            {num(d.before)} → {num(d.after)}
          </Text>
          <Text role="cell" style={[styles.verdict, d.improved === true && styles.better, d.improved === false && styles.worse]}>
            {d.improved === null ? '=' : d.improved ? '▲ better' : '▼ worse'}
          </Text>
        </View>
      ))}
    </View>
  );
}

/** Which two versions are compared: the screen holds the pick and fetches their difference. */
export interface DiffPick {
  from: number | null;
  to: number | null;
}

/** What changed between two versions: every setting, the rig mapping, the character file, and the metrics. */
export function VersionDiff({ versions, pick, onPick, diff }: { versions: ProfileVersionSummary[]; pick: DiffPick; onPick(pick: DiffPick): void; diff: ProfileDiffQuery }) {
  const choices = versions.map((v) => ({ value: String(v.version), label: `v${v.version}` }));
  const from = pick.from === null ? undefined : String(pick.from);
  const to = pick.to === null ? undefined : String(pick.to);
  const setFrom = (v: string) => onPick({ ...pick, from: Number(v) });
  const setTo = (v: string) => onPick({ ...pick, to: Number(v) });
  if (versions.length < 2) return <Text style={styles.none}>Publish a second version to see what changed.</Text>;
  const d = diff.data?.diff;
  return (
    <View style={styles.wrap}>
      <View style={styles.pickers}>
        <ChoiceChips label="From" choices={choices} value={from} onChange={setFrom} />
        <ChoiceChips label="To" choices={choices} value={to} onChange={setTo} />
      </View>
      {from === to ? <Text style={styles.none}>Pick two different versions.</Text> : null}
      {diff.isError ? <Notice message={diff.error.message} /> : null}
      {d ? (
        <>
          <Changes title="Leg setup" changes={d.settings} />
          <Changes title="Rig mapping" changes={d.rig} />
          {d.characterChanged ? <Notice tone="info" message="The character file changed between these versions." /> : null}
          <MetricChanges deltas={d.metrics} />
        </>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.md },
  pickers: { flexDirection: 'row', flexWrap: 'wrap', gap: space.lg },
  block: { gap: space.xs },
  blockTitle: { fontFamily: fonts.bodyStrong, fontSize: 15, color: colors.ink },
  none: { ...type.small, color: colors.graphite },
  change: { flexDirection: 'row', flexWrap: 'wrap', justifyContent: 'space-between', gap: space.sm, borderBottomWidth: 1, borderBottomColor: colors.rule, paddingVertical: space.xs },
  path: { fontFamily: fonts.mono, fontSize: 13, color: colors.ink },
  values: { fontFamily: fonts.monoMedium, fontSize: 13, color: colors.ink, textAlign: 'right', marginLeft: 'auto' },
  metricRow: { flexDirection: 'row', alignItems: 'center', gap: space.sm, borderBottomWidth: 1, borderBottomColor: colors.rule, paddingVertical: space.xs },
  metricLabel: { ...type.small, color: colors.ink, flex: 2 },
  metricValue: { fontFamily: fonts.mono, fontSize: 13, color: colors.ink, flex: 2, textAlign: 'right' },
  verdict: { fontFamily: fonts.bodyMedium, fontSize: 13, color: colors.graphite, width: 72, textAlign: 'right' },
  better: { color: colors.moss },
  worse: { color: colors.danger },
});
