import {
  COURSE_LIMITS,
  applyBrush,
  applyBrushStroke,
  cloneHeightfield,
  courseFromJson,
  courseToJson,
  decodeCourse,
  encodeCourse,
  flatCourse,
  heightAt,
  redoChange,
  rubbleCourse,
  undoChange,
  type BrushInput,
} from '../../engine/course';
import { bytesToBase64 } from '../../engine/course/base64';

describe('course encoding', () => {
  it('round-trips within half a millimetre, and re-encodes identically', () => {
    const hf = rubbleCourse(5, 0.1, 0.3, 42);
    const enc = encodeCourse(hf);
    const back = decodeCourse(JSON.parse(JSON.stringify(enc)));
    expect(back.cols).toBe(hf.cols);
    expect(back.rows).toBe(hf.rows);
    for (let i = 0; i < hf.heights.length; i++) expect(Math.abs(back.heights[i] - hf.heights[i])).toBeLessThanOrEqual(0.0005 + 1e-12);
    expect(encodeCourse(back)).toEqual(enc);
    expect(courseFromJson(courseToJson(back)).heights).toEqual(back.heights);
  });
  it('uses 2 bytes per sample (about 2.7 characters of base64)', () => {
    const enc = encodeCourse(flatCourse(10));
    expect(enc.heights.length).toBe(Math.ceil((enc.cols * enc.rows * 2) / 3) * 4);
  });
  it('matches the RFC 4648 §10 base64 test vectors', () => {
    const enc = (s: string) => bytesToBase64(Uint8Array.from(s, (c) => c.charCodeAt(0)));
    expect(['', 'f', 'fo', 'foo', 'foob', 'fooba', 'foobar'].map(enc)).toEqual(['', 'Zg==', 'Zm8=', 'Zm9v', 'Zm9vYg==', 'Zm9vYmE=', 'Zm9vYmFy']);
  });

  const good = () => encodeCourse(flatCourse(1, { width: 0.5, cellSize: 0.1 }));
  it.each([
    ['wrong format', (e: Record<string, unknown>) => ({ ...e, format: 'other' }), /format must be "treadle-course"/],
    ['future version', (e: Record<string, unknown>) => ({ ...e, version: 2 }), /unsupported version 2/],
    ['too many columns', (e: Record<string, unknown>) => ({ ...e, cols: 100000 }), /cols/],
    ['non-integer rows', (e: Record<string, unknown>) => ({ ...e, rows: 2.5 }), /rows/],
    ['zero cell size', (e: Record<string, unknown>) => ({ ...e, cellSize: 0 }), /cellSize/],
    ['infinite base', (e: Record<string, unknown>) => ({ ...e, baseMm: Infinity }), /baseMm/],
    ['short heights', (e: Record<string, unknown>) => ({ ...e, heights: 'AAAA' }), /heights must hold rows × cols × 2 = \d+ bytes, got 3 bytes/],
    ['not base64', (e: Record<string, unknown>) => ({ ...e, heights: '!!!!' }), /heights must be base64/],
    ['missing field', (e: Record<string, unknown>) => ({ ...e, cellSize: undefined }), /cellSize/],
  ])('rejects %s with its reason', (_name, mutate, reason) => {
    expect(() => decodeCourse(mutate(good() as unknown as Record<string, unknown>))).toThrow(reason);
  });
  it('rejects heights above the bound once decoded', () => {
    const e = good();
    expect(() => decodeCourse({ ...e, baseMm: COURSE_LIMITS.maxAbsHeight * 1000 - 5, heights: e.heights.replace(/A/g, '/') })).toThrow(/above the bound/);
  });
  it('rejects a course with non-finite heights at encode time', () => {
    const hf = flatCourse(1);
    hf.heights[3] = NaN;
    expect(() => encodeCourse(hf)).toThrow(/finite/);
  });
  it('rejects text that is not JSON', () => {
    expect(() => courseFromJson('{oops')).toThrow(/not JSON/);
  });
});

describe('brushes', () => {
  const kinds: BrushInput['kind'][] = ['raise', 'lower', 'smooth', 'flatten'];

  it('raise lifts the centre by strength × 5 cm and leaves samples beyond the radius alone', () => {
    const hf = flatCourse(4, { cellSize: 0.05 });
    applyBrush(hf, { kind: 'raise', radius: 0.5, strength: 0.5, falloff: 'smooth' }, 0, 2);
    expect(heightAt(hf, 0, 2)).toBeCloseTo(0.025, 12);
    expect(heightAt(hf, 0, 2.55)).toBe(0);
  });
  it('flatten pulls towards the level where the stroke started; smooth reduces roughness', () => {
    const hf = rubbleCourse(4, 0.1, 0.3, 3);
    const level = heightAt(hf, 0, 2);
    applyBrush(hf, { kind: 'flatten', radius: 0.4, strength: 1, falloff: 'constant' }, 0, 2);
    expect(heightAt(hf, 0.1, 2.1)).toBeCloseTo(level, 9);
    const rough = rubbleCourse(4, 0.1, 0.1, 5);
    const spread = (h: Float64Array) => Math.max(...h) - Math.min(...h);
    const before = spread(rough.heights);
    for (let k = 0; k < 6; k++) applyBrushStroke(rough, { kind: 'smooth', radius: 3, strength: 1, falloff: 'constant' }, [{ x: 0, z: 2 }]);
    expect(spread(rough.heights)).toBeLessThan(before / 2);
  });
  it('every brush returns the change it made; undo restores and redo reapplies bit for bit', () => {
    for (const kind of kinds) {
      const hf = rubbleCourse(4, 0.1, 0.3, 11);
      const original = cloneHeightfield(hf);
      const change = applyBrushStroke(hf, { kind, radius: 0.3, strength: 0.8, level: 0.05 }, [
        { x: -0.5, z: 1 },
        { x: 0.4, z: 2.5 },
      ]);
      expect(change.indices.length).toBeGreaterThan(0);
      const edited = hf.heights.slice();
      undoChange(hf, change);
      expect(hf.heights).toEqual(original.heights);
      redoChange(hf, change);
      expect(hf.heights).toEqual(edited);
    }
  });
  it('keeps heights finite and within the course bounds however hard it is pushed', () => {
    const hf = flatCourse(2, { cellSize: 0.1 });
    for (const kind of kinds) {
      for (let k = 0; k < 800; k++) {
        applyBrush(hf, { kind: k % 2 ? kind : 'raise', radius: 1, strength: 1, falloff: 'linear', level: 31.99 }, 0, 1);
      }
    }
    for (const h of hf.heights) {
      expect(Number.isFinite(h)).toBe(true);
      expect(Math.abs(h)).toBeLessThanOrEqual(COURSE_LIMITS.maxAbsHeight);
    }
  });
  it('rejects bad brushes and points naming the problem', () => {
    const hf = flatCourse(1);
    expect(() => applyBrush(hf, { kind: 'raise', radius: -1, strength: 0.5 }, 0, 0)).toThrow(/radius/);
    expect(() => applyBrush(hf, { kind: 'raise', radius: 0.2, strength: 3 }, 0, 0)).toThrow(/strength/);
    expect(() => applyBrush(hf, { kind: 'raise', radius: 0.2, strength: 0.5 }, NaN, 0)).toThrow(/finite x and z/);
    expect(() => applyBrushStroke(hf, { kind: 'raise', radius: 0.2, strength: 0.5 }, [])).toThrow(/at least one point/);
  });
});
