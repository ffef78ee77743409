import { StyleSheet, Text, View } from 'react-native';
import { FOOTING_SCORE_FORMULA } from '../../engine/metrics/footing-score';
import { STUMBLE_KINDS } from '../../engine/metrics/stumble-thresholds';
import type { TrialMetrics } from '../../engine/metrics/trial-metrics';
import { colors, fonts, radius, space, type } from '../../constants/theme';
import { StumbleGlyph } from './StumbleGlyph';
import { STUMBLE_LABELS } from './stumble-glyphs';

const fig = (v: number | null, digits = 1, unit = '') => (v === null || !Number.isFinite(v) ? '—' : `${v.toFixed(digits)}${unit}`);

function Figure({ label, value, note }: { label: string; value: string; note?: string }) {
  return (
    <View style={styles.row}>
      <View style={styles.rowText}>
        <Text style={styles.rowLabel}>{label}</Text>
        {note ? <Text style={styles.note}>{note}</Text> : null}
      </View>
      <Text style={styles.value}>{value}</Text>
    </View>
  );
}

/** The trial's figures: footing score with its formula, stumbles per 100 steps by kind, step response and tracking. */
export function MetricCards({ metrics }: { metrics: TrialMetrics }) {
  const m = metrics;
  return (
    <View style={styles.grid} testID="metric-cards">
      <View style={[styles.card, styles.scoreCard]}>
        <Text style={styles.cardTitle}>Footing score</Text>
        <Text style={styles.score} testID="footing-score">
          {m.footingScore.toFixed(1)}
        </Text>
        <Text style={styles.formula}>{FOOTING_SCORE_FORMULA.text}</Text>
      </View>
      <View style={styles.card}>
        <Text style={styles.cardTitle}>Stumbles per 100 steps</Text>
        {STUMBLE_KINDS.map((k) => (
          <View key={k} style={styles.row}>
            <View style={styles.kind}>
              <StumbleGlyph kind={k} />
              <Text style={styles.rowLabel}>{STUMBLE_LABELS[k]}</Text>
            </View>
            <Text style={styles.value}>{fig(m.stumbles[k].per100Steps)}</Text>
          </View>
        ))}
        <Figure label="Steps" value={String(m.steps)} />
      </View>
      <View style={styles.card}>
        <Text style={styles.cardTitle}>Step response</Text>
        <Figure label="Touchdown overshoot" note="mean, foot height against target" value={fig(m.touchdown.overshootMeanPercent, 1, ' %')} />
        <Figure label="Touchdown settling" note="2 % band, mean" value={fig(m.touchdown.settleMeanSeconds, 3, ' s')} />
        <Figure label="Body step-up overshoot" value={fig(m.bodyStepUp.count ? m.bodyStepUp.overshootMeanPercent : null, 1, ' %')} />
        <Figure label="Body settling" note="2 % band, mean" value={fig(m.bodyStepUp.settleMeanSeconds, 3, ' s')} />
      </View>
      <View style={styles.card}>
        <Text style={styles.cardTitle}>Tracking and solver</Text>
        <Figure label="Tracking error" note="RMS, foot to target" value={fig(m.tracking.rms * 100, 2, ' cm')} />
        <Figure label="Worst tracking error" value={fig(m.tracking.max * 100, 2, ' cm')} />
        <Figure label="Iterations per solve" value={fig(m.solver.iterationsPerSolve, 1)} />
        <Figure label="Unconverged solves" value={String(m.solver.unconverged)} />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  grid: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  card: { flexGrow: 1, flexBasis: 280, backgroundColor: colors.card, borderRadius: radius.lg, borderWidth: 1, borderColor: colors.rule, padding: space.lg, gap: space.sm },
  scoreCard: { borderColor: colors.moss },
  cardTitle: { ...type.label, color: colors.graphite },
  score: { fontFamily: fonts.monoMedium, fontSize: 40, lineHeight: 46, color: colors.ink },
  formula: { ...type.small, fontFamily: fonts.mono, color: colors.graphite },
  row: { flexDirection: 'row', justifyContent: 'space-between', alignItems: 'center', gap: space.md, minHeight: 24 },
  rowText: { flexShrink: 1 },
  rowLabel: { ...type.small, color: colors.ink },
  note: { fontSize: 11, color: colors.graphite },
  kind: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  value: { ...type.figure, color: colors.ink, textAlign: 'right' },
});
