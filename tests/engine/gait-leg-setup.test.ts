import { flatCourse } from '../../engine/course';
import {
  LegSetupSchema,
  PRESET_RIG_NAMES,
  checkLegSetupForRig,
  defaultLegSetup,
  parseLegSetup,
  presetRig,
  runTrial,
} from '../../engine/gait';
import { STORED_SOLVER_OPTIONS, SolverSettingsSchema, solverOptionsOf, type SolverSettings } from '../../engine/gait/leg-setup';
import { DEFAULT_OPTIONS, createWorkspace, type SolverOptions } from '../../engine/ik';
import { z } from 'zod';
import fs from 'node:fs';
import path from 'node:path';

describe('leg setup schema', () => {
  it.each(PRESET_RIG_NAMES)('the default setup of %s is valid, JSON-safe and fits its rig', (name) => {
    const rig = presetRig(name);
    const s = defaultLegSetup(rig);
    expect(parseLegSetup(JSON.parse(JSON.stringify(s)))).toEqual(s);
    expect(() => checkLegSetupForRig(s, rig)).not.toThrow();
  });
  it('converts to a JSON Schema (zod 4 toJSONSchema), as the profile export needs', () => {
    const schema = z.toJSONSchema(LegSetupSchema, { io: 'input' }) as { properties: Record<string, unknown> };
    expect(Object.keys(schema.properties)).toEqual(['version', 'solver', 'gait', 'body', 'footholds', 'legs']);
  });
  it('takes its solver defaults from the IK engine', () => {
    const s = defaultLegSetup(presetRig('quadruped'));
    expect(s.solver.method).toBe(DEFAULT_OPTIONS.method);
    expect(s.solver.lambda).toBe(DEFAULT_OPTIONS.lambda);
    expect(s.solver.maxIterations).toBe(DEFAULT_OPTIONS.maxIterations);
  });
  it('rejects bad input naming the field and the problem', () => {
    const s = defaultLegSetup(presetRig('biped'));
    expect(() => parseLegSetup({ ...s, solver: { ...s.solver, method: 'magic' } })).toThrow(/solver\.method/);
    expect(() => parseLegSetup({ ...s, gait: { ...s.gait, dutyFactor: 1.5 } })).toThrow(/gait\.dutyFactor/);
    expect(() => parseLegSetup({ ...s, gait: { ...s.gait, pattern: 'custom', phaseOffsets: null } })).toThrow(/custom pattern needs phaseOffsets/);
    expect(() => parseLegSetup({ ...s, version: 9 })).toThrow(/version/);
    expect(() => parseLegSetup({ ...s, legs: [{ leg: 'left', limits: [{ joint: 'knee', min: 1, max: 0 }] }] })).toThrow(/min must not exceed max/);
    expect(LegSetupSchema.safeParse({}).success).toBe(false);
  });
  it('rig-specific checks name the leg, joint or count that does not fit', () => {
    const rig = presetRig('biped');
    const s = defaultLegSetup(rig);
    expect(() => checkLegSetupForRig({ ...s, legs: [{ leg: 'tail', limits: [] }] }, rig)).toThrow(/no leg named tail/);
    expect(() => checkLegSetupForRig({ ...s, legs: [{ leg: 'left', limits: [{ joint: 'elbow', dof: 0, min: 0, max: 1 }] }] }, rig)).toThrow(
      /no joint named elbow/,
    );
    expect(() => checkLegSetupForRig({ ...s, gait: { ...s.gait, pattern: 'hexapod-tripod' } }, rig)).toThrow(/for 6 legs/);
    expect(() => checkLegSetupForRig({ ...s, gait: { ...s.gait, phaseOffsets: [0, 0.3, 0.6] } }, rig)).toThrow(/has 2 legs, got 3/);
  });
  it('a per-leg limit override reaches the solver: a knee held straight cannot lift the foot', () => {
    const rig = presetRig('biped');
    const s = defaultLegSetup(rig);
    s.legs = [{ leg: 'left', limits: [{ joint: 'knee', dof: 0, min: 0, max: 0.01 }] }];
    const stiff = runTrial(rig, s, flatCourse(30), { duration: 6 });
    const free = runTrial(rig, defaultLegSetup(rig), flatCourse(30), { duration: 6 });
    expect(stiff.metrics.tracking.rms).toBeGreaterThan(10 * free.metrics.tracking.rms);
  });
  it('a per-leg solver override applies to that leg only', () => {
    const rig = presetRig('quadruped');
    const s = defaultLegSetup(rig);
    s.legs = [{ leg: 'left-fore', limits: [], solver: { maxIterations: 1, lambda: 0.5, warmStart: 'previous' } }];
    const r = runTrial(rig, s, flatCourse(30), { duration: 6, recordRate: 60 });
    const meanError = (leg: number) => {
      let sum = 0;
      for (let k = 0; k < r.series.length; k++) sum += r.series.error[k * 4 + leg];
      return sum / r.series.length;
    };
    expect(meanError(0)).toBeGreaterThan(10 * meanError(1));
    expect(meanError(1)).toBeLessThan(s.solver.tolerance);
  });
  it('a custom pattern with its own offsets runs', () => {
    const rig = presetRig('quadruped');
    const s = defaultLegSetup(rig);
    s.gait = { ...s.gait, pattern: 'custom', phaseOffsets: [0, 0.5, 0.25, 0.75], dutyFactor: 0.7 };
    expect(runTrial(rig, s, flatCourse(20), { duration: 3 }).gait.phaseOffsets[2]).toBe(0.25);
  });
});

