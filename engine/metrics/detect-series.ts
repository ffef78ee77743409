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
  const contact = new Uint8Array(L);
  const foot = new Float64Array(3 * L);
  const target = new Float64Array(3 * L);
  const ground = new Float64Array(L);
  const speed = new Float64Array(L);
  for (let k = 0; k < series.length; k++) {
    for (let i = 0; i < L; i++) {
      for (let c = 0; c < 3; c++) {
        foot[3 * i + c] = series.foot[(k * L + i) * 3 + c];
        target[3 * i + c] = series.target[(k * L + i) * 3 + c];
      }
      contact[i] = series.contact[k * L + i];
      ground[i] = heightAt(course, foot[3 * i], foot[3 * i + 2]);
      speed[i] = series.jointSpeed[k * L + i];
    }
    det.observe(k / series.rate, contact, foot, target, ground, speed);
  }
  return det;
}
