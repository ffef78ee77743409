import { useEffect, useMemo, useRef, useState } from 'react';
import { Platform, StyleSheet, Text, View } from 'react-native';
import type { Heightfield } from '../../engine/course/heightfield';
import type { TrialSeries } from '../../engine/gait/series';
import type { Rig } from '../../engine/gait/rig';
import type { StumbleEvent } from '../../engine/metrics/trial-metrics';
import { colors, fonts, space, type } from '../../constants/theme';
import { Button } from '../ui/Button';
import { ChoiceChips } from '../ui/ChoiceChips';
import { ClipControls } from '../viewer/ClipControls';
import type { Caption } from '../viewer/clip';
import type { WalkReplay } from '../viewer/walk-replay';
import { WalkStage, type MeshStatus, type StageFocus } from '../viewer/WalkStage';
import { ScrubBar } from './ScrubBar';

const SPEEDS = ['0.1', '0.25', '0.5', '1', '2'] as const;
type Speed = (typeof SPEEDS)[number];
type Look = 'character' | 'skeleton';
const LOOKS: readonly { value: Look; label: string }[] = [
  { value: 'character', label: 'Character' },
  { value: 'skeleton', label: 'Skeleton' },
];

/**
 * 3D playback of a stored trial: the character's own mesh posed by the replay (or its skeleton), play and
 * pause, frame by frame (buttons, and the arrow keys on a wide screen), slow motion, scrubbing, a clip or a
 * still to share. `onTime` follows the playhead (s); `focus` frames a stumbling leg.
 */
