import { useEffect, useRef, useState } from 'react';
import { Platform, StyleSheet, Text, View } from 'react-native';
import Svg, { Circle, Line, Polyline, Text as SvgText } from 'react-native-svg';
import { colors, fonts, space, type } from '../../constants/theme';
import type { CompareResult } from '../../hooks/useCompare';
import { ChoiceChips } from '../ui/ChoiceChips';
import { ENTRY_STYLES } from './entryStyles';
import { focusFromPlot, nearestIndex, type CompareFocus, type PlotQuantity as Quantity } from './focus';

type Entry = CompareResult['entries'][number];

const QUANTITIES: { value: Quantity; label: string; unit: string; scale: number }[] = [
  { value: 'bodyHeight', label: 'Body height change', unit: 'cm', scale: 100 },
  { value: 'footError', label: 'Foot tracking error', unit: 'mm', scale: 1 },
];

const HEIGHT = 220;
const PAD = { left: 44, right: 12, top: 12, bottom: 28 };

function niceMax(v: number) {
  if (!(v > 0)) return 1;
  const p = 10 ** Math.floor(Math.log10(v));
  return [1, 2, 5, 10].map((m) => m * p).find((m) => m >= v) ?? 10 * p;
}

/**
 * The entries' series over one course drawn over each other, against distance along the course (where the
 * ground is, so a stumble on the same step lines up); each line has its own dash pattern as well as colour.
 * Hovering, touching or tapping the plot reports the point under the cursor (`onFocus`), so the table can light
 * up its rows; `focus` from elsewhere (the shared walk's playhead) marks each entry's point at that instant.
 */
