/** A trial: a walk (walk-state.ts) with a recorder observing it, and the result it gives. */
import type { PathTrack } from '../course/walk-path';
import type { TrialMetrics } from '../metrics/trial-metrics';
import type { GaitParams } from './gait-params';
import type { TrialRecorder } from './trial-record';
import type { TrialSeries } from './series';
import type { TrialOptions } from './trial-options';
import type { Walk } from './walk-state';

export interface TrialResult {
  rig: string;
  legNames: string[];
  gait: GaitParams;
  metrics: TrialMetrics;
  series: TrialSeries;
}

export interface Trial extends Walk {
  readonly course: import('../course/heightfield').Heightfield;
  readonly options: TrialOptions;
  /** Frames to run. */
  readonly totalFrames: number;
  /** Straight walks: the body's start along +Z, and where the walk ends (the course runs out), m. */
  readonly startZ: number;
  readonly lastBodyZ: number;
  /** The course's walk path, sampled (null: straight ahead); an open path ends at `lastS` along it, m. */
  readonly track: PathTrack | null;
  readonly lastS: number;
  /** What the trial measures (trial-record.ts). */
  readonly record: TrialRecorder;
}
