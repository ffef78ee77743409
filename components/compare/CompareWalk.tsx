import { useEffect, useMemo, useRef, useState } from 'react';
import { PanResponder, Platform, StyleSheet, Text, View } from 'react-native';
import type { Heightfield } from '../../engine/course/heightfield';
import type { LegSetup } from '../../engine/gait/leg-setup';
import type { Rig } from '../../engine/gait/rig';
import type { TrialSeries } from '../../engine/gait/series';
import { runTrial } from '../../engine/gait/trial';
import type { StumbleEvent } from '../../engine/metrics/trial-metrics';
import { TRIAL_SECONDS } from '../../schemas/trials';
import { colors, fonts, space, type } from '../../constants/theme';
import type { CompareWalkerSource } from '../../hooks/useCompareWalkers';
import { useIsWide } from '../../hooks/useLayout';
import { ScrubBar } from '../trial/ScrubBar';
import { Button } from '../ui/Button';
import { Card } from '../ui/Card';
import { SectionHeading } from '../ui/SectionHeading';
import { ChoiceChips } from '../ui/ChoiceChips';
import { replayFromRecord, type WalkReplay } from '../viewer/walk-replay';
import { WalkStage, type StageWalker } from '../viewer/WalkStage';
import { focusFromWalk, type CompareFocus } from './focus';

type Layout = 'side' | 'one' | 'ghosts';
const LAYOUTS: readonly { value: Layout; label: string }[] = [
  { value: 'side', label: 'Side by side' },
  { value: 'one', label: 'One at a time' },
  { value: 'ghosts', label: 'Ghosts' },
];

interface Walk {
  series: TrialSeries;
  events: StumbleEvent[];
  replay: WalkReplay | null;
  score: number;
}

/** Walk each pick over the course with the same engine as the comparison, one per tick so the page stays live. */
function useWalks(sources: readonly { pick: string; rig: Rig | null; setup: LegSetup | null }[], course: Heightfield | null) {
  const [walks, setWalks] = useState<Record<string, Walk | { problem: string }>>({});
  const ready = sources.every((s) => s.rig && s.setup);
  const key = sources.map((s) => s.pick).join(',');
  const inputs = useRef(sources);
  inputs.current = sources;
  useEffect(() => {
    setWalks({});
    if (!course || !ready) return;
    let cancelled = false;
    let i = 0;
    const next = () => {
      if (cancelled || i >= inputs.current.length) return;
      const s = inputs.current[i++];
      let walk: Walk | { problem: string };
      try {
        const r = runTrial(s.rig!, s.setup!, course, { duration: TRIAL_SECONDS });
        walk = { series: r.series, events: r.metrics.events, replay: replayFromRecord(s.rig!, r.series), score: r.metrics.footingScore };
      } catch (err) {
        walk = { problem: (err as Error).message };
      }
      setWalks((w) => ({ ...w, [s.pick]: walk }));
      setTimeout(next, 0);
    };
    const handle = setTimeout(next, 0);
    return () => {
      cancelled = true;
      clearTimeout(handle);
    };
  }, [course, ready, key]);
  return walks;
}

/**
 * The comparison by eye: every pick walking the same course on one clock, as its own mesh. Side by side on a wide
 * screen; one at a time on a phone (swipe the name strip, or its arrows); or overlaid as ghosts over the first.
 * Once the playhead is moved or played, `onInstant` hears each instant (the course and the stumbles at that time),
 * so the table can light up the rows it concerns.
 */
