import { useRef, useState } from 'react';
import { Pressable, StyleSheet, Text, View, type GestureResponderEvent } from 'react-native';
import Svg, { Line, Rect } from 'react-native-svg';
import { STUMBLE_KINDS, type StumbleKind } from '../../engine/metrics/stumble-thresholds';
import type { StumbleEvent } from '../../engine/metrics/trial-metrics';
import { colors, fonts, space, touchTarget, type } from '../../constants/theme';
import { GlyphAt, StumbleGlyph } from './StumbleGlyph';
import { STUMBLE_LABELS } from './stumble-glyphs';

const PAD = 10;
const ROW = 14;
/** A tap this close to a stumble's mark (px) takes that stumble (common practice, no source). */
const SNAP_PX = 12;

/**
 * Where along the element the press landed, px. Native reports locationX; on the web the press event carries
 * the pointer's clientX/pageX only, so it is measured against the element's box. Null when neither is known.
 */
export function pressOffsetX(e: GestureResponderEvent, element: unknown): number | null {
  const ne = e.nativeEvent as unknown as { locationX?: number; clientX?: number; pageX?: number };
  const box = (element as { getBoundingClientRect?: () => { left: number } } | null)?.getBoundingClientRect?.();
  if (box && Number.isFinite(ne.clientX)) return ne.clientX! - box.left;
  if (box && Number.isFinite(ne.pageX) && typeof window !== 'undefined') return ne.pageX! - (box.left + window.scrollX);
  return Number.isFinite(ne.locationX) ? ne.locationX! : null;
}

/**
 * The walk's timeline: one row per stumble kind, a mark (the kind's colour and glyph) at each stumble's
 * time, the playhead in ember. Tapping the timeline moves the playhead there.
 */
export function StumbleTimeline({
  events,
  duration,
  time,
  onSeek,
  onStumble,
  legNames,
}: {
  events: StumbleEvent[];
  duration: number;
  time: number;
  onSeek(t: number): void;
  /** A tap on (or next to) a stumble's mark: the playback jumps to it and frames its leg. */
  onStumble?(e: StumbleEvent): void;
  legNames: string[];
}) {
  const [width, setWidth] = useState(320);
  const box = useRef<View>(null);
  const w = Math.max(10, width - 2 * PAD);
  const x = (t: number) => PAD + (t / Math.max(duration, 1e-6)) * w;
  const height = PAD * 2 + ROW * STUMBLE_KINDS.length;
  const counts = Object.fromEntries(STUMBLE_KINDS.map((k) => [k, events.filter((e) => e.kind === k).length])) as Record<StumbleKind, number>;
  const near = events.filter((e) => Math.abs(e.time - time) < 0.25).slice(0, 3);
  return (
    <View style={styles.wrap} testID="stumble-timeline">
      <Pressable
        onLayout={(e) => setWidth(e.nativeEvent.layout.width)}
        ref={box}
        onPress={(e) => {
          const px = pressOffsetX(e, box.current);
          if (px === null || !(duration > 0)) return;
          let nearest: StumbleEvent | null = null;
          for (const ev of events) if (Math.abs(x(ev.time) - px) <= SNAP_PX && (!nearest || Math.abs(x(ev.time) - px) < Math.abs(x(nearest.time) - px))) nearest = ev;
          if (nearest && onStumble) onStumble(nearest);
          else onSeek(Math.min(duration, Math.max(0, ((px - PAD) / w) * duration)));
        }}
        accessibilityRole="adjustable"
        accessibilityLabel={`Stumble timeline, ${events.length} stumbles; tap to move the playhead`}
        style={{ minHeight: Math.max(touchTarget, height) }}
      >
        <Svg width={width} height={height} pointerEvents="none">
          <Rect x={PAD} y={PAD - 4} width={w} height={ROW * STUMBLE_KINDS.length + 8} fill={colors.paperDeep} rx={4} />
          {STUMBLE_KINDS.map((k, row) =>
            events
              .filter((e) => e.kind === k)
              .slice(0, 400)
              .map((e, i) => <GlyphAt key={`${k}-${i}`} kind={k} x={x(e.time)} y={PAD + ROW * row + ROW / 2} size={5} />),
          )}
          <Line x1={x(time)} y1={PAD - 6} x2={x(time)} y2={height - PAD + 6} stroke={colors.ember} strokeWidth={2} />
        </Svg>
      </Pressable>
      <View style={styles.legend}>
        {STUMBLE_KINDS.map((k) => (
          <View key={k} style={styles.key}>
            <StumbleGlyph kind={k} />
            <Text style={styles.keyText}>
              {STUMBLE_LABELS[k]} <Text style={styles.count}>{counts[k]}</Text>
            </Text>
          </View>
        ))}
      </View>
      {near.length ? (
        <Text style={styles.near}>
          At the playhead: {near.map((e) => `${STUMBLE_LABELS[e.kind].toLowerCase()} on ${legNames[e.leg] ?? `leg ${e.leg + 1}`} at ${e.time.toFixed(2)} s`).join('; ')}
        </Text>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.sm },
  legend: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  key: { flexDirection: 'row', alignItems: 'center', gap: space.xs },
  keyText: { ...type.small, color: colors.ink },
  count: { fontFamily: fonts.mono },
  near: { ...type.small, color: colors.graphite },
});