describe('solver settings: the stored names and the map to the engine', () => {
  // Outside reference: the published leg profile JSON Schema (draft 2020-12) that
  // saved setups and exported profiles follow.
  const publishedFile = path.join(__dirname, '../../assets/schema/leg-profile.schema.json');
  const published = JSON.parse(fs.readFileSync(publishedFile, 'utf8')) as { properties: { legSetup: { properties: { solver: { properties: Record<string, unknown> } } } } };
  const publishedSolverKeys = Object.keys(published.properties.legSetup.properties.solver.properties);

  it('keeps the field names and order of the published schema, so stored setups read as before', () => {
    expect(Object.keys(SolverSettingsSchema.shape)).toEqual(publishedSolverKeys);
    expect(Object.keys(defaultLegSetup(presetRig('biped')).solver)).toEqual(publishedSolverKeys);
  });

  it('hands every stored solver setting to the engine under its own name (common practice, no source)', () => {
    // Each setting moved off its default, so a setting the map forgets or swaps shows as the engine's default.
    const s: SolverSettings = {
      ...defaultLegSetup(presetRig('biped')).solver,
      method: 'sdls',
      maxIterations: 17,
      tolerance: 3e-4,
      orientationTolerance: 0.031,
      maxStepAngle: 0.41,
      maxStepLength: 0.07,
      clampDistance: 0.23,
      orientationWeight: 0.17,
      lambda: 0.09,
      svdThreshold: 2e-3,
      gammaMax: 0.51,
      adaptiveMode: 'manipulability',
      manipulabilityThreshold: 0.03,
      lmBias: 3e-3,
      nullSpace: { kind: 'rest', gain: 0.2 },
      minStep: 2e-8,
      resolveSaturated: false,
    };
    const ws = createWorkspace(presetRig('biped').legs[0].chain, solverOptionsOf(s));
    for (const k of STORED_SOLVER_OPTIONS) {
      expect([k, ws.options[k]]).toEqual([k, s[k]]);
      expect([k, ws.options[k]]).not.toEqual([k, DEFAULT_OPTIONS[k as keyof SolverOptions]]);
    }
    // null (off) is the engine's Infinity; a walk's solve starts from the pose the walk set.
    expect(ws.options.clampDistance).toBe(0.23);
    expect(createWorkspace(presetRig('biped').legs[0].chain, solverOptionsOf({ ...s, clampDistance: null })).options.clampDistance).toBe(Infinity);
    expect(ws.options.startPose).toBe('current');
  });
});

describe('trial input errors', () => {
  const rig = presetRig('biped');
  it('a course too short to walk on', () => {
    expect(() => runTrial(rig, defaultLegSetup(rig), flatCourse(2), { duration: 5 })).toThrow(/course too short/);
  });
  it('bad trial options', () => {
    expect(() => runTrial(rig, defaultLegSetup(rig), flatCourse(20), { timeStep: 2 })).toThrow(/timeStep/);
  });
  it('a leg setup that is not one', () => {
    expect(() => runTrial(rig, { version: 1 }, flatCourse(20))).toThrow(/invalid leg setup/);
  });
});
