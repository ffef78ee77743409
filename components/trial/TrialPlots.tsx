import { useMemo, useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import type { Heightfield } from '../../engine/course/heightfield';
import type { LegSetup } from '../../engine/gait/leg-setup';
import type { TrialSeries } from '../../engine/gait/series';
import type { Rig } from '../../engine/gait/rig';
import { colors, space, type } from '../../constants/theme';
import { LinePlot } from '../charts/LinePlot';
import { Button } from '../ui/Button';
import { ChoiceChips } from '../ui/ChoiceChips';
import { Notice } from '../ui/Notice';
import { solverErrorPerIteration } from './solver-replay';

/** Foot height against target for a chosen leg, the body height response, and the solver's error per iteration at the playhead. */
export function TrialPlots({ series, legNames, time, rig, setup, course, duration }: { series: TrialSeries; legNames: string[]; time: number; rig: Rig; setup: LegSetup; course: Heightfield | null; duration: number }) {
  const [leg, setLeg] = useState('0');
  const [solved, setSolved] = useState<{ time: number; leg: number; errors: number[] } | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const L = series.legs;
  const i = Number(leg);
  const times = useMemo(() => Float32Array.from({ length: series.length }, (_, k) => k / series.rate), [series]);
  const foot = useMemo(() => Float32Array.from({ length: series.length }, (_, k) => series.foot[(k * L + i) * 3 + 1]), [series, i, L]);
  const target = useMemo(() => Float32Array.from({ length: series.length }, (_, k) => series.target[(k * L + i) * 3 + 1]), [series, i, L]);
  const legChoices = legNames.map((n, k) => ({ value: String(k), label: n }));

  function solveHere() {
    if (!course) return;
    try {
      const frame = Math.round(time * 60);
      setSolved({ time, leg: i, errors: solverErrorPerIteration(rig, setup, course, duration, frame, i) });
      setProblem(null);
    } catch (err) {
      setProblem((err as Error).message);
    }
  }

  return (
    <View style={styles.wrap}>
      <ChoiceChips label="Leg" choices={legChoices} value={leg} onChange={setLeg} />
      <LinePlot
        title={`Foot height against target: ${legNames[i]}`}
        xLabel="time, s"
        yLabel="height, m"
        marker={time}
        lines={[
          { label: 'target', color: colors.moss, xs: times, ys: target, dashed: true },
          { label: 'foot', color: colors.ink, xs: times, ys: foot },
        ]}
      />
      <LinePlot title="Body height (hip level): response to step-ups" xLabel="time, s" yLabel="height, m" marker={time} lines={[{ label: 'body', color: colors.ember, xs: times, ys: series.bodyHeight }]} />
      <View style={styles.solver}>
        <Text style={styles.heading}>Solver error per iteration</Text>
        <Text style={styles.note}>Replays the trial in the browser to the playhead and re-solves the chosen leg with 1, 2, … iterations.</Text>
        <Button tone="quiet" label={`Solve ${legNames[i]} at ${time.toFixed(2)} s`} onPress={solveHere} disabled={!course} />
        {!course ? <Notice tone="info" message="The course of this trial was deleted, so the frame cannot be re-solved." /> : null}
        {problem ? <Notice message={problem} /> : null}
        {solved ? (
          <LinePlot
            title={`${legNames[solved.leg]} at ${solved.time.toFixed(2)} s: ${solved.errors.length} ${solved.errors.length === 1 ? 'iteration' : 'iterations'}`}
            xLabel="iteration"
            yLabel="position error, m (log scale)"
            yLog
            lines={[{ label: 'error', color: colors.ink, xs: solved.errors.map((_, k) => k + 1), ys: solved.errors }]}
          />
        ) : null}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.lg },
  solver: { gap: space.sm },
  heading: { ...type.label, color: colors.ink },
  note: { ...type.small, color: colors.graphite },
});
