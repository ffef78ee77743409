/**
 * Gauntlet benchmark: every preset rig with its default setup, and every demo
 * character with its seeded setup, over the gauntlet (engine/course/gauntlet.ts)
 * and the demo suite. Columns: footing score, stumbles by kind, unconverged
 * solves, wall time, and the cost of a simulated second against the same rig
 * on flat ground, measured in the same run.
 * Goals: every row ≥ 90 with defaults; the demo suite ≥ 90 for all three demo
 * characters; a stairs trial costs at most 2× flat per simulated second.
 * `--json`: the last line is {"rows":[{"rig","course","score","stumbles":{…},"unconverged","wallMs"}…]}.
 * `--only NAME` keeps rows whose rig or course contains NAME.
 * `--tune N`: rows under 95 are then dialled in on their own course with N candidates (the product's
 * search, seeds/demo-setups.ts's settings and bounds) and the tuned score is printed beside them.
 */
import { generateCourse, type Heightfield } from '../../engine/course';
import { GAUNTLET } from '../../engine/course/gauntlet';
import { defaultLegSetup, type LegSetup } from '../../engine/gait/leg-setup';
import { PRESET_RIG_NAMES, presetRig } from '../../engine/gait/rig-presets';
import type { Rig } from '../../engine/gait/rig';
import { runTrial } from '../../engine/gait/trial';
import { STUMBLE_KINDS } from '../../engine/metrics/stumble-thresholds';
import { DEMO_COURSES } from '../../seeds/demo-courses';
import { demoCharacterRigs } from '../../seeds/demo-character-rigs';
import { seededSetupFor, tunedDimensions, withTuned } from '../../seeds/demo-setups';
import { createDialInSearch, evaluateCandidate } from '../../engine/dialin';

interface Row {
  rig: string;
  course: string;
  score: number;
  stumbles: Record<string, number>;
  unconverged: number;
  wallMs: number;
  msPerSimSecond: number;
}

function measure(rigName: string, rig: Rig, setup: LegSetup, courseName: string, course: Heightfield): Row {
  const t0 = performance.now();
  const r = runTrial(rig, setup, course, { duration: 60 });
  const wallMs = performance.now() - t0;
  const stumbles = Object.fromEntries(STUMBLE_KINDS.map((k) => [k, r.metrics.stumbles[k].count]));
  return {
    rig: rigName,
    course: courseName,
    score: r.metrics.footingScore,
    stumbles,
    unconverged: r.metrics.solver.unconverged,
    wallMs,
    msPerSimSecond: wallMs / Math.max(r.metrics.simSeconds, 1e-9),
  };
}

async function main(): Promise<void> {
  const json = process.argv.includes('--json');
  const onlyAt = process.argv.indexOf('--only');
  const only = onlyAt > 0 ? process.argv[onlyAt + 1] : null;
  const gauntlet = GAUNTLET.map((c) => ({ name: c.name, hf: generateCourse(c.recipe) }));
  const demoSuite = DEMO_COURSES.map((c) => ({ name: `demo: ${c.name}`, hf: generateCourse(c.recipe) }));
  const flat = generateCourse({ segments: [{ kind: 'flat', length: 60 }] });
  const stairs = generateCourse({
    cellSize: 0.02,
    segments: Array.from({ length: 6 }, () => [
      { kind: 'flat' as const, length: 2 },
      { kind: 'stairs' as const, steps: 6, riser: 0.178, tread: 0.279, direction: 'up' as const },
      { kind: 'flat' as const, length: 2 },
      { kind: 'stairs' as const, steps: 6, riser: 0.178, tread: 0.279, direction: 'down' as const },
    ]).flat(),
  });

  const subjects: { name: string; rig: Rig; setup: LegSetup; courses: { name: string; hf: Heightfield }[] }[] = [];
  for (const name of PRESET_RIG_NAMES) {
    const rig = presetRig(name);
    subjects.push({ name, rig, setup: defaultLegSetup(rig), courses: gauntlet });
  }
  for (const demo of await demoCharacterRigs()) subjects.push({ name: demo.name, rig: demo.rig, setup: seededSetupFor(demo.name, demo.rig), courses: [...gauntlet, ...demoSuite] });

  const rows: Row[] = [];
  const costs: string[] = [];
  for (const s of subjects) {
    const keep = (course: string) => !only || s.name.includes(only) || course.includes(only);
    // Warm-up so the JIT has compiled the loop before anything is timed.
    runTrial(s.rig, s.setup, flat, { duration: 3 });
    for (const c of s.courses) if (keep(c.name)) rows.push(measure(s.name, s.rig, s.setup, c.name, c.hf));
    if (!only) {
      const f = measure(s.name, s.rig, s.setup, 'long flat', flat);
      const st = measure(s.name, s.rig, s.setup, 'long stairs', stairs);
      costs.push(`${s.name.padEnd(10)} flat ${f.msPerSimSecond.toFixed(2)} ms/s, stairs ${st.msPerSimSecond.toFixed(2)} ms/s: ${(st.msPerSimSecond / f.msPerSimSecond).toFixed(2)}× (goal ≤ 2×)`);
    }
  }

  const pad = (v: string | number, n: number) => String(v).padStart(n);
  console.log(`${'rig'.padEnd(10)}${'course'.padEnd(34)}${pad('score', 7)}${STUMBLE_KINDS.map((k) => pad(k, 11)).join('')}${pad('unconv', 8)}${pad('wall ms', 9)}`);
  for (const r of rows) {
    console.log(
      `${r.rig.padEnd(10)}${r.course.padEnd(34)}${pad(r.score.toFixed(1), 7)}${STUMBLE_KINDS.map((k) => pad(r.stumbles[k], 11)).join('')}${pad(r.unconverged, 8)}${pad(r.wallMs.toFixed(1), 9)}`,
    );
  }
  const below = rows.filter((r) => r.score < 90);
  console.log(`rows below 90: ${below.length} of ${rows.length}; lowest ${Math.min(...rows.map((r) => r.score)).toFixed(1)}`);
  for (const c of costs) console.log(c);
  const tuneAt = process.argv.indexOf('--tune');
  if (tuneAt > 0) {
    const budget = Number(process.argv[tuneAt + 1] ?? 200);
    for (const r of rows.filter((x) => x.score < 95)) {
      const subject = subjects.find((x) => x.name === r.rig)!;
      const course = subject.courses.find((c) => c.name === r.course)!.hf;
      const dims = tunedDimensions(subject.rig, subject.setup);
      const search = createDialInSearch({ dimensions: dims, start: dims.map((d) => d.start), budget, seed: 2026 });
      let best = -Infinity;
      for (let batch = search.ask(); batch; batch = search.ask()) {
        const outs = batch.map((p) => evaluateCandidate(subject.rig, withTuned(subject.setup, dims, p.values), [course], { duration: 60 }));
        for (const o of outs) best = Math.max(best, o.footingScore);
        search.tell(outs.map((o) => o.objective));
      }
      console.log(`tuned (${budget} candidates): ${r.rig.padEnd(10)}${r.course.padEnd(34)}${r.score.toFixed(1)} → ${best.toFixed(1)}`);
    }
  }
  if (json) console.log(JSON.stringify({ rows: rows.map(({ msPerSimSecond: _m, ...r }) => r) }));
}

main().catch((e) => {
  console.error(e);
  process.exit(1);
});
