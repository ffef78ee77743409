/** Each stumble kind's colour (Treadle's identity, constants/palette.ts) and its own glyph, so colour is never the only cue. */
import { stumbleColors } from '../../constants/theme';
import type { StumbleKind } from '../../engine/metrics/stumble-thresholds';

export const STUMBLE_LABELS: Record<StumbleKind, string> = { sink: 'Sink', skid: 'Skid', 'reach-miss': 'Reach-miss', scuff: 'Scuff', snap: 'Snap' };

/** SVG path of the glyph centred on (0, 0) with half-size s; `stroked` glyphs are drawn as lines. */
export function glyphPath(kind: StumbleKind, s: number): { d: string; stroked: boolean } {
  switch (kind) {
    case 'sink': // a triangle pointing down: into the ground
      return { d: `M ${-s} ${-s} L ${s} ${-s} L 0 ${s} Z`, stroked: false };
    case 'skid': // a diamond
      return { d: `M 0 ${-s} L ${s} 0 L 0 ${s} L ${-s} 0 Z`, stroked: false };
    case 'reach-miss': // a cross: the target was missed
      return { d: `M ${-s} ${-s} L ${s} ${s} M ${s} ${-s} L ${-s} ${s}`, stroked: true };
    case 'scuff': // a circle
      return { d: `M ${-s} 0 A ${s} ${s} 0 1 0 ${s} 0 A ${s} ${s} 0 1 0 ${-s} 0 Z`, stroked: false };
    case 'snap': // a zig-zag: a pop
      return { d: `M ${-s} ${s} L ${-s / 3} ${-s} L ${s / 3} ${s} L ${s} ${-s}`, stroked: true };
  }
}

export const stumbleColor = (kind: StumbleKind) => stumbleColors[kind];
