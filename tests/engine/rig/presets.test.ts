/**
 * Preset legs built in code: structure, reach, rest pose, and the mirror
 * (x → −x reflection: axial vectors map to (ax, −ay, −az), Spong et al. ch. 2
 * on reflections of rotations).
 */
import { createWorkspace, dofCount, forwardKinematics, setPose } from '../../../engine/ik';
import { mulberry32 } from '../../../engine/math/random';
import { digitigradeLeg, humanLeg, insectLeg, mirrorChain, pistonLeg, presetLeg, PRESET_NAMES } from '../../../engine/rig/presets';

describe('preset legs', () => {
  test('joint kinds and DOF counts', () => {
    expect(humanLeg().joints.map((j) => j.kind)).toEqual(['ball', 'hinge', 'universal']);
    expect(digitigradeLeg().joints).toHaveLength(4);
    expect(insectLeg().joints.map((j) => j.kind)).toEqual(['hinge', 'hinge', 'hinge']);
    expect(pistonLeg().joints.some((j) => j.kind === 'slider')).toBe(true);
    expect(PRESET_NAMES.map((n) => dofCount(presetLeg(n)))).toEqual([6, 5, 3, 5]);
    expect(humanLeg().toe).toBeDefined();
  });

  test('proportions scale the leg', () => {
    const a = humanLeg();
    const b = humanLeg({ scale: 2 });
    expect(b.reach).toBeCloseTo(2 * a.reach, 12);
    expect(humanLeg({ thigh: 0.5 }).reach).toBeCloseTo(a.reach + 0.05, 12);
  });

  test.each(PRESET_NAMES.map((n) => [n]))('%s: rest pose within limits, the sole below the hip and within reach', (name) => {
    const chain = presetLeg(name);
    const ws = createWorkspace(chain);
    for (let i = 0; i < ws.nDof; i++) {
      expect(ws.restPose[i]).toBeGreaterThanOrEqual(ws.lo[i]);
      expect(ws.restPose[i]).toBeLessThanOrEqual(ws.hi[i]);
    }
    const f = forwardKinematics(ws);
    expect(f[1]).toBeLessThan(0);
    expect(Math.hypot(f[0], f[1], f[2])).toBeLessThanOrEqual(chain.reach + 1e-12);
  });

  test.each(PRESET_NAMES.map((n) => [n]))('%s: the mirrored chain gives the mirrored foot for mirrored poses', (name) => {
    const chain = presetLeg(name);
    const mirrored = mirrorChain(chain);
    const a = createWorkspace(chain);
    const b = createWorkspace(mirrored);
    const rng = mulberry32(3);
    for (let t = 0; t < 50; t++) {
      const p = new Float64Array(a.nDof);
      for (let i = 0; i < p.length; i++) p[i] = rng.range(-0.5, 0.5);
      const q = Float64Array.from(p);
      for (let j = 0; j < a.nJoints; j++) {
        if (a.jBall[j] < 0) continue;
        const d = a.jDof0[j];
        q[d + 1] = -p[d + 1];
        q[d + 2] = -p[d + 2];
      }
      setPose(a, p, false);
      setPose(b, q, false);
      const fa = forwardKinematics(a);
      const fb = forwardKinematics(b);
      expect(fb[0]).toBeCloseTo(-fa[0], 12);
      expect(fb[1]).toBeCloseTo(fa[1], 12);
      expect(fb[2]).toBeCloseTo(fa[2], 12);
    }
  });
});
