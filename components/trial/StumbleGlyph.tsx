import Svg, { G, Path } from 'react-native-svg';
import type { StumbleKind } from '../../engine/metrics/stumble-thresholds';
import { glyphPath, stumbleColor } from './stumble-glyphs';

/** One glyph at (x, y) inside an Svg. */
export function GlyphAt({ kind, x, y, size = 6 }: { kind: StumbleKind; x: number; y: number; size?: number }) {
  const { d, stroked } = glyphPath(kind, size);
  const color = stumbleColor(kind);
  return (
    <G x={x} y={y}>
      <Path d={d} fill={stroked ? 'none' : color} stroke={color} strokeWidth={stroked ? 2.2 : 1} />
    </G>
  );
}

/** A glyph on its own, for legends and cards. */
export function StumbleGlyph({ kind, size = 14 }: { kind: StumbleKind; size?: number }) {
  return (
    <Svg width={size} height={size} accessibilityLabel={kind}>
      <GlyphAt kind={kind} x={size / 2} y={size / 2} size={size / 2 - 2} />
    </Svg>
  );
}
