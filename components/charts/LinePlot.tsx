import { useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import Svg, { Line, Polyline, Text as SvgText } from 'react-native-svg';
import { colors, fonts, space, type } from '../../constants/theme';

export interface PlotLine {
  label: string;
  color: string;
  xs: ArrayLike<number>;
  ys: ArrayLike<number>;
  dashed?: boolean;
}

const PAD = { left: 44, right: 10, top: 10, bottom: 28 };
/** Most points drawn per line: more than a phone has pixels across. */
const MAX_POINTS = 600;

function extent(lines: PlotLine[], key: 'xs' | 'ys'): [number, number] {
  let lo = Infinity;
  let hi = -Infinity;
  for (const l of lines) for (let i = 0; i < l[key].length; i++) {
    const v = l[key][i];
    if (Number.isFinite(v)) {
      lo = Math.min(lo, v);
      hi = Math.max(hi, v);
    }
  }
  if (!Number.isFinite(lo)) return [0, 1];
  if (hi - lo < 1e-9) return [lo - 0.5, hi + 0.5];
  return [lo, hi];
}

/**
 * Tick labels at one precision per axis, taken from the axis' span: 0 to 0.96 m reads 0.00, 0.48, 0.96 (not a
 * stray -0.00039), 0.50 to 0.55 reads 0.500, 0.525, 0.550, and whole-number axes (iterations) read 1 and 18.
 */
export function axisTicks(lo: number, hi: number, values: number[]): string[] {
  const span = hi - lo;
  if (values.every(Number.isInteger) && span >= 2) return values.map((v) => v.toFixed(0));
  const decimals = Math.min(6, Math.max(span >= 100 ? 0 : 1, 1 - Math.floor(Math.log10(span))));
  return values.map((v) => v.toFixed(decimals).replace(/^-(0\.?0*)$/, '$1'));
}

/** A log axis' tick: two figures, in powers of ten below 0.01 so it fits beside the axis (7.6e-5, not .000076). */
export const logTickText = (v: number) => (v >= 0.01 && v < 1e4 ? String(Number(v.toPrecision(2))) : v.toExponential(1).replace('e+', 'e'));

/** Room left of the y axis for its longest label (10 px IBM Plex Mono is 6 px a figure). */
const yLabelRoom = (labels: string[]) => Math.max(PAD.left, 8 + 6 * Math.max(...labels.map((l) => l.length)));

/** A small line plot drawn with react-native-svg; `marker` draws a vertical line at that x (the playhead). */
export function LinePlot({ title, lines, xLabel, yLabel, height = 180, marker, yLog = false }: { title: string; lines: PlotLine[]; xLabel: string; yLabel: string; height?: number; marker?: number; yLog?: boolean }) {
  const [width, setWidth] = useState(320);
  const shown = yLog ? lines.map((l) => ({ ...l, ys: Array.from(l.ys, (v) => (v > 0 ? Math.log10(v) : NaN)) })) : lines;
  const [x0, x1] = extent(shown, 'xs');
  const [y0, y1] = extent(shown, 'ys');
  const yTicks = [y0, (y0 + y1) / 2, y1];
  const yTickLabels = yLog ? yTicks.map((v) => logTickText(10 ** v)) : axisTicks(y0, y1, yTicks);
  const xTickLabels = axisTicks(x0, x1, [x0, x1]);
  const left = yLabelRoom(yTickLabels);
  const w = Math.max(10, width - left - PAD.right);
  const h = Math.max(10, height - PAD.top - PAD.bottom);
  const sx = (x: number) => left + ((x - x0) / (x1 - x0)) * w;
  const sy = (y: number) => PAD.top + (1 - (y - y0) / (y1 - y0)) * h;
  return (
    <View style={styles.wrap} onLayout={(e) => setWidth(e.nativeEvent.layout.width)}>
      <Text style={styles.title}>{title}</Text>
      <Svg width={width} height={height} accessibilityLabel={`${title}: ${yLabel} against ${xLabel}`}>
        <Line x1={left} y1={PAD.top + h} x2={left + w} y2={PAD.top + h} stroke={colors.rule} strokeWidth={1} />
        <Line x1={left} y1={PAD.top} x2={left} y2={PAD.top + h} stroke={colors.rule} strokeWidth={1} />
        {yTicks.map((v, i) => (
          <SvgText key={i} x={left - 4} y={sy(v) + 4} fontSize={10} fontFamily={fonts.mono} fill={colors.graphite} textAnchor="end">
            {yTickLabels[i]}
          </SvgText>
        ))}
        {[x0, x1].map((v, i) => (
          <SvgText key={i} x={sx(v)} y={PAD.top + h + 14} fontSize={10} fontFamily={fonts.mono} fill={colors.graphite} textAnchor={i ? 'end' : 'start'}>
            {xTickLabels[i]}
          </SvgText>
        ))}
        <SvgText x={left + w / 2} y={height - 2} fontSize={11} fill={colors.graphite} textAnchor="middle">
          {xLabel}
        </SvgText>
        {shown.map((l) => {
          const n = l.xs.length;
          const every = Math.max(1, Math.ceil(n / MAX_POINTS));
          const pts: string[] = [];
          for (let i = 0; i < n; i += every) if (Number.isFinite(l.ys[i])) pts.push(`${sx(l.xs[i]).toFixed(1)},${sy(l.ys[i]).toFixed(1)}`);
          return <Polyline key={l.label} points={pts.join(' ')} fill="none" stroke={l.color} strokeWidth={1.6} strokeDasharray={l.dashed ? '5,4' : undefined} />;
        })}
        {marker !== undefined && marker >= x0 && marker <= x1 ? <Line x1={sx(marker)} y1={PAD.top} x2={sx(marker)} y2={PAD.top + h} stroke={colors.ember} strokeWidth={1.5} /> : null}
      </Svg>
      <View style={styles.legend}>
        <Text style={styles.axis}>{yLabel}</Text>
        {lines.map((l) => (
          <Text key={l.label} style={[styles.key, { color: l.color }]}>
            {l.dashed ? '╌ ' : '— '}
            {l.label}
          </Text>
        ))}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.xs, width: '100%' },
  title: { ...type.label, color: colors.ink },
  legend: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  axis: { ...type.small, color: colors.graphite },
  key: { ...type.small, fontFamily: fonts.bodyMedium },
});
