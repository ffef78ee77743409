/**
 * Clips and stills of a 3D walk in the browser: each frame of the WebGL canvas is copied onto a 2D canvas with
 * a caption burned into its lower left corner (character, course, version, footing score); a still is one such
 * frame as PNG, a clip is the 2D canvas's stream recorded by MediaRecorder as WebM (Matroska-based; its files
 * begin with the EBML header 1A 45 DF A3).
 */
import { colors } from '../../constants/theme';

export interface Caption {
  lines: string[];
}

/** Whether this browser can record a clip (MediaRecorder with a WebM type, and canvas streams). */
export function clipSupported(): boolean {
  if (typeof document === 'undefined' || typeof MediaRecorder === 'undefined') return false;
  const c = document.createElement('canvas') as HTMLCanvasElement & { captureStream?: unknown };
  return typeof c.captureStream === 'function' && webmType() !== null;
}

function webmType(): string | null {
  for (const t of ['video/webm;codecs=vp9', 'video/webm;codecs=vp8', 'video/webm']) if (MediaRecorder.isTypeSupported(t)) return t;
  return null;
}

/** Copy the walk and draw the caption over it. */
function compose(ctx: CanvasRenderingContext2D, source: HTMLCanvasElement, caption: Caption): void {
  const { width, height } = ctx.canvas;
  ctx.drawImage(source, 0, 0, width, height);
  const size = Math.max(11, Math.round(height / 32));
  const pad = Math.round(size * 0.6);
  ctx.font = `600 ${size}px Inter_600SemiBold, Inter, system-ui, sans-serif`;
  const lines = ['Treadle', ...caption.lines];
  const w = Math.max(...lines.map((l) => ctx.measureText(l).width)) + 2 * pad;
  const lh = Math.round(size * 1.35);
  const h = lines.length * lh + pad;
  const x = pad;
  const y = height - h - pad;
  ctx.fillStyle = 'rgba(30, 37, 43, 0.78)';
  ctx.fillRect(x, y, w, h);
  lines.forEach((l, i) => {
    ctx.fillStyle = i === 0 ? colors.ember : colors.onInk;
    ctx.fillText(l, x + pad, y + pad / 2 + (i + 1) * lh - Math.round(size * 0.3));
  });
}

function composer(source: HTMLCanvasElement): { canvas: HTMLCanvasElement; ctx: CanvasRenderingContext2D } {
  const canvas = document.createElement('canvas');
  // Even sizes: video encoders want them.
  canvas.width = Math.max(2, source.width - (source.width % 2));
  canvas.height = Math.max(2, source.height - (source.height % 2));
  const ctx = canvas.getContext('2d');
  if (!ctx) throw new Error('This browser cannot draw the caption (no 2D canvas).');
  return { canvas, ctx };
}

export function download(blob: Blob, name: string): void {
  const url = URL.createObjectURL(blob);
  const a = document.createElement('a');
  a.href = url;
  a.download = name;
  a.style.display = 'none';
  document.body.appendChild(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

/** The current frame with its caption, as PNG. */
export async function stillOf(source: HTMLCanvasElement, caption: Caption): Promise<Blob> {
  const { canvas, ctx } = composer(source);
  compose(ctx, source, caption);
  return new Promise((resolve, reject) => canvas.toBlob((b) => (b ? resolve(b) : reject(new Error('The still could not be made.'))), 'image/png'));
}

/** Record `seconds` of the walk with its caption as WebM; `onFrame` is asked to draw before each copy. */
export async function recordClip(source: HTMLCanvasElement, caption: Caption, seconds: number, onFrame?: () => void): Promise<Blob> {
  const type = webmType();
  if (!type) throw new Error('This browser cannot record WebM video.');
  const { canvas, ctx } = composer(source);
  compose(ctx, source, caption);
  const stream = (canvas as HTMLCanvasElement & { captureStream(fps?: number): MediaStream }).captureStream(30);
  const recorder = new MediaRecorder(stream, { mimeType: type, videoBitsPerSecond: 4_000_000 });
  const chunks: Blob[] = [];
  recorder.ondataavailable = (e) => {
    if (e.data.size) chunks.push(e.data);
  };
  const stopped = new Promise<void>((resolve) => (recorder.onstop = () => resolve()));
  let handle = 0;
  const copy = () => {
    onFrame?.();
    compose(ctx, source, caption);
    handle = requestAnimationFrame(copy);
  };
  recorder.start(250);
  handle = requestAnimationFrame(copy);
  await new Promise((r) => setTimeout(r, seconds * 1000));
  cancelAnimationFrame(handle);
  recorder.stop();
  await stopped;
  for (const track of stream.getTracks()) track.stop();
  return new Blob(chunks, { type: 'video/webm' });
}
