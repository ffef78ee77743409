import Svg, { Circle, Polyline } from 'react-native-svg';
import { colors } from '../../constants/theme';

/** Recent footing scores on one course, on a fixed 0–100 scale, newest at the right. */
export function ScoreSparkline({ scores, course, width = 120, height = 36 }: { scores: number[]; course: string; width?: number; height?: number }) {
  // One score is no trend: a lone dot would only look like one.
  if (scores.length < 2) return null;
  const pad = 4;
  const x = (i: number) => (scores.length === 1 ? width / 2 : pad + (i * (width - 2 * pad)) / (scores.length - 1));
  const y = (s: number) => pad + ((100 - s) / 100) * (height - 2 * pad);
  const last = scores.length - 1;
  return (
    <Svg width={width} height={height} accessibilityLabel={`Footing scores of the last ${scores.length} trials on ${course}: ${scores.map((s) => s.toFixed(1)).join(', ')}`}>
      <Polyline points={scores.map((s, i) => `${x(i)},${y(s)}`).join(' ')} fill="none" stroke={colors.graphite} strokeWidth={1.5} />
      <Circle cx={x(last)} cy={y(scores[last])} r={3.5} fill={colors.ink} />
    </Svg>
  );
}
