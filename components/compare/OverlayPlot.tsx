import { useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import Svg, { Line, Polyline, Text as SvgText } from 'react-native-svg';
import { colors, fonts, space, type } from '../../constants/theme';
import type { CompareResult } from '../../hooks/useCompare';
import { ChoiceChips } from '../ui/ChoiceChips';
import { ENTRY_STYLES } from './entryStyles';

type Entry = CompareResult['entries'][number];
type Quantity = 'bodyHeight' | 'footError';

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
 */
export function OverlayPlot({ entries, courses }: { entries: Entry[]; courses: string[] }) {
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
  return (
    <View style={styles.wrap}>
      <ChoiceChips label="Course" choices={courses.map((c) => ({ value: c, label: c }))} value={course} onChange={setCourse} />
      <ChoiceChips label="Plot" choices={QUANTITIES.map((x) => ({ value: x.value as Quantity, label: x.label }))} value={quantity} onChange={(v: Quantity) => setQuantity(v)} />
      <View onLayout={(e) => setWidth(Math.max(240, e.nativeEvent.layout.width))} aria-label={`${q.label} against distance along ${course}`} role="img">
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
        </Svg>
      </View>
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
  legend: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  legendItem: { flexDirection: 'row', alignItems: 'center', gap: space.xs },
  legendText: { ...type.small, color: colors.ink },
});