export function CompareWalk({
  courses,
  courseId,
  onCourse,
  heightfield,
  sources,
  onInstant,
}: {
  /** The suite's courses; the walk is over `courseId`. */
  courses: readonly { id: number; name: string }[];
  courseId: number | undefined;
  onCourse: (id: number) => void;
  /** The chosen course's ground, null while it loads. */
  heightfield: Heightfield | null;
  sources: readonly CompareWalkerSource[];
  onInstant?: (focus: CompareFocus) => void;
}) {
  const wide = useIsWide();
  const chosen = courseId !== undefined ? String(courseId) : undefined;
  const walks = useWalks(sources, heightfield);
  const [layout, setLayout] = useState<Layout>(wide ? 'side' : 'one');
  const [shown, setShown] = useState(0);
  const [time, setTime] = useState(0);
  const [playing, setPlaying] = useState(false);
  const clock = useRef<{ wall: number; time: number } | null>(null);
  const now = useRef(0);

  const done = sources.map((s) => walks[s.pick]).filter((w): w is Walk => !!w && 'series' in w);
  const duration = done.length ? Math.max(...done.map((w) => (w.series.length - 1) / w.series.rate)) : 0;
  if (!playing) now.current = time;

  const timeAt = () => {
    if (playing) {
      const wall = performance.now();
      const c = (clock.current ??= { wall, time: now.current });
      now.current = Math.min(duration, c.time + (wall - c.wall) / 1000);
      if (now.current >= duration) {
        clock.current = null;
        setPlaying(false);
        setTime(duration);
      }
    }
    return now.current;
  };
  // The page's clock text follows a few times a second while playing.
  useEffect(() => {
    if (!playing) return;
    const timer = setInterval(() => setTime(now.current), 150);
    return () => clearInterval(timer);
  }, [playing]);

  // The instant under the playhead, told to the page once someone has moved it or pressed play.
  const moved = useRef(false);
  const courseName = courses.find((c) => String(c.id) === chosen)?.name;
  const instantRef = useRef(onInstant);
  instantRef.current = onInstant;
  useEffect(() => {
    if (!moved.current || !courseName || !done.length) return;
    instantRef.current?.(
      focusFromWalk(
        courseName,
        time,
        sources.flatMap((s) => {
          const w = walks[s.pick];
          return w && 'series' in w ? [{ pick: s.pick, events: w.events, duration: (w.series.length - 1) / w.series.rate }] : [];
        }),
      ),
    );
  }, [time, courseName, done.length]);

  const walkers: (StageWalker & { score: number | null; problem: string | null })[] = sources.map((s, i) => {
    const w = walks[s.pick];
    const ok = w && 'series' in w ? w : null;
    return {
      key: s.pick,
      label: s.label,
      rig: s.rig!,
      series: ok?.series as TrialSeries,
      replay: ok?.replay ?? null,
      events: ok?.events ?? [],
      mesh: s.mesh,
      ghost: layout === 'ghosts' && i > 0,
      score: ok?.score ?? null,
      problem: w && 'problem' in w ? w.problem : s.meshProblem,
    };
  });
  const ready = walkers.filter((w) => w.series);
  const index = Math.min(shown, Math.max(0, walkers.length - 1));
  const count = useRef(walkers.length);
  count.current = walkers.length;
  const turn = (dx: number) => {
    if (dx < -40) setShown((k) => Math.min(count.current - 1, k + 1));
    if (dx > 40) setShown((k) => Math.max(0, k - 1));
  };
  const turnRef = useRef(turn);
  turnRef.current = turn;
  // A horizontal swipe on the name strip: pointer events on the web (finger and mouse alike), the responder on native.
  const strip = useRef<View>(null);
  useEffect(() => {
    if (Platform.OS !== 'web') return;
    const el = strip.current as unknown as HTMLElement | null;
    if (!el) return;
    let start: { x: number; y: number } | null = null;
    const down = (e: PointerEvent) => (start = { x: e.clientX, y: e.clientY });
    const up = (e: PointerEvent) => {
      if (start && Math.abs(e.clientX - start.x) > Math.abs(e.clientY - start.y)) turnRef.current(e.clientX - start.x);
      start = null;
    };
    el.style.touchAction = 'pan-y';
    el.addEventListener('pointerdown', down);
    window.addEventListener('pointerup', up);
    return () => {
      el.removeEventListener('pointerdown', down);
      window.removeEventListener('pointerup', up);
    };
  }, [layout]);
  const swipe = useMemo(
    () =>
      Platform.OS === 'web'
        ? { panHandlers: {} }
        : PanResponder.create({
            onMoveShouldSetPanResponder: (_, g) => Math.abs(g.dx) > 12 && Math.abs(g.dx) > Math.abs(g.dy),
            onPanResponderRelease: (_, g) => turnRef.current(g.dx),
          }),
    [],
  );

  const stage = (ws: StageWalker[], key: string, height: number, label: string) =>
    heightfield && ws.every((w) => w.series) ? (
      <WalkStage key={key} testID="compare-walk-view" course={heightfield} walkers={ws} timeAt={timeAt} animating={playing} revision={Math.round(time * 30)} skeleton={false} height={height} label={label} />
    ) : (
      <View key={key} style={[styles.waiting, { height }]}>
        <Text style={styles.note}>Walking {ws.map((w) => w.label).join(', ')} over the course…</Text>
      </View>
    );

  let view: React.ReactNode;
  if (layout === 'side') {
    view = (
      <View style={[styles.side, !wide && styles.sideNarrow]}>
        {walkers.map((w) => (
          <View key={w.key} style={wide ? styles.sideCol : undefined}>
            {stage([w], w.key, wide ? 300 : 220, `${w.label} walking the course`)}
            <Caption walker={w} time={time} />
          </View>
        ))}
      </View>
    );
  } else if (layout === 'ghosts') {
    view = (
      <View style={styles.gap}>
        {stage(walkers, 'ghosts', wide ? 420 : 300, `${walkers.map((w) => w.label).join(' and ')} overlaid: the first solid, the others as ghosts`)}
        <Text style={styles.note}>Solid: {walkers[0]?.label}. Ghosts: {walkers.slice(1).map((w) => w.label).join(', ')}.</Text>
      </View>
    );
  } else {
    const w = walkers[index];
    view = (
      <View style={styles.gap}>
        {w ? stage([w], `one-${w.key}`, wide ? 420 : 300, `${w.label} walking the course (${index + 1} of ${walkers.length})`) : null}
        <View ref={strip} style={styles.strip} {...swipe.panHandlers} testID="compare-walk-strip">
          <Button label="‹" tone="quiet" accessibilityLabel="Previous walk" disabled={index === 0} onPress={() => setShown(index - 1)} />
          <View style={styles.stripText}>{w ? <Caption walker={w} time={time} position={`${index + 1} of ${walkers.length}`} /> : null}</View>
          <Button label="›" tone="quiet" accessibilityLabel="Next walk" disabled={index >= walkers.length - 1} onPress={() => setShown(index + 1)} />
        </View>
        <Text style={styles.note}>Swipe the name strip to see the next walk; the clock is shared.</Text>
      </View>
    );
  }

  return (
    <Card>
      <View style={styles.gap} testID="compare-walk">
      <SectionHeading>Watch them walk</SectionHeading>
      <Text style={styles.note}>Each pick walks the course here, in the browser, with the same engine and leg setup as the comparison.</Text>
      {courses.length > 1 ? <ChoiceChips label="Course" choices={courses.map((c) => ({ value: String(c.id), label: c.name }))} value={chosen} onChange={(v) => { moved.current = false; onCourse(Number(v)); setTime(0); setPlaying(false); }} /> : null}
      <ChoiceChips<Layout> label="Layout" choices={LAYOUTS} value={layout} onChange={setLayout} />
      {view}
      <View style={styles.controls}>
        <Button
          label={playing ? 'Pause' : 'Play'}
          tone="quiet"
          disabled={ready.length < walkers.length || !duration}
          onPress={() => {
            clock.current = null;
            moved.current = true;
            if (playing) {
              setTime(now.current);
              setPlaying(false);
            } else {
              if (now.current >= duration) setTime(0);
              setPlaying(true);
            }
          }}
        />
        <Text style={styles.time} testID="compare-clock">
          {time.toFixed(2)} / {duration.toFixed(2)} s
        </Text>
      </View>
      <ScrubBar
        value={duration ? time / duration : 0}
        onChange={(v) => {
          clock.current = null;
          moved.current = true;
          setPlaying(false);
          setTime(v * duration);
        }}
        label="Shared playhead"
      />
      </View>
    </Card>
  );
}

