/** The walk path on a course: its schema (old courses stay valid), the field through encoding, and the arc-length track. */
import { CourseEncodingSchema, CourseSpecSchema, createPathTrack, decodeCourse, encodeCourse, generateCourse, trackPoint, WalkPathSchema } from '../../../engine/course';

const circle = (r: number, n: number, cz: number) =>
  Array.from({ length: n }, (_, k) => ({ x: r * Math.sin((2 * Math.PI * k) / n), z: cz + r * Math.cos((2 * Math.PI * k) / n) }));

describe('walk path schema', () => {
  it('leaves a course without a path valid and straight (common practice, no source: new fields are optional)', () => {
    const enc = encodeCourse(generateCourse({ segments: [{ kind: 'flat', length: 3 }] }));
    expect(enc.walkPath).toBeUndefined();
    expect(CourseEncodingSchema.safeParse(enc).success).toBe(true);
    expect(decodeCourse(enc).walkPath).toBeUndefined();
  });

  it('carries a path through the encoding and the recipe', () => {
    const walkPath = { points: circle(2, 16, 3), closed: true, speed: 0.8 };
    const hf = generateCourse({ width: 6, segments: [{ kind: 'flat', length: 6 }], walkPath });
    const back = decodeCourse(JSON.parse(JSON.stringify(encodeCourse(hf))));
    expect(back.walkPath).toEqual(walkPath);
    expect(CourseSpecSchema.parse({ segments: [{ kind: 'flat', length: 1 }], walkPath: { points: [{ x: 0, z: 0 }, { x: 0, z: 1 }] } }).walkPath).toEqual({
      points: [{ x: 0, z: 0 }, { x: 0, z: 1 }],
      closed: false,
      speed: null,
    });
  });

  it('names the point that is off the course or on top of its neighbour', () => {
    const enc = encodeCourse(generateCourse({ width: 2, segments: [{ kind: 'flat', length: 4 }] }));
    const off = CourseEncodingSchema.safeParse({ ...enc, walkPath: { points: [{ x: 0, z: 0.5 }, { x: 1.5, z: 2 }] } });
    expect(off.success).toBe(false);
    expect(off.error!.issues[0].path).toEqual(['walkPath', 'points', 1]);
    expect(off.error!.issues[0].message).toMatch(/off the course/);
    const twin = WalkPathSchema.safeParse({ points: [{ x: 0, z: 1 }, { x: 0.01, z: 1 }] });
    expect(twin.success).toBe(false);
    expect(twin.error!.issues[0].path).toEqual(['points', 1]);
    expect(() => generateCourse({ width: 2, segments: [{ kind: 'flat', length: 4 }], walkPath: { points: [{ x: 0, z: 1 }, { x: 0, z: 9 }] } })).toThrow(/off the course/);
  });
});

describe('path track', () => {
  it('puts a loop through 16 points of a 2 m circle on that circle, 2π·r long, facing along it', () => {
    // Circle geometry: circumference 2πr, tangent perpendicular to the radius (textbook geometry).
    const track = createPathTrack(WalkPathSchema.parse({ points: circle(2, 16, 3), closed: true }));
    expect(track.length).toBeGreaterThan(2 * Math.PI * 2 * 0.999);
    expect(track.length).toBeLessThan(2 * Math.PI * 2 * 1.001);
    const p = new Float64Array(3);
    for (let s = 0; s < track.length; s += 0.37) {
      trackPoint(track, s, p);
      const rx = p[0];
      const rz = p[1] - 3;
      expect(Math.abs(Math.hypot(rx, rz) - 2)).toBeLessThan(0.005);
      // Heading (sin ψ, cos ψ) is perpendicular to the radius.
      expect(Math.abs(Math.sin(p[2]) * rx + Math.cos(p[2]) * rz) / 2).toBeLessThan(0.01);
    }
    // A loop wraps: one circumference on is the same place.
    const q = new Float64Array(3);
    trackPoint(track, 1, p);
    trackPoint(track, 1 + track.length, q);
    expect(Math.hypot(p[0] - q[0], p[1] - q[1])).toBeLessThan(1e-9);
  });

  it('walks a straight two-point path at unit speed and continues past its end (common practice, no source)', () => {
    const track = createPathTrack(WalkPathSchema.parse({ points: [{ x: 0, z: 1 }, { x: 3, z: 5 }] }));
    expect(track.length).toBeCloseTo(5, 9);
    const p = new Float64Array(3);
    trackPoint(track, 2.5, p);
    expect([p[0], p[1]]).toEqual([expect.closeTo(1.5, 9), expect.closeTo(3, 9)]);
    expect(p[2]).toBeCloseTo(Math.atan2(3, 4), 9);
    trackPoint(track, 6, p);
    expect([p[0], p[1]]).toEqual([expect.closeTo(3.6, 9), expect.closeTo(5.8, 9)]);
  });
});
