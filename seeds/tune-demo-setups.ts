/**
 * A real dial-in for each demo character over the demo suite, whose results the seed uses as its leg
 * setups (seeds/demo-tuned-setups.json, written by this script; `npm run seed:tune`). The search is
 * the product's own (engine/dialin: a Latin hypercube, then Nelder–Mead from the best starts, on the
 * mean footing penalty); it is deterministic for its seed, so running this again on the same engine
 * writes the same file. Run it after changing the walking engine.
 */
import fs from 'node:fs';
import path from 'node:path';
import { generateCourse } from '../engine/course';
import { createDialInSearch, evaluateCandidate } from '../engine/dialin';
import { defaultLegSetup, type LegSetup } from '../engine/gait/leg-setup';
import type { Rig } from '../engine/gait/rig';
import { TRIAL_SECONDS } from '../schemas/trials';
import { demoCharacterRigs } from './demo-character-rigs';
import { DEMO_COURSES } from './demo-courses';
import { TUNED_SETUPS_FILE, tunedDimensions, withTuned, type TunedSetupsFile } from './demo-setups';

const BUDGET = 96;
const SEED = 2026;

function tune(rig: Rig, base: LegSetup, courses: ReturnType<typeof generateCourse>[]) {
  const dims = tunedDimensions(rig, base);
  const search = createDialInSearch({ dimensions: dims, start: dims.map((d) => d.start), budget: BUDGET, seed: SEED });
  const outcomes: ReturnType<typeof evaluateCandidate>[] = [];
  const values: number[][] = [];
  for (let batch = search.ask(); batch; batch = search.ask()) {
    const results = batch.map((p) => evaluateCandidate(rig, withTuned(base, dims, p.values), courses, { duration: TRIAL_SECONDS }));
    results.forEach((r, k) => {
      outcomes[batch[k].index] = r;
      values[batch[k].index] = batch[k].values;
    });
    search.tell(results.map((r) => r.objective));
  }
  return { s: search.summary(), outcomes, values };
}

async function main(): Promise<void> {
  const courses = DEMO_COURSES.map((c) => generateCourse(c.recipe));
  const file: TunedSetupsFile = { note: 'Written by seeds/tune-demo-setups.ts; do not edit by hand.', budget: BUDGET, seed: SEED, characters: {} };
  for (const { name, rig } of await demoCharacterRigs()) {
    const base = defaultLegSetup(rig);
    const { s, outcomes, values } = tune(rig, base, courses);
    const dims = tunedDimensions(rig, base);
    const best = outcomes[s.bestIndex];
    file.characters[name] = {
      values: Object.fromEntries(dims.map((d, k) => [d.key, values[s.bestIndex][k]])),
      startScores: outcomes[0].perCourse.map((c) => c.footingScore),
      bestScores: best.perCourse.map((c) => c.footingScore),
      tried: s.tried,
    };
    console.log(`${name}: tried ${s.tried}, start ${outcomes[0].footingScore.toFixed(1)} → best ${best.footingScore.toFixed(1)} (${best.perCourse.map((c) => c.footingScore.toFixed(1)).join(', ')})`);
  }
  fs.writeFileSync(TUNED_SETUPS_FILE, JSON.stringify(file, null, 2) + '\n');
  console.log(`wrote ${path.relative(process.cwd(), TUNED_SETUPS_FILE)}`);
}

main().catch((e) => {
  console.error(e);
  process.exit(1);
});