export function TrialPlayback({
  series,
  course,
  rig,
  time,
  onTime,
  height,
  replay,
  replayNote,
  mesh,
  meshNote,
  events,
  focus,
  wide,
  caption,
  clipName,
}: {
  series: TrialSeries;
  course: Heightfield;
  rig: Rig;
  time: number;
  onTime(t: number): void;
  height?: number;
  replay: WalkReplay | null;
  /** Why there is no replay (yet), when there is none. */
  replayNote: string | null;
  mesh: ArrayBuffer | null;
  meshNote: string | null;
  events: readonly StumbleEvent[];
  focus: StageFocus | null;
  wide: boolean;
  caption: Caption;
  clipName: string;
}) {
  const [playing, setPlaying] = useState(false);
  const [speed, setSpeed] = useState<Speed>('1');
  const [look, setLook] = useState<Look>('character');
  const [meshStatus, setMeshStatus] = useState<MeshStatus>({ state: 'waiting' });
  const clock = useRef<{ wall: number; sample: number } | null>(null);
  const sample = useRef(time * series.rate);
  const lastShown = useRef(0);
  const canvas = useRef<HTMLCanvasElement | null>(null);
  const last = Math.max(0, series.length - 1);
  const duration = last / series.rate;
  if (!playing) sample.current = time * series.rate;

  const stop = () => {
    clock.current = null;
    setPlaying(false);
  };
  const step = (by: number) => {
    stop();
    onTime(Math.min(last, Math.max(0, Math.round(sample.current) + by)) / series.rate);
  };
  const stepRef = useRef(step);
  stepRef.current = step;

  // Arrow keys step frames on a wide screen (a keyboard is likely), unless a field has the focus.
  useEffect(() => {
    if (!wide || Platform.OS !== 'web' || typeof window === 'undefined') return;
    const key = (e: KeyboardEvent) => {
      const el = e.target as HTMLElement | null;
      if (el && (el.tagName === 'INPUT' || el.tagName === 'TEXTAREA' || el.isContentEditable)) return;
      if (e.key === 'ArrowRight' || e.key === 'ArrowLeft') {
        e.preventDefault();
        stepRef.current((e.key === 'ArrowRight' ? 1 : -1) * (e.shiftKey ? 10 : 1));
      }
    };
    window.addEventListener('keydown', key);
    return () => window.removeEventListener('keydown', key);
  }, [wide]);

  const timeAt = () => {
    if (playing) {
      const now = performance.now();
      const c = (clock.current ??= { wall: now, sample: sample.current });
      sample.current = c.sample + ((now - c.wall) / 1000) * series.rate * Number(speed);
      if (sample.current >= last) {
        sample.current = last;
        setPlaying(false);
        clock.current = null;
        onTime(duration);
      } else if (now - lastShown.current > 120) {
        // The page follows the playhead a few times a second, not every frame.
        lastShown.current = now;
        onTime(sample.current / series.rate);
      }
    }
    return sample.current / series.rate;
  };

  const walkers = useMemo(() => [{ key: 'trial', label: clipName, rig, series, replay, events, mesh }], [clipName, rig, series, replay, events, mesh]);
  const meshShown = meshStatus.state === 'shown';
  const note = meshStatus.state === 'none' ? meshStatus.reason : replayNote ?? meshNote ?? (meshStatus.state === 'waiting' ? 'Loading the character…' : null);
  const frame = Math.round(time * series.rate);

  return (
    <View style={styles.wrap}>
      <WalkStage
        course={course}
        walkers={walkers}
        timeAt={timeAt}
        animating={playing}
        revision={frame}
        skeleton={look === 'skeleton' || !meshShown}
        focus={focus}
        height={height}
        onMeshStatus={(_, s) => setMeshStatus(s)}
        onCanvas={(c) => (canvas.current = c)}
        label={meshShown && look === 'character' ? 'The character walking the trial over the course, with its foot trails, target rings and stumbles' : 'The trial as a skeleton: body, legs, feet (filled in stance) and targets (rings) over the course'}
      />
      {note ? (
        <Text style={styles.note} testID="walk-note">
          {note}
        </Text>
      ) : null}
      <View style={styles.controls}>
        <Button
          label={playing ? 'Pause' : 'Play'}
          tone="quiet"
          onPress={() => {
            if (playing) {
              onTime(sample.current / series.rate);
              stop();
            } else {
              if (sample.current >= last) onTime(0);
              clock.current = null;
              setPlaying(true);
            }
          }}
        />
        <Button label="◀" tone="quiet" accessibilityLabel="Previous frame" onPress={() => step(-1)} />
        <Button label="▶" tone="quiet" accessibilityLabel="Next frame" onPress={() => step(1)} />
        <Text style={styles.time} testID="playback-clock">
          {time.toFixed(2)} / {duration.toFixed(2)} s
        </Text>
      </View>
      <ScrubBar
        value={duration ? time / duration : 0}
        onChange={(v) => {
          stop();
          onTime(v * duration);
        }}
        label="Playhead"
      />
      <View style={styles.options}>
        <ChoiceChips label="Speed" choices={SPEEDS.map((s) => ({ value: s, label: `${s}×` }))} value={speed} onChange={(s) => { clock.current = null; setSpeed(s); }} />
        <ChoiceChips<Look>
          label="Show"
          choices={LOOKS}
          value={meshShown ? look : 'skeleton'}
          disabled={!meshShown}
          onChange={setLook}
        />
      </View>
      <ClipControls
        canvas={() => canvas.current}
        caption={caption}
        name={clipName}
        onRecording={(on) => {
          clock.current = null;
          if (on && sample.current >= last) onTime(0);
          setPlaying(on);
        }}
      />
      {wide ? <Text style={styles.note}>Arrow keys step a frame (with Shift, ten).</Text> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.sm },
  controls: { flexDirection: 'row', alignItems: 'center', gap: space.sm, flexWrap: 'wrap' },
  options: { flexDirection: 'row', flexWrap: 'wrap', gap: space.lg },
  time: { flex: 1, textAlign: 'right', fontFamily: fonts.mono, fontSize: 14, color: colors.ink, ...{ lineHeight: type.figure.lineHeight } },
  note: { ...type.small, color: colors.graphite },
});
