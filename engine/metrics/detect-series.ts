/** Stumble detection over a recorded series (the same detector the trial loop feeds every frame). */
import type { Heightfield } from '../course/heightfield';
import { heightAt } from '../course/sample';
import type { TrialSeries } from '../gait/series';
import { StumbleDetector } from './stumble-detector';
import { DEFAULT_STUMBLE_THRESHOLDS, type StumbleThresholds } from './stumble-thresholds';

/**
 * Runs the detector over every recorded sample. Recorded at the trial's own
 * frame rate this gives exactly the trial's events; at a lower rate, runs
 * shorter than a sample can be missed.
 */
export function detectStumbles(
  series: TrialSeries,
  course: Heightfield,
  thresholds: StumbleThresholds = DEFAULT_STUMBLE_THRESHOLDS,
): StumbleDetector {
  const L = series.legs;
  const det = new StumbleDetector(L, thresholds);
  for (let k = 0; k < series.length; k++) {
    det.frame(k / series.rate);
    for (let i = 0; i < L; i++) {
      const a = (k * L + i) * 3;
      const fx = series.foot[a];
      const fy = series.foot[a + 1];
      const fz = series.foot[a + 2];
      det.leg(
        i,
        series.contact[k * L + i] === 1,
        fx,
        fy,
        fz,
        series.target[a],
        series.target[a + 1],
        series.target[a + 2],
        heightAt(course, fx, fz),
        series.jointSpeed[k * L + i],
      );
    }
  }
  return det;
}