export function OverlayPlot({ entries, courses, focus, onFocus }: { entries: Entry[]; courses: string[]; focus?: CompareFocus | null; onFocus?: (f: CompareFocus | null) => void }) {
  const [course, setCourse] = useState(courses[0]);
  const [quantity, setQuantity] = useState<Quantity>('bodyHeight');
  const [width, setWidth] = useState(340);
  const q = QUANTITIES.find((x) => x.value === quantity)!;
  const plots = entries.map((e) => e.plots.find((p) => p.course === course));
  let dMax = 0;
  let lo = 0;
  let hi = 0;
  for (const p of plots) {
    if (!p) continue;
    for (const d of p.distance) dMax = Math.max(dMax, d);
    for (const v of p[quantity]) {
      if (v === null) continue;
      lo = Math.min(lo, v * q.scale);
      hi = Math.max(hi, v * q.scale);
    }
  }
  const top = niceMax(hi);
  const bottom = lo < 0 ? -niceMax(-lo) : 0;
  const dEnd = niceMax(dMax);
  const x = (d: number) => PAD.left + (Math.max(0, d) / dEnd) * (width - PAD.left - PAD.right);
  const y = (v: number) => PAD.top + ((top - v) / (top - bottom)) * (HEIGHT - PAD.top - PAD.bottom);

  // Each entry's sample under the cursor: by distance when the plot is pointed at, by time when the walk is.
  const at = focus && focus.at.course === course ? focus.at : null;
  const marks = plots.map((p, i) => {
    if (!p || !at) return null;
    const k = at.distance !== undefined ? nearestIndex(p.distance, at.distance) : at.time !== undefined ? nearestIndex(p.time, at.time) : -1;
    const v = k >= 0 ? p[quantity][k] : null;
    return k < 0 || v === null ? null : { pick: entries[i].pick, i, d: p.distance[k], v: v * q.scale };
  });
  const pointAt = (px: number, py: number) => {
    const d = Math.min(dMax, Math.max(0, ((px - PAD.left) / (width - PAD.left - PAD.right)) * dEnd));
    let nearest: string | null = null;
    let best = Infinity;
    plots.forEach((p, i) => {
      if (!p) return;
      const v = p[quantity][nearestIndex(p.distance, d)];
      if (v === null || v === undefined) return;
      const gap = Math.abs(y(v * q.scale) - py);
      if (gap < best) {
        best = gap;
        nearest = entries[i].pick;
      }
    });
    onFocus?.(focusFromPlot(quantity, course, d, nearest));
  };
  const onFocusRef = useRef(onFocus);
  onFocusRef.current = onFocus;
  const pointRef = useRef(pointAt);
  pointRef.current = pointAt;
  const plotEl = useRef<View>(null);
  // The web: pointer events cover a hovering mouse, a dragging finger and a tap alike; a mouse leaving clears.
  useEffect(() => {
    if (Platform.OS !== 'web') return;
    const el = plotEl.current as unknown as HTMLElement | null;
    if (!el) return;
    const move = (e: PointerEvent) => {
      const r = el.getBoundingClientRect();
      pointRef.current(e.clientX - r.left, e.clientY - r.top);
    };
    const leave = (e: PointerEvent) => {
      if (e.pointerType === 'mouse') onFocusRef.current?.(null);
    };
    el.style.touchAction = 'pan-y';
    el.addEventListener('pointermove', move);
    el.addEventListener('pointerdown', move);
    el.addEventListener('pointerleave', leave);
    return () => {
      el.removeEventListener('pointermove', move);
      el.removeEventListener('pointerdown', move);
      el.removeEventListener('pointerleave', leave);
    };
  }, []);
  const touch =
    Platform.OS === 'web'
      ? {}
      : {
          onStartShouldSetResponder: () => true,
          onResponderGrant: (e: { nativeEvent: { locationX: number; locationY: number } }) => pointAt(e.nativeEvent.locationX, e.nativeEvent.locationY),
          onResponderMove: (e: { nativeEvent: { locationX: number; locationY: number } }) => pointAt(e.nativeEvent.locationX, e.nativeEvent.locationY),
        };
  const shown = marks.filter((m): m is NonNullable<typeof m> => !!m);
  return (
    <View style={styles.wrap}>
      <ChoiceChips label="Course" choices={courses.map((c) => ({ value: c, label: c }))} value={course} onChange={setCourse} />
      <ChoiceChips label="Plot" choices={QUANTITIES.map((x) => ({ value: x.value as Quantity, label: x.label }))} value={quantity} onChange={(v: Quantity) => setQuantity(v)} />
      <View ref={plotEl} testID="compare-plot" {...touch} onLayout={(e) => setWidth(Math.max(240, e.nativeEvent.layout.width))} aria-label={`${q.label} against distance along ${course}`} role="img">
        <Svg width={width} height={HEIGHT}>
          {[bottom, (bottom + top) / 2, top].map((v) => (
            <Line key={v} x1={PAD.left} x2={width - PAD.right} y1={y(v)} y2={y(v)} stroke={colors.rule} strokeWidth={1} />
          ))}
          {[bottom, (bottom + top) / 2, top].map((v) => (
            <SvgText key={`l${v}`} x={PAD.left - 6} y={y(v) + 4} fontSize={11} fontFamily={fonts.mono} fill={colors.graphite} textAnchor="end">
              {Number(v.toFixed(2))}
            </SvgText>
          ))}
          {[0, dEnd / 2, dEnd].map((d) => (
            <SvgText key={`d${d}`} x={x(d)} y={HEIGHT - 8} fontSize={11} fontFamily={fonts.mono} fill={colors.graphite} textAnchor={d === dEnd ? 'end' : 'middle'}>
              {`${Number(d.toFixed(1))} m`}
            </SvgText>
          ))}
          {plots.map((p, i) =>
            p ? (
              <Polyline
                key={entries[i].pick}
                points={p.distance
                  .map((d, k) => (p[quantity][k] === null ? null : `${x(d).toFixed(1)},${y((p[quantity][k] as number) * q.scale).toFixed(1)}`))
                  .filter(Boolean)
                  .join(' ')}
                fill="none"
                stroke={ENTRY_STYLES[i].color}
                strokeWidth={2}
                strokeDasharray={ENTRY_STYLES[i].dash}
              />
            ) : null,
          )}
          {at?.distance !== undefined ? <Line x1={x(at.distance)} x2={x(at.distance)} y1={PAD.top} y2={HEIGHT - PAD.bottom} stroke={colors.graphite} strokeWidth={1} strokeDasharray="3 3" /> : null}
          {shown.map((m) => (
            <Circle key={m.pick} cx={x(m.d)} cy={y(m.v)} r={focus?.cells[focus.rows[0]]?.includes(m.pick) ? 5.5 : 3.5} fill={colors.card} stroke={ENTRY_STYLES[m.i].color} strokeWidth={2} />
          ))}
        </Svg>
      </View>
      <Text style={styles.readout} testID="compare-plot-readout">
        {shown.length
          ? at?.time !== undefined
            ? `At ${at.time.toFixed(2)} s: ${shown.map((m) => `${entries[m.i].label} ${m.v.toFixed(q.unit === 'mm' ? 1 : 2)} ${q.unit} at ${m.d.toFixed(1)} m`).join(' · ')}`
            : `At ${shown[0].d.toFixed(1)} m: ${shown.map((m) => `${entries[m.i].label} ${m.v.toFixed(q.unit === 'mm' ? 1 : 2)} ${q.unit}`).join(' · ')}`
          : focus && focus.at.course !== course
            ? `The walk below is on ${focus.at.course}; pick that course here to see its instant on the plot.`
            : Platform.OS === 'web'
              ? 'Point at the plot (or tap it) to light up its rows in the table.'
              : 'Touch the plot to light up its rows in the table.'}
      </Text>
      <Text style={styles.axis}>
        {q.label} ({q.unit}) against distance along the course (m)
      </Text>
      <View style={styles.legend} role="list" aria-label="Legend">
        {entries.map((e, i) => (
          <View key={e.pick} role="listitem" style={styles.legendItem}>
            <Svg width={30} height={10}>
              <Line x1={0} x2={30} y1={5} y2={5} stroke={ENTRY_STYLES[i].color} strokeWidth={2.5} strokeDasharray={ENTRY_STYLES[i].dash} />
            </Svg>
            <Text style={styles.legendText}>
              {e.label} ({ENTRY_STYLES[i].name})
            </Text>
          </View>
        ))}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.sm },
  axis: { ...type.small, color: colors.graphite },
  readout: { fontFamily: fonts.mono, fontSize: 12, lineHeight: 17, color: colors.ink, minHeight: 34 },
  legend: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  legendItem: { flexDirection: 'row', alignItems: 'center', gap: space.xs },
  legendText: { ...type.small, color: colors.ink },
});
