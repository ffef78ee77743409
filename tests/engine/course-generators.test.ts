import {
  CODE_STAIRS,
  codeStairsCourse,
  courseLength,
  curbCourse,
  flatCourse,
  generateCourse,
  heightAt,
  heightRange,
  maxHeightAlong,
  mixedCourse,
  normalAt,
  rampCourse,
  rubbleCourse,
  segmentClearance,
  trenchCourse,
} from '../../engine/course';

describe('code stairs preset', () => {
  it('a generated flight measures riser ≤ 7 in and tread ≥ 11 in, to the millimetre courses are stored in (IBC 2021 §1011.5.2; 1 in = 25.4 mm exactly)', () => {
    const hf = codeStairsCourse(6, 'up', { leadIn: 1, leadOut: 1, cellSize: 0.005 });
    // Walk the centre line and find the edges: where the height jumps between neighbouring samples.
    const edges: { z: number; rise: number }[] = [];
    const step = 0.001;
    for (let z = 0; z + step < courseLength(hf); z += step) {
      const d = heightAt(hf, 0, z + step) - heightAt(hf, 0, z);
      if (d > 0.01) {
        const last = edges[edges.length - 1];
        if (last && z - last.z < 0.01) last.rise += d;
        else edges.push({ z, rise: d });
      }
    }
    expect(edges.length).toBe(6);
    const mm = (m: number) => Math.round(m * 1000);
    for (const e of edges) expect(mm(e.rise)).toBeLessThanOrEqual(Math.round(7 * 25.4));
    // Edges sit on a 5 mm grid: the mean tread over the flight is good to 1 mm.
    const tread = (edges[edges.length - 1].z - edges[0].z) / (edges.length - 1);
    expect(mm(tread)).toBeGreaterThanOrEqual(Math.round(11 * 25.4));
  });
  it('the generated flight climbs one riser per tread (IBC 2021 §1011.5.2 dimensions)', () => {
    const hf = codeStairsCourse(5, 'up', { leadIn: 1, leadOut: 1 });
    // Middle of each tread, away from the bilinear ramp at the nosing.
    for (let k = 0; k < 5; k++) {
      const z = 1 + (k + 0.5) * CODE_STAIRS.tread;
      expect(heightAt(hf, 0, z)).toBeCloseTo((k + 1) * CODE_STAIRS.riser, 9);
    }
    expect(heightAt(hf, 0, courseLength(hf))).toBeCloseTo(5 * CODE_STAIRS.riser, 9);
  });
});

describe('sampling (bilinear interpolation; common practice, no source)', () => {
  it('a ramp samples exactly between grid points and its normal tilts by the ramp angle', () => {
    const hf = rampCourse(4, 10, { cellSize: 0.1 });
    const slope = Math.tan((10 * Math.PI) / 180);
    expect(heightAt(hf, 0.033, 1.2345)).toBeCloseTo(slope * 1.2345, 9);
    const n = normalAt(hf, 0.2, 2.05, [0, 0, 0]);
    // Normal of the plane y = s·z is (0, 1, −s)/√(1+s²): its angle from +Y is the ramp angle.
    expect(Math.acos(n[1]) * (180 / Math.PI)).toBeCloseTo(10, 6);
    expect(n[2]).toBeLessThan(0);
    expect(Math.hypot(n[0], n[1], n[2])).toBeCloseTo(1, 12);
  });
  it('holds the edge heights beyond the grid', () => {
    const hf = curbCourse(2, 0.2);
    expect(heightAt(hf, 0, -5)).toBe(0);
    expect(heightAt(hf, 0, 50)).toBeCloseTo(0.2, 12);
    expect(heightAt(hf, 99, 1.5)).toBeCloseTo(0.2, 12);
    expect(normalAt(hf, 0, 50, [0, 0, 0])).toEqual([-0, 1, -0]);
  });
  it('segment tests see a curb between the ends of a segment', () => {
    const hf = curbCourse(2, 0.15, { cellSize: 0.02 });
    expect(maxHeightAlong(hf, 0, 0.2, 0, 1.8)).toBeCloseTo(0.15, 9);
    // A segment 10 cm above the low side crosses the curb 5 cm too low.
    expect(segmentClearance(hf, 0, 0.1, 0.2, 0, 0.1, 1.8)).toBeCloseTo(-0.05, 9);
    expect(segmentClearance(hf, 0, 0.2, 0.2, 0, 0.2, 1.8)).toBeCloseTo(0.05, 9);
  });
});

