/** The numbers a trial walks by, resolved from a leg setup and a rig. */
import type { GaitSettings } from './leg-setup';
import { PRESET_GAITS } from './patterns';
import type { Rig } from './rig';
import { ALEXANDER_STRIDE, GRAVITY, alexanderStride } from './stride';

export interface GaitParams {
  phaseOffsets: number[];
  dutyFactor: number;
  cycleTime: number;
  speed: number;
  stride: number;
  stepHeight: number;
}

/**
 * Stride for a given cycle time from Alexander's relation λ = a·h·(v²/gh)^b
 * with v = λ/T: solving for λ gives λ^(1−2b) = a·h^(1−b)·(g·T²)^(−b).
 */
export function alexanderStrideForCycle(hipHeight: number, cycleTime: number): number {
  const { coefficient: a, exponent: b } = ALEXANDER_STRIDE;
  return Math.pow(a * Math.pow(hipHeight, 1 - b) * Math.pow(GRAVITY * cycleTime * cycleTime, -b), 1 / (1 - 2 * b));
}

export function resolveGait(g: GaitSettings, rig: Rig): GaitParams {
  const offsets = g.phaseOffsets ?? (g.pattern === 'custom' ? null : PRESET_GAITS[g.pattern].phaseOffsets);
  if (!offsets || offsets.length !== rig.legs.length) {
    throw new Error(`gait: need ${rig.legs.length} phase offsets for rig ${rig.name}`);
  }
  let speed: number;
  let stride: number;
  let cycleTime: number;
  if (g.timing.mode === 'speed') {
    speed = g.timing.speed;
    stride = g.stride ?? alexanderStride(rig.hipHeight, speed);
    cycleTime = stride / speed;
  } else {
    cycleTime = g.timing.cycleTime;
    stride = g.stride ?? alexanderStrideForCycle(rig.hipHeight, cycleTime);
    speed = stride / cycleTime;
  }
  return { phaseOffsets: [...offsets], dutyFactor: g.dutyFactor, cycleTime, speed, stride, stepHeight: g.stepHeight };
}
