/** The pose of sample k of a stored series, for the 3D view. */
import type { TrialSeries } from '../../engine/gait/series';
import type { WalkPose } from './walk-scene';

export function poseOfSample(s: TrialSeries, k: number): WalkPose {
  const i = Math.max(0, Math.min(s.length - 1, Math.round(k)));
  const L = s.legs;
  return {
    body: [0, s.bodyHeight[i], s.bodyZ[i]],
    pitch: s.bodyPitch[i],
    roll: s.bodyRoll[i],
    feet: s.foot.subarray(i * L * 3, (i + 1) * L * 3),
    targets: s.target.subarray(i * L * 3, (i + 1) * L * 3),
    contact: s.contact.subarray(i * L, (i + 1) * L),
  };
}
