/**
 * The gauntlet: the standard courses every rig must cross. Recipes of our own
 * (lengths, rubble seed, mixed order, the turn); the stair geometry is IBC 2021
 * §1011.5.2 (178 mm riser, 279 mm tread), the gentle ramp the 1:12 slope a
 * building code allows for ramps (common practice, no source).
 */
import { CODE_STAIRS, type CourseSpecInput } from './generators';

const LEAD = 3;
const RAMP_1_IN_12_DEG = (Math.atan(1 / 12) * 180) / Math.PI;
/** The turning course: a loop of this radius, m, through this many points, on flat ground with room for the legs. */
export const TURN_RADIUS = 2;
const TURN_POINTS = 16;
const TURN_CENTRE_Z = 3.5;

/** Control points of a circle of radius r about (0, cz), from its point nearest the start of the course (x 0, z cz − r), setting off toward +X. */
export function circlePoints(r: number, n: number, cz: number): { x: number; z: number }[] {
  return Array.from({ length: n }, (_, k) => ({ x: r * Math.sin((2 * Math.PI * k) / n), z: cz - r * Math.cos((2 * Math.PI * k) / n) }));
}

export interface GauntletCourse {
  name: string;
  recipe: CourseSpecInput;
}

export const GAUNTLET: readonly GauntletCourse[] = [
  {
    name: 'code stairs up',
    recipe: { cellSize: 0.02, segments: [{ kind: 'flat', length: LEAD }, { kind: 'stairs', steps: 8, ...CODE_STAIRS, direction: 'up' }, { kind: 'flat', length: LEAD }] },
  },
  {
    name: 'code stairs down',
    recipe: { cellSize: 0.02, segments: [{ kind: 'flat', length: LEAD }, { kind: 'stairs', steps: 8, ...CODE_STAIRS, direction: 'down' }, { kind: 'flat', length: LEAD }] },
  },
  {
    name: 'curb 15 cm up and down',
    recipe: { cellSize: 0.02, segments: [{ kind: 'flat', length: LEAD }, { kind: 'curb', length: 3, height: 0.15 }, { kind: 'curb', length: 3, height: -0.15 }, { kind: 'flat', length: LEAD }] },
  },
  {
    name: 'ramp 1:12 up and down',
    recipe: { segments: [{ kind: 'flat', length: LEAD }, { kind: 'ramp', length: 4, angleDeg: RAMP_1_IN_12_DEG }, { kind: 'flat', length: 1 }, { kind: 'ramp', length: 4, angleDeg: -RAMP_1_IN_12_DEG }, { kind: 'flat', length: LEAD }] },
  },
  {
    name: 'ramp 20° up and down',
    recipe: { cellSize: 0.04, segments: [{ kind: 'flat', length: LEAD }, { kind: 'ramp', length: 3, angleDeg: 20 }, { kind: 'flat', length: 1.5 }, { kind: 'ramp', length: 3, angleDeg: -20 }, { kind: 'flat', length: LEAD }] },
  },
  {
    name: 'rubble',
    recipe: { cellSize: 0.04, segments: [{ kind: 'flat', length: LEAD }, { kind: 'rubble', length: 8, amplitude: 0.05, featureSize: 0.5, seed: 907, octaves: 3 }, { kind: 'flat', length: LEAD }] },
  },
  {
    name: 'gap 25 cm',
    recipe: { cellSize: 0.02, segments: [{ kind: 'flat', length: LEAD }, { kind: 'trench', length: 1.5, width: 0.25, depth: 0.6 }, { kind: 'flat', length: 1.5 }, { kind: 'trench', length: 1.5, width: 0.25, depth: 0.6 }, { kind: 'flat', length: LEAD }] },
  },
  {
    name: 'mixed',
    recipe: {
      cellSize: 0.02,
      segments: [
        { kind: 'flat', length: LEAD },
        { kind: 'curb', length: 1.5, height: 0.1 },
        { kind: 'rubble', length: 3, amplitude: 0.04, featureSize: 0.4, seed: 31, octaves: 2 },
        { kind: 'stairs', steps: 4, ...CODE_STAIRS, direction: 'down' },
        { kind: 'flat', length: 1 },
        { kind: 'ramp', length: 2, angleDeg: 10 },
        { kind: 'trench', length: 1.2, width: 0.2, depth: 0.3 },
        { kind: 'flat', length: LEAD },
      ],
    },
  },
  {
    name: 'turn: 2 m circle',
    recipe: {
      width: 2 * TURN_CENTRE_Z,
      segments: [{ kind: 'flat', length: 2 * TURN_CENTRE_Z }],
      walkPath: { points: circlePoints(TURN_RADIUS, TURN_POINTS, TURN_CENTRE_Z), closed: true },
    },
  },
];
