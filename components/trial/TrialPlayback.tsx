import { useRef, useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import type { Heightfield } from '../../engine/course/heightfield';
import type { TrialSeries } from '../../engine/gait/series';
import type { Rig } from '../../engine/gait/rig';
import { colors, fonts, space, type } from '../../constants/theme';
import { Button } from '../ui/Button';
import { ChoiceChips } from '../ui/ChoiceChips';
import { ScrubBar } from './ScrubBar';
import { poseOfSample } from './series-pose';
import { WalkView } from './WalkView';

const SPEEDS = ['0.25', '0.5', '1', '2'] as const;
type Speed = (typeof SPEEDS)[number];

/** 3D playback of a stored series: play, pause, scrub and speed; `onTime` follows the playhead (s). */
export function TrialPlayback({ series, course, rig, time, onTime, height }: { series: TrialSeries; course: Heightfield; rig: Rig; time: number; onTime(t: number): void; height?: number }) {
  const [playing, setPlaying] = useState(false);
  const [speed, setSpeed] = useState<Speed>('1');
  const clock = useRef<{ wall: number; sample: number } | null>(null);
  const sample = useRef(time * series.rate);
  const lastShown = useRef(0);
  const duration = Math.max(0, (series.length - 1) / series.rate);
  if (!playing) sample.current = time * series.rate;

  const poseAt = () => {
    if (playing) {
      const now = performance.now();
      const c = (clock.current ??= { wall: now, sample: sample.current });
      sample.current = c.sample + ((now - c.wall) / 1000) * series.rate * Number(speed);
      if (sample.current >= series.length - 1) {
        sample.current = series.length - 1;
        setPlaying(false);
        clock.current = null;
      }
      // The page follows the playhead a few times a second, not every frame.
      if (now - lastShown.current > 120) {
        lastShown.current = now;
        onTime(sample.current / series.rate);
      }
    }
    return poseOfSample(series, sample.current);
  };

  return (
    <View style={styles.wrap}>
      <WalkView course={course} rig={rig} poseAt={poseAt} animating={playing} revision={Math.round(time * series.rate)} height={height} label="3D playback of the trial: the body, each leg, the feet (filled in stance) and their targets (rings) over the course" />
      <View style={styles.controls}>
        <Button
          label={playing ? 'Pause' : 'Play'}
          tone="quiet"
          onPress={() => {
            if (playing) {
              onTime(sample.current / series.rate);
              clock.current = null;
              setPlaying(false);
            } else {
              if (sample.current >= series.length - 1) onTime(0);
              clock.current = null;
              setPlaying(true);
            }
          }}
        />
        <Text style={styles.time}>
          {time.toFixed(2)} / {duration.toFixed(2)} s
        </Text>
      </View>
      <ScrubBar
        value={duration ? time / duration : 0}
        onChange={(v) => {
          clock.current = null;
          setPlaying(false);
          onTime(v * duration);
        }}
        label="Playhead"
      />
      <ChoiceChips label="Speed" choices={SPEEDS.map((s) => ({ value: s, label: `${s}×` }))} value={speed} onChange={(s) => { clock.current = null; setSpeed(s); }} />
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.sm },
  controls: { flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', gap: space.md },
  time: { fontFamily: fonts.mono, fontSize: 14, color: colors.ink, ...{ lineHeight: type.figure.lineHeight } },
});
