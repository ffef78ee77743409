import Svg, { Rect } from 'react-native-svg';
import type { HeightMapProps } from './heightMapProps';
import { rampColour } from './ramp';
import { toScreen } from './frame';

/** Outside the browser: the course from above as coarse SVG cells, for viewing only (sculpting needs the web canvas). */
export function HeightMap({ hf, frame, lo, hi, label }: HeightMapProps) {
  const stepC = Math.max(1, Math.ceil(hf.cols / 40));
  const stepR = Math.max(1, Math.ceil(hf.rows / 80));
  const cells = [];
  const rgb = [0, 0, 0];
  for (let r = 0; r < hf.rows; r += stepR) {
    for (let c = 0; c < hf.cols; c += stepC) {
      rampColour((hf.heights[r * hf.cols + c] - lo) / (hi - lo), rgb);
      const x = (c - (hf.cols - 1) / 2) * hf.cellSize;
      const z = r * hf.cellSize;
      const p = toScreen(frame, x + (stepC * hf.cellSize) / 2, z + (stepR * hf.cellSize) / 2);
      const q = toScreen(frame, x - (stepC * hf.cellSize) / 2, z - (stepR * hf.cellSize) / 2);
      cells.push(
        <Rect
          key={`${r}-${c}`}
          x={Math.min(p.px, q.px)}
          y={Math.min(p.py, q.py)}
          width={Math.abs(q.px - p.px)}
          height={Math.abs(q.py - p.py)}
          fill={`rgb(${Math.round(rgb[0])}, ${Math.round(rgb[1])}, ${Math.round(rgb[2])})`}
        />,
      );
    }
  }
  return (
    <Svg width={frame.width} height={frame.height} accessibilityLabel={label}>
      {cells}
    </Svg>
  );
}
