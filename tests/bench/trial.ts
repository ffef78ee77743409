/**
 * Trial benchmark: a 60 s trial for each preset rig on flat, rubble and
 * stairs. Prints wall time, realtime factor (simulated seconds per wall
 * second) and leg solves per second; each course's time is also given as a
 * ratio to the same rig on flat, measured in the same run.
 * `--json`: the last line is {"trials":[{rig, course, simSeconds, wallMs, realtimeFactor, legSolvesPerSec}, …]}.
 * Goal: the quadruped rubble trial under 30 ms (≥ 2000× real time).
 */
import { CODE_STAIRS, generateCourse, type CourseSegmentInput, type Heightfield } from '../../engine/course';
import { defaultLegSetup } from '../../engine/gait/leg-setup';
import { PRESET_RIG_NAMES, presetRig } from '../../engine/gait/rig-presets';
import { runTrial } from '../../engine/gait/trial';

const SIM_SECONDS = 60;
const RUNS = 7;
const COURSE_LENGTH = 100;

function stairsSegments(): CourseSegmentInput[] {
  const segs: CourseSegmentInput[] = [];
  let z = 0;
  while (z < COURSE_LENGTH) {
    segs.push({ kind: 'flat', length: 2 });
    segs.push({ kind: 'stairs', steps: 6, riser: CODE_STAIRS.riser, tread: CODE_STAIRS.tread, direction: 'up' });
    segs.push({ kind: 'flat', length: 2 });
    segs.push({ kind: 'stairs', steps: 6, riser: CODE_STAIRS.riser, tread: CODE_STAIRS.tread, direction: 'down' });
    z += 4 + 12 * CODE_STAIRS.tread;
  }
  segs.push({ kind: 'flat', length: 2 });
  return segs;
}

const COURSES: Record<'flat' | 'rubble' | 'stairs', () => Heightfield> = {
  flat: () => generateCourse({ segments: [{ kind: 'flat', length: COURSE_LENGTH }] }),
  rubble: () =>
    generateCourse({
      segments: [
        { kind: 'flat', length: 3 },
        { kind: 'rubble', length: COURSE_LENGTH, amplitude: 0.04, featureSize: 0.6, seed: 2026 },
      ],
    }),
  stairs: () => generateCourse({ cellSize: 0.02, segments: stairsSegments() }),
};

interface Row {
  rig: string;
  course: string;
  simSeconds: number;
  wallMs: number;
  realtimeFactor: number;
  legSolvesPerSec: number;
}

function main(): void {
  const json = process.argv.includes('--json');
  const rows: Row[] = [];
  const courses = Object.fromEntries(Object.entries(COURSES).map(([k, make]) => [k, make()])) as Record<keyof typeof COURSES, Heightfield>;
  for (const rigName of PRESET_RIG_NAMES) {
    const rig = presetRig(rigName);
    const setup = defaultLegSetup(rig);
    for (const courseName of Object.keys(courses) as (keyof typeof COURSES)[]) {
      const course = courses[courseName];
      // Warm-up so the JIT has compiled the loop before it is timed.
      runTrial(rig, setup, course, { duration: 5 });
      let best = Infinity;
      let sim = 0;
      let solves = 0;
      for (let k = 0; k < RUNS; k++) {
        const t0 = performance.now();
        const r = runTrial(rig, setup, course, { duration: SIM_SECONDS });
        const ms = performance.now() - t0;
        if (ms < best) best = ms;
        sim = r.metrics.simSeconds;
        solves = r.metrics.solver.solves;
      }
      rows.push({
        rig: rigName,
        course: courseName,
        simSeconds: sim,
        wallMs: best,
        realtimeFactor: sim / (best / 1000),
        legSolvesPerSec: solves / (best / 1000),
      });
    }
  }
  const pad = (s: string, n: number) => s.padStart(n);
  console.log(`${'rig'.padEnd(10)}${'course'.padEnd(8)}${pad('sim s', 7)}${pad('wall ms', 9)}${pad('× real', 9)}${pad('solves/s', 11)}${pad('vs flat', 9)}`);
  for (const r of rows) {
    const flat = rows.find((x) => x.rig === r.rig && x.course === 'flat')!;
    console.log(
      `${r.rig.padEnd(10)}${r.course.padEnd(8)}${pad(r.simSeconds.toFixed(1), 7)}${pad(r.wallMs.toFixed(1), 9)}${pad(r.realtimeFactor.toFixed(0), 9)}${pad(r.legSolvesPerSec.toExponential(2), 11)}${pad((r.wallMs / flat.wallMs).toFixed(2) + '×', 9)}`,
    );
  }
  const goal = rows.find((r) => r.rig === 'quadruped' && r.course === 'rubble')!;
  console.log(`goal: quadruped rubble ${goal.wallMs.toFixed(1)} ms (target < 30 ms, ${goal.realtimeFactor.toFixed(0)}× real time, target ≥ 2000×)`);
  if (json) console.log(JSON.stringify({ trials: rows }));
}

main();
