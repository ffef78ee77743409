import { useMemo } from 'react';
import { View, Text, StyleSheet } from 'react-native';
import Svg, { Line, Path, Text as SvgText } from 'react-native-svg';
import type { Heightfield } from '../../engine/course/heightfield';
import { heightAt } from '../../engine/course/sample';
import { colors, fonts, space, type } from '../../constants/theme';
import { alongAt, type CourseFrame } from './frame';

const PAD = 30;

/**
 * The ground cut along the walking line (x = 0), lined up with the map: the same distance along the walk sits
 * at the same screen offset. A pale band shows the lowest and highest ground across the width at each spot.
 */
export function SideProfile({ hf, frame, revision, depth }: { hf: Heightfield; frame: CourseFrame; revision: number; depth: number }) {
  const up = frame.direction === 'up';
  const span = up ? frame.height : frame.width;
  const plot = Math.max(20, depth - PAD - 8);
  const shape = useMemo(() => {
    const n = Math.max(2, Math.floor(span / 2));
    const centre = new Float64Array(n + 1);
    const low = new Float64Array(n + 1);
    const high = new Float64Array(n + 1);
    let lo = Infinity;
    let hi = -Infinity;
    const length = (hf.rows - 1) * hf.cellSize;
    for (let k = 0; k <= n; k++) {
      const z = Math.min(length, Math.max(0, alongAt(frame, (k / n) * span)));
      centre[k] = heightAt(hf, 0, z);
      const r = Math.round(z / hf.cellSize);
      let mn = Infinity;
      let mx = -Infinity;
      for (let c = 0; c < hf.cols; c++) {
        const h = hf.heights[r * hf.cols + c];
        if (h < mn) mn = h;
        if (h > mx) mx = h;
      }
      low[k] = mn;
      high[k] = mx;
      if (mn < lo) lo = mn;
      if (mx > hi) hi = mx;
    }
    const mid = (lo + hi) / 2;
    const half = Math.max(0.05, (hi - lo) / 2) * 1.1;
    const hLo = mid - half;
    const hHi = mid + half;
    // Height → offset across the plot (up: to the right; right: upwards).
    const across = (h: number) => (up ? PAD + ((h - hLo) / (hHi - hLo)) * plot : 8 + ((hHi - h) / (hHi - hLo)) * plot);
    const along = (k: number) => (k / n) * span;
    const pt = (k: number, h: number) => (up ? `${across(h).toFixed(1)},${along(k).toFixed(1)}` : `${along(k).toFixed(1)},${across(h).toFixed(1)}`);
    let line = '';
    let band = '';
    for (let k = 0; k <= n; k++) line += `${k ? 'L' : 'M'}${pt(k, centre[k])}`;
    for (let k = 0; k <= n; k++) band += `${k ? 'L' : 'M'}${pt(k, high[k])}`;
    for (let k = n; k >= 0; k--) band += `L${pt(k, low[k])}`;
    const exaggeration = plot / (hHi - hLo) / frame.scale;
    return { line, band: `${band}Z`, lo, hi, exaggeration, across };
    // revision: the heights changed in place.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [hf, frame, revision, span, plot, up]);

  const w = up ? depth : frame.width;
  const h = up ? frame.height : depth;
  const loAt = shape.across(shape.lo);
  const hiAt = shape.across(shape.hi);
  return (
    <View style={styles.wrap}>
      <Svg width={w} height={h} accessibilityLabel={`Side profile along the walking line, ${shape.lo.toFixed(3)} m to ${shape.hi.toFixed(3)} m`}>
        <Path d={shape.band} fill={colors.graphite} fillOpacity={0.16} />
        <Path d={shape.line} stroke={colors.ink} strokeWidth={2} fill="none" strokeLinejoin="round" />
        {up ? (
          <>
            <Line x1={loAt} y1={0} x2={loAt} y2={h} stroke={colors.rule} strokeDasharray="3 4" />
            <Line x1={hiAt} y1={0} x2={hiAt} y2={h} stroke={colors.rule} strokeDasharray="3 4" />
            <SvgText x={loAt} y={h - 4} fontFamily={fonts.mono} fontSize={10} fill={colors.graphite} textAnchor="middle">
              {shape.lo.toFixed(2)}
            </SvgText>
            <SvgText x={hiAt} y={12} fontFamily={fonts.mono} fontSize={10} fill={colors.graphite} textAnchor="middle">
              {shape.hi.toFixed(2)}
            </SvgText>
          </>
        ) : (
          <>
            <Line x1={0} y1={loAt} x2={w} y2={loAt} stroke={colors.rule} strokeDasharray="3 4" />
            <Line x1={0} y1={hiAt} x2={w} y2={hiAt} stroke={colors.rule} strokeDasharray="3 4" />
            <SvgText x={4} y={hiAt - 3} fontFamily={fonts.mono} fontSize={11} fill={colors.graphite}>
              {`${shape.hi.toFixed(3)} m`}
            </SvgText>
            <SvgText x={4} y={loAt + 12} fontFamily={fonts.mono} fontSize={11} fill={colors.graphite}>
              {`${shape.lo.toFixed(3)} m`}
            </SvgText>
          </>
        )}
      </Svg>
      {up ? null : <Text style={styles.caption}>Profile on the walking line · heights ×{shape.exaggeration.toFixed(1)}</Text>}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.xs },
  caption: { ...type.small, color: colors.graphite },
});
