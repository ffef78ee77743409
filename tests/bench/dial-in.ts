/**
 * Dial-in benchmark: a dial-in of 200 candidates over 3 courses for the demo quadruped (Burrow, built from
 * its seed design and imported like an upload) through the piscina worker pool, batch by batch the way the
 * dial-in job runs it (server/workers/dial-in-search.ts). Prints wall time, how busy the cores were (process
 * CPU time over wall time × cores, from process.cpuUsage, which counts every thread) and each worker's
 * event-loop utilisation; the peer is the same search with every candidate evaluated on the main thread in
 * the same run, given as a ratio. Goal: under 30 s on a 2-core machine.
 * `--json`: the last line is {"candidates", "courses", "poolWallMs", "serialWallMs", "speedup", "coreBusy", "workerUtilization", "before", "best", "sameAsSerial"}.
 */
import os from 'node:os';
import { encodeCourse } from '../../engine/course/encoding';
import { generateCourse } from '../../engine/course/generators';
import { decodeCourse } from '../../engine/course/encoding';
import { evaluateCandidate, summariseOutcome, type CourseOutcome } from '../../engine/dialin/objective';
import { rigFromCharacter } from '../../engine/gait/character-rig';
import { defaultLegSetup } from '../../engine/gait/leg-setup';
import { createPiscinaPool } from '../../server/jobs/worker-pool';
import { importGltf } from '../../server/services/gltf-import';
import { mappingOf } from '../../engine/rig/leg-mapping';
import { runSearch, withValues, type DialInContext } from '../../server/workers/dial-in-search';
import { burrow } from '../../seeds/characters';
import { buildCharacterGlb } from '../../seeds/characters/rig-builder';
import type { DialInParam } from '../../schemas/dial-ins';
import { TRIAL_SECONDS } from '../../schemas/trials';

const CANDIDATES = 200;
const SEED = 2026;
const PARAMS: DialInParam[] = [
  { key: 'body.heightOffset', min: -0.25, max: 0.05 },
  { key: 'gait.stepHeight', min: 0.03, max: 0.2 },
  { key: 'solver.lambda', min: 0.005, max: 0.3 },
];
/** Three courses of our own, each about 14 m: rubble, a curb, a trench. */
const COURSES = [
  { segments: [{ kind: 'flat', length: 3 }, { kind: 'rubble', length: 8, amplitude: 0.05, featureSize: 0.5, seed: 11 }, { kind: 'flat', length: 3 }] },
  { segments: [{ kind: 'flat', length: 5 }, { kind: 'curb', length: 4, height: 0.12 }, { kind: 'flat', length: 5 }] },
  { segments: [{ kind: 'flat', length: 5 }, { kind: 'trench', length: 3, width: 0.5, depth: 0.2 }, { kind: 'flat', length: 6 }] },
] as const;

async function main(): Promise<void> {
  const json = process.argv.includes('--json');
  const glb = await buildCharacterGlb(burrow);
  const imported = await importGltf([{ originalname: 'burrow.glb', buffer: Buffer.from(glb) }]);
  const rig = rigFromCharacter(imported.skeleton, imported.detection.legs.map(mappingOf), { name: 'Burrow' });
  const base = defaultLegSetup(rig);
  const context: DialInContext = { rig, base, params: PARAMS, courses: COURSES.map((c) => encodeCourse(generateCourse(c as never))), options: { duration: TRIAL_SECONDS } };
  const input = { base, params: PARAMS, budget: CANDIDATES, seed: SEED };
  const cores = os.availableParallelism?.() ?? os.cpus().length;

  const pool = createPiscinaPool(2);
  const signal = new AbortController().signal;
  const onPool = async (values: Record<string, number>) =>
    summariseOutcome(await Promise.all(context.courses.map((_, course) => pool.run<CourseOutcome>('candidate', { context, values, course }, () => undefined, signal))));
  // Warm the threads (load tsx and the engine) before timing.
  await Promise.all([0, 1].map(() => onPool({})));
  const heightfields = context.courses.map((c) => decodeCourse(c));
  const onMain = async (values: Record<string, number>) => evaluateCandidate(rig, withValues(base, values), heightfields, context.options);
  const cpu0 = process.cpuUsage();
  const t0 = performance.now();
  const pooled = await runSearch(input, onPool);
  const poolWallMs = performance.now() - t0;
  const cpu = process.cpuUsage(cpu0);
  const workerUtilization = pool.eventLoopUtilization().map((u) => Number(u.toFixed(3)));
  await pool.close();
  const coreBusy = (cpu.user + cpu.system) / 1000 / (poolWallMs * Math.min(cores, 2));

  await onMain({});
  const s0 = performance.now();
  const serial = await runSearch(input, onMain);
  const serialWallMs = performance.now() - s0;

  const same = JSON.stringify(pooled.candidates) === JSON.stringify(serial.candidates);
  const row = {
    candidates: pooled.candidates.length,
    courses: context.courses.length,
    poolWallMs: Math.round(poolWallMs),
    serialWallMs: Math.round(serialWallMs),
    speedup: Number((serialWallMs / poolWallMs).toFixed(2)),
    coreBusy: Number(coreBusy.toFixed(2)),
    workerUtilization,
    before: pooled.start.outcome.footingScore,
    best: pooled.best.outcome.footingScore,
    sameAsSerial: same,
  };
  console.log(`dial-in, Burrow, ${row.candidates} candidates × ${row.courses} courses (${TRIAL_SECONDS} s trials, stopped by ${pooled.stopReason}):`);
  console.log(`  pool of 2 threads: ${(poolWallMs / 1000).toFixed(1)} s wall, both cores ${(coreBusy * 100).toFixed(0)} % busy (process CPU / wall × 2), worker event-loop use ${workerUtilization.map((u) => `${(u * 100).toFixed(0)} %`).join(', ')}`);
  console.log(`  main thread, one candidate after the other: ${(serialWallMs / 1000).toFixed(1)} s wall → pool speed-up ×${row.speedup}`);
  console.log(`  footing score ${row.before.toFixed(1)} → ${row.best.toFixed(1)}; pool and serial agree: ${same ? 'yes' : 'NO'}; goal under 30 s: ${poolWallMs < 30_000 ? 'met' : 'missed'}`);
  if (json) console.log(JSON.stringify(row));
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
