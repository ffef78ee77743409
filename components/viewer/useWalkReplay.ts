import { useEffect, useState } from 'react';
import type { Heightfield } from '../../engine/course/heightfield';
import type { LegSetup } from '../../engine/gait/leg-setup';
import type { Rig } from '../../engine/gait/rig';
import type { TrialSeries } from '../../engine/gait/series';
import { REPLAY_TOLERANCE, replayFromRecord, startReplay, type WalkReplay } from './walk-replay';

/** Engine frames replayed per slice: a few milliseconds, so the page keeps answering while the walk replays. */
const FRAMES_PER_SLICE = 90;

export type ReplayState = { state: 'running' } | { state: 'ready'; replay: WalkReplay } | { state: 'failed'; reason: string };

/**
 * The poses of a stored trial's legs: from the joint angles it recorded, or (for trials stored before those were
 * recorded) by replaying it in the browser, in slices between frames. Either is checked against the record.
 * A replay that drifts from the stored feet (the course or the character's legs changed since the trial, or an
 * older engine recorded it) is refused with a reason, and the walk is drawn from the record as a skeleton.
 */
export function useWalkReplay(rig: Rig | null, setup: LegSetup | null, course: Heightfield | null, series: TrialSeries | null): ReplayState {
  const [state, setState] = useState<ReplayState>({ state: 'running' });
  useEffect(() => {
    if (!rig || !setup || !series) return;
    // The trial's own recorded joint angles first; the trial loop only for trials stored without them.
    let recorded: WalkReplay | null = null;
    try {
      recorded = replayFromRecord(rig, series);
    } catch {
      recorded = null;
    }
    if (recorded && recorded.footDeviation <= REPLAY_TOLERANCE) {
      setState({ state: 'ready', replay: recorded });
      return;
    }
    if (!course) {
      setState({ state: 'failed', reason: 'This trial recorded no joint angles and its course is gone, so the walk is drawn as a skeleton.' });
      return;
    }
    setState({ state: 'running' });
    let run: ReturnType<typeof startReplay>;
    try {
      run = startReplay(rig, setup, course, series);
    } catch (err) {
      setState({ state: 'failed', reason: `The walk cannot be replayed here (${(err as Error).message}); it is drawn as a skeleton.` });
      return;
    }
    let handle: ReturnType<typeof setTimeout> | null = null;
    const slice = () => {
      if (run.advance(FRAMES_PER_SLICE)) {
        handle = setTimeout(slice, 0);
        return;
      }
      const r = run.replay;
      if (r.footDeviation > REPLAY_TOLERANCE) {
        const mm = Number.isFinite(r.footDeviation) ? `${(r.footDeviation * 1000).toFixed(0)} mm` : 'a different length';
        setState({ state: 'failed', reason: `The replay of this trial differs from its record by ${mm} (the course or the legs changed since it ran), so the walk is drawn from the record as a skeleton.` });
      } else setState({ state: 'ready', replay: r });
    };
    handle = setTimeout(slice, 0);
    return () => {
      if (handle) clearTimeout(handle);
    };
  }, [rig, setup, course, series]);
  return state;
}