function Caption({ walker, time, position }: { walker: StageWalker & { score: number | null; problem: string | null }; time: number; position?: string }) {
  const at = walker.series ? Math.min(time, (walker.series.length - 1) / walker.series.rate) : 0;
  return (
    <View>
      <Text style={styles.name} numberOfLines={2}>
        {walker.label}
        {position ? ` · ${position}` : ''}
      </Text>
      <Text style={styles.note}>
        {walker.score !== null ? `Footing score ${walker.score.toFixed(1)} on this course · ` : ''}
        <Text style={styles.mono} testID="compare-walk-time">{at.toFixed(2)} s</Text>
      </Text>
      {walker.problem ? <Text style={styles.note}>{walker.problem}</Text> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  gap: { gap: space.sm },
  side: { flexDirection: 'row', gap: space.md },
  sideNarrow: { flexDirection: 'column' },
  sideCol: { flex: 1, minWidth: 0, gap: space.xs },
  waiting: { justifyContent: 'center', alignItems: 'center', backgroundColor: colors.paperDeep, borderRadius: 12, padding: space.md },
  strip: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  stripText: { flex: 1, minWidth: 0 },
  controls: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  time: { flex: 1, textAlign: 'right', fontFamily: fonts.mono, fontSize: 14, color: colors.ink },
  name: { ...type.small, fontFamily: fonts.bodyStrong, color: colors.ink },
  note: { ...type.small, color: colors.graphite },
  mono: { fontFamily: fonts.mono },
});
