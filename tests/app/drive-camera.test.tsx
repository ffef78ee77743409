/**
 * Drive's camera behind the character and its start on a course's walk path, and the walk-path speed field's
 * reading of what is typed.
 */
import { behindCamera, createFollowYaw, stepFollowYaw, wrapAngle } from '../../components/drive/follow-camera';
import { driveStart } from '../../components/drive/drive-walk';
import { speedFromText, speedProblem } from '../../components/course/WalkPathSpeedField';
import { flatCourse } from '../../engine/course/generators';

/** Critically damped x'' + 2ωx' + ω²x = 0 has the repeated root −ω: x(t) = (x0 + (v0 + ω x0) t) e^(−ωt) (any ODE text, e.g. Boyce & DiPrima §3.4; from memory). */
const closedForm = (x0: number, v0: number, w: number, t: number) => (x0 + (v0 + w * x0) * t) * Math.exp(-w * t);

describe('the view behind the heading', () => {
  it('starts right behind the first heading', () => {
    const f = createFollowYaw();
    expect(stepFollowYaw(f, 1.2, 1 / 60)).toBe(1.2);
  });

  it('closes on a new heading as the critically damped solution does, at any frame rate', () => {
    const T = 0.35;
    const w = 2 / T;
    for (const fps of [60, 24, 144]) {
      const f = createFollowYaw();
      stepFollowYaw(f, 0, 0, T);
      // Heading steps to 0.8 rad: the offset starts at −0.8 with no rate.
      let t = 0;
      for (let k = 0; k < fps; k++) {
        stepFollowYaw(f, 0.8, 1 / fps, T);
        t += 1 / fps;
        expect(f.yaw - 0.8).toBeCloseTo(closedForm(-0.8, 0, w, t), 10);
      }
    }
  });

  it('never overshoots: the view stays on one side of the heading (critical damping, common practice, no source)', () => {
    const f = createFollowYaw();
    stepFollowYaw(f, 0, 0);
    for (let k = 0; k < 600; k++) {
      stepFollowYaw(f, 1, 1 / 60);
      expect(f.yaw).toBeLessThanOrEqual(1 + 1e-12);
    }
    expect(f.yaw).toBeCloseTo(1, 6);
  });

  it('takes the short way round when the heading wraps past ±π', () => {
    const f = createFollowYaw();
    stepFollowYaw(f, Math.PI - 0.05, 0);
    // The heading crosses +π and reads −π + 0.05: 0.1 rad on, not a whole turn back.
    let least = Infinity;
    let most = -Infinity;
    for (let k = 0; k < 120; k++) {
      stepFollowYaw(f, -Math.PI + 0.05, 1 / 60);
      least = Math.min(least, f.yaw);
      most = Math.max(most, f.yaw);
    }
    expect(least).toBeGreaterThanOrEqual(Math.PI - 0.05 - 1e-12);
    expect(most).toBeLessThanOrEqual(Math.PI + 0.05 + 1e-12);
    expect(wrapAngle(f.yaw)).toBeCloseTo(-Math.PI + 0.05, 4);
  });

  it('follows a steady turn without jitter: the lag settles to rate × smoothing time and every frame moves on', () => {
    const T = 0.35;
    const rate = 1.5;
    const f = createFollowYaw();
    stepFollowYaw(f, 0, 0, T);
    let heading = 0;
    let before = f.yaw;
    for (let k = 0; k < 600; k++) {
      heading += rate / 60;
      stepFollowYaw(f, wrapAngle(heading), 1 / 60, T);
      // Ever forward, never faster than the heading turns once started (a ramp through a critically damped filter).
      expect(f.yaw).toBeGreaterThanOrEqual(before);
      before = f.yaw;
    }
    // Steady-state error of a critically damped follower to a ramp: 2ζ/ω × rate = T × rate with ζ = 1, ω = 2/T
    // (standard second-order control result; from memory). A target held a frame at a time shifts it by under a frame's turn.
    const lag = heading - f.yaw;
    expect(Math.abs(lag - T * rate)).toBeLessThan(rate / 60);
  });

  it('places the camera behind the body along the view and looks ahead of it', () => {
    const eye = new Float64Array(3);
    const look = new Float64Array(3);
    behindCamera(1, 0.5, 2, 0.5, Math.PI / 2, eye, look);
    // Facing +X: the camera is on the −X side, at the body's z, above it; it looks towards +X.
    expect(eye[0]).toBeLessThan(1);
    expect(eye[2]).toBeCloseTo(2, 12);
    expect(eye[1]).toBeGreaterThan(0.5);
    expect(look[0]).toBeGreaterThan(1);
    expect(Math.atan2(look[0] - eye[0], look[2] - eye[2])).toBeCloseTo(Math.PI / 2, 12);
  });

  it('wraps angles into (−π, π]', () => {
    expect(wrapAngle(Math.PI)).toBeCloseTo(Math.PI, 12);
    expect(wrapAngle(-Math.PI)).toBeCloseTo(Math.PI, 12);
    expect(wrapAngle(3 * Math.PI / 2)).toBeCloseTo(-Math.PI / 2, 12);
    expect(wrapAngle(-7)).toBeCloseTo(-7 + 2 * Math.PI, 12);
  });
});

describe('where Drive starts', () => {
  it('on a walk path: its first point, facing along it', () => {
    const hf = flatCourse(6, { width: 2 });
    hf.walkPath = { points: [{ x: 0.4, z: 1 }, { x: 0.4, z: 2 }, { x: 0.9, z: 3 }], closed: false, speed: null };
    const start = driveStart(hf)!;
    expect(start.position[0]).toBeCloseTo(0.4, 6);
    expect(start.position[1]).toBeCloseTo(1, 6);
    // The first two points share x: the curve leaves point 1 close to +Z (heading 0), bending only later.
    expect(Math.abs(start.heading)).toBeLessThan(0.2);
    hf.walkPath = { points: [{ x: -0.5, z: 1 }, { x: 0.5, z: 1 }], closed: false, speed: null };
    // Two points across the course: straight along +X, heading π/2 (atan2 of the unit tangent).
    expect(driveStart(hf)!.heading).toBeCloseTo(Math.PI / 2, 6);
  });

  it('without one: where the runtime starts a straight walk (no start of its own)', () => {
    expect(driveStart(flatCourse(6, { width: 2 }))).toBeNull();
  });
});

describe('the walk-path speed field', () => {
  it('reads empty as the setup’s own pace, numbers as numbers, anything else as no number', () => {
    expect(speedFromText('')).toBeNull();
    expect(speedFromText(' 1.25 ')).toBe(1.25);
    expect(speedFromText('0,8')).toBe(0.8);
    expect(speedFromText('fast')).toBeNaN();
    expect(speedFromText('1.2.3')).toBeNaN();
  });

  it('gives the walk-path schema’s own messages for speeds out of its bounds', () => {
    expect(speedProblem(null)).toBeNull();
    expect(speedProblem(1.2)).toBeNull();
    expect(speedProblem(10)).toBeNull();
    expect(speedProblem(12)).toBe('Walk at most 10 m/s.');
    expect(speedProblem(0)).toBe('The speed must be above 0.');
    expect(speedProblem(NaN)).toMatch(/number/);
  });
});
