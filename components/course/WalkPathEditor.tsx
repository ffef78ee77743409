import { useMemo, useRef } from 'react';
import { PanResponder, StyleSheet, Text, View } from 'react-native';
import Svg, { Polyline } from 'react-native-svg';
import { createPathTrack, WALK_PATH_MIN_SPACING, type WalkPath } from '../../engine/course/walk-path';
import type { Heightfield } from '../../engine/course/heightfield';
import { colors, fonts, touchTarget } from '../../constants/theme';
import { toCourse, toScreen, type CourseFrame } from './frame';

type Point = WalkPath['points'][number];

/** Keep a point on the course: x within its width, z within its length (the schema's walkPathOutside bounds). */
function clampToCourse(hf: Heightfield, p: Point): Point {
  const half = ((hf.cols - 1) * hf.cellSize) / 2;
  const length = (hf.rows - 1) * hf.cellSize;
  const round = (v: number) => Math.round(v * 1000) / 1000;
  return { x: round(Math.max(-half, Math.min(half, p.x))), z: round(Math.max(0, Math.min(length, p.z))) };
}

/** The path the editor starts from: three points straight up the middle, as a course without one is walked. */
export function straightPath(hf: Heightfield): WalkPath {
  const length = (hf.rows - 1) * hf.cellSize;
  return { points: [0.1, 0.5, 0.9].map((f) => ({ x: 0, z: Math.round(length * f * 100) / 100 })), closed: false, speed: null };
}

/** A point after the last one, halfway from it to the course's far end (or back towards the start if at the end). */
export function pathWithPointAdded(hf: Heightfield, path: WalkPath): WalkPath {
  const length = (hf.rows - 1) * hf.cellSize;
  const last = path.points[path.points.length - 1];
  const room = length - last.z;
  const next = room > 2 * WALK_PATH_MIN_SPACING ? { x: last.x, z: last.z + room / 2 } : { x: last.x / 2, z: Math.max(0, last.z - length / 4) };
  return { ...path, points: [...path.points, clampToCourse(hf, next)] };
}

function Handle({ index, count, point, frame, hf, onMove, onDone }: { index: number; count: number; point: Point; frame: CourseFrame; hf: Heightfield; onMove(i: number, p: Point): void; onDone(): void }) {
  const start = useRef({ px: 0, py: 0 });
  const latest = useRef({ point, frame, hf, onMove, onDone });
  latest.current = { point, frame, hf, onMove, onDone };
  const responder = useRef(
    PanResponder.create({
      onStartShouldSetPanResponder: () => true,
      onMoveShouldSetPanResponder: () => true,
      onPanResponderTerminationRequest: () => false,
      onPanResponderGrant: () => {
        const { point: p, frame: f } = latest.current;
        start.current = toScreen(f, p.x, p.z);
      },
      onPanResponderMove: (_e, g) => {
        const { frame: f, hf: h, onMove: move } = latest.current;
        move(index, clampToCourse(h, toCourse(f, start.current.px + g.dx, start.current.py + g.dy)));
      },
      onPanResponderRelease: () => latest.current.onDone(),
      onPanResponderTerminate: () => latest.current.onDone(),
    }),
  ).current;
  const { px, py } = toScreen(frame, point.x, point.z);
  return (
    <View
      {...responder.panHandlers}
      role="button"
      aria-label={`Walk path point ${index + 1} of ${count}: x ${point.x.toFixed(2)} m, z ${point.z.toFixed(2)} m. Drag to move it.`}
      testID={`walk-path-point-${index + 1}`}
      style={[styles.handle, { left: px - touchTarget / 2, top: py - touchTarget / 2 }]}
    >
      <View style={[styles.dot, index === 0 && styles.first]}>
        <Text style={styles.dotText}>{index + 1}</Text>
      </View>
    </View>
  );
}

/**
 * The course's walk path over its height map: the curve the trials follow (as the engine samples it) and, when
 * `editing`, a handle on each control point to drag. Without a path, the straight line up the middle is shown.
 */
export function WalkPathEditor({ hf, frame, path, editing, onChange, onDone }: { hf: Heightfield; frame: CourseFrame; path: WalkPath | undefined; editing: boolean; onChange(i: number, p: Point): void; onDone(): void }) {
  const line = useMemo(() => {
    let pts: number[][];
    if (path) {
      try {
        const track = createPathTrack(path);
        pts = Array.from({ length: track.count }, (_, k) => [track.xz[2 * k], track.xz[2 * k + 1]]);
      } catch {
        pts = path.points.map((p) => [p.x, p.z]);
      }
    } else {
      pts = [
        [0, 0],
        [0, (hf.rows - 1) * hf.cellSize],
      ];
    }
    return pts
      .map(([x, z]) => {
        const s = toScreen(frame, x, z);
        return `${s.px.toFixed(1)},${s.py.toFixed(1)}`;
      })
      .join(' ');
  }, [path, frame, hf]);
  return (
    <View style={[StyleSheet.absoluteFill, { width: frame.width, height: frame.height }]} pointerEvents={editing ? 'box-none' : 'none'} testID="walk-path">
      <Svg width={frame.width} height={frame.height} style={StyleSheet.absoluteFill} pointerEvents="none">
        <Polyline points={line} fill="none" stroke={colors.ink} strokeWidth={path ? 3 : 2} strokeDasharray={path ? undefined : '6 6'} strokeOpacity={0.8} />
      </Svg>
      {editing && path ? path.points.map((p, i) => <Handle key={i} index={i} count={path.points.length} point={p} frame={frame} hf={hf} onMove={onChange} onDone={onDone} />) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  handle: { position: 'absolute', width: touchTarget, height: touchTarget, alignItems: 'center', justifyContent: 'center', touchAction: 'none', cursor: 'grab' } as object,
  dot: { width: 26, height: 26, borderRadius: 13, backgroundColor: colors.ember, borderWidth: 2, borderColor: colors.card, alignItems: 'center', justifyContent: 'center' },
  first: { backgroundColor: colors.moss },
  dotText: { fontFamily: fonts.monoMedium, fontSize: 12, color: colors.card },
});
