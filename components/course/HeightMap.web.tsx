import { useCallback, useEffect, useRef, type PointerEvent as ReactPointerEvent } from 'react';
import { colors } from '../../constants/theme';
import { toCourse, toScreen } from './frame';
import type { HeightMapProps } from './heightMapProps';
import { sampleColours } from './ramp';

/**
 * The course from above, drawn into a canvas at screen resolution (nearest sample per pixel, so steps stay
 * crisp), with the walking line, a metre tick along it and the brush outline. Painting uses pointer events.
 * Only while painting (onStroke set) does touch-action: none keep a finger drag from scrolling; otherwise a
 * swipe on the map scrolls as anywhere else on the page.
 */
export function HeightMap({ hf, frame, revision, lo, hi, brushRadius, onStroke, label }: HeightMapProps) {
  const canvas = useRef<HTMLCanvasElement>(null);
  const colourBuf = useRef<Uint8ClampedArray | null>(null);
  const cursor = useRef<{ px: number; py: number } | null>(null);
  const activePointer = useRef<number | null>(null);

  const draw = useCallback(() => {
    const el = canvas.current;
    const ctx = el?.getContext('2d');
    if (!el || !ctx) return;
    const { width: W, height: H } = frame;
    if (el.width !== W || el.height !== H) {
      el.width = W;
      el.height = H;
    }
    const n = hf.cols * hf.rows;
    if (!colourBuf.current || colourBuf.current.length !== 4 * n) colourBuf.current = new Uint8ClampedArray(4 * n);
    const colours = sampleColours(hf, lo, hi, colourBuf.current);
    const image = ctx.createImageData(W, H);
    const px = image.data;
    const up = frame.direction === 'up';
    // Which sample each screen column and row shows.
    const colOf = new Int32Array(up ? W : H);
    const rowOf = new Int32Array(up ? H : W);
    const half = (hf.cols - 1) / 2;
    for (let k = 0; k < colOf.length; k++) {
      const x = frame.halfAcross - (k + 0.5) / frame.scale;
      colOf[k] = Math.min(hf.cols - 1, Math.max(0, Math.round(x / hf.cellSize + half)));
    }
    for (let k = 0; k < rowOf.length; k++) {
      const z = up ? frame.along - (k + 0.5) / frame.scale : (k + 0.5) / frame.scale - frame.margin;
      rowOf[k] = Math.min(hf.rows - 1, Math.max(0, Math.round(z / hf.cellSize)));
    }
    for (let y = 0; y < H; y++) {
      for (let x = 0; x < W; x++) {
        const i = up ? rowOf[y] * hf.cols + colOf[x] : rowOf[x] * hf.cols + colOf[y];
        const o = 4 * (y * W + x);
        px[o] = colours[4 * i];
        px[o + 1] = colours[4 * i + 1];
        px[o + 2] = colours[4 * i + 2];
        px[o + 3] = 255;
      }
    }
    ctx.putImageData(image, 0, 0);

    // The walking line (x = 0) with a tick each metre.
    ctx.strokeStyle = 'rgba(245, 241, 232, 0.85)';
    ctx.lineWidth = 1.5;
    ctx.setLineDash([6, 5]);
    const a = toScreen(frame, 0, 0);
    const b = toScreen(frame, 0, (hf.rows - 1) * hf.cellSize);
    ctx.beginPath();
    ctx.moveTo(a.px, a.py);
    ctx.lineTo(b.px, b.py);
    ctx.stroke();
    ctx.setLineDash([]);
    for (let m = 1; m < (hf.rows - 1) * hf.cellSize; m++) {
      const p = toScreen(frame, 0, m);
      ctx.beginPath();
      if (up) {
        ctx.moveTo(p.px - 5, p.py);
        ctx.lineTo(p.px + 5, p.py);
      } else {
        ctx.moveTo(p.px, p.py - 5);
        ctx.lineTo(p.px, p.py + 5);
      }
      ctx.stroke();
    }
    if (brushRadius && cursor.current) {
      ctx.strokeStyle = colors.onInk;
      ctx.lineWidth = 2;
      ctx.beginPath();
      ctx.arc(cursor.current.px, cursor.current.py, brushRadius * frame.scale, 0, Math.PI * 2);
      ctx.stroke();
      ctx.strokeStyle = colors.ink;
      ctx.lineWidth = 1;
      ctx.stroke();
    }
  }, [hf, frame, lo, hi, brushRadius]);

  useEffect(() => {
    draw();
  }, [draw, revision]);

  function at(e: ReactPointerEvent<HTMLCanvasElement>) {
    const rect = e.currentTarget.getBoundingClientRect();
    const px = ((e.clientX - rect.left) * frame.width) / (rect.width || 1);
    const py = ((e.clientY - rect.top) * frame.height) / (rect.height || 1);
    cursor.current = { px, py };
    return toCourse(frame, px, py);
  }

  const painting = !!onStroke;
  return (
    <canvas
      ref={canvas}
      role="img"
      aria-label={label}
      data-testid="sculpt-canvas"
      style={{ width: frame.width, height: frame.height, display: 'block', touchAction: painting ? 'none' : 'pan-x pan-y', cursor: painting ? 'crosshair' : 'default', borderRadius: 8 }}
      onPointerDown={(e) => {
        if (!onStroke || activePointer.current !== null) return;
        e.preventDefault();
        e.currentTarget.setPointerCapture?.(e.pointerId);
        activePointer.current = e.pointerId;
        onStroke({ phase: 'start', ...at(e) });
      }}
      onPointerMove={(e) => {
        const p = at(e);
        if (activePointer.current === e.pointerId) onStroke?.({ phase: 'move', ...p });
        else if (painting) draw();
      }}
      onPointerUp={(e) => {
        if (activePointer.current !== e.pointerId) return;
        activePointer.current = null;
        onStroke?.({ phase: 'end', ...at(e) });
      }}
      onPointerCancel={(e) => {
        if (activePointer.current !== e.pointerId) return;
        activePointer.current = null;
        onStroke?.({ phase: 'end', ...at(e) });
      }}
      onPointerLeave={() => {
        if (activePointer.current !== null) return;
        cursor.current = null;
        draw();
      }}
    />
  );
}