describe('generators', () => {
  it('flat is flat', () => {
    const r = heightRange(flatCourse(3));
    expect(r.min).toBe(0);
    expect(r.max).toBe(0);
  });
  it('rubble stays within its amplitude, depends on the seed only, and is repeatable', () => {
    const a = rubbleCourse(6, 0.08, 0.4, 7);
    const b = rubbleCourse(6, 0.08, 0.4, 7);
    const c = rubbleCourse(6, 0.08, 0.4, 8);
    expect(Array.from(a.heights)).toEqual(Array.from(b.heights));
    expect(Array.from(a.heights)).not.toEqual(Array.from(c.heights));
    const r = heightRange(a);
    expect(r.max).toBeLessThanOrEqual(0.08);
    expect(r.min).toBeGreaterThanOrEqual(-0.08);
    expect(r.max - r.min).toBeGreaterThan(0.04);
  });
  it('trench has its width and depth, centred in its segment', () => {
    const hf = trenchCourse(4, 1, 0.5, { cellSize: 0.02 });
    expect(heightAt(hf, 0, 2)).toBeCloseTo(-0.5, 12);
    expect(heightAt(hf, 0, 1.45)).toBe(0);
    expect(heightAt(hf, 0, 2.55)).toBe(0);
  });
  it('a mixed course continues each segment from the height where the previous ended', () => {
    const hf = mixedCourse(
      [
        { kind: 'flat', length: 1 },
        { kind: 'stairs', steps: 3, riser: 0.15, tread: 0.3 },
        { kind: 'ramp', length: 2, angleDeg: -5 },
        { kind: 'curb', length: 1, height: 0.1 },
      ],
      { cellSize: 0.02 },
    );
    expect(heightAt(hf, 0, 2.5)).toBeCloseTo(0.45 - Math.tan((5 * Math.PI) / 180) * 0.6, 9);
    const end = 0.45 - Math.tan((5 * Math.PI) / 180) * 2 + 0.1;
    expect(heightAt(hf, 0, 1.9 + 2 + 0.9)).toBeCloseTo(end, 9);
  });
  it('rejects bad specs naming the problem', () => {
    expect(() => generateCourse({ segments: [] })).toThrow(/segments/);
    expect(() => generateCourse({ segments: [{ kind: 'ramp', length: 2, angleDeg: 80 }] })).toThrow(/angleDeg/);
    expect(() => generateCourse({ segments: [{ kind: 'trench', length: 1, width: 2, depth: 1 }] })).toThrow(/trench width/);
    expect(() => generateCourse({ segments: [{ kind: 'stairs', steps: 400, riser: 0.2, tread: 0.3 }] })).toThrow(/height bound/);
    expect(() => generateCourse({ segments: [{ kind: 'bumps', length: 1 } as never] })).toThrow(/kind/);
  });
});

describe('grid limits', () => {
  it('a course too long for its cell size names the size and the limit', () => {
    expect(() => flatCourse(900, { cellSize: 0.05 })).toThrow(/900 m course with 0.05 m cells: rows must be an integer in \[2, 16384\]/);
  });
  it('a trench deeper than the height bound is rejected', () => {
    const down = { kind: 'stairs', steps: 65, riser: 0.2, tread: 0.3, direction: 'down' } as const;
    expect(() => generateCourse({ segments: [down, { kind: 'trench', length: 2, width: 1, depth: 20 }] })).toThrow(/segment 1 \(trench\) leaves the height bound/);
  });
});
