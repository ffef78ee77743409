/**
 * Suite runs for compare, publish and the regression check, in-process: a 60 s trial takes tens of milliseconds,
 * so waiting on the job queue would only add latency. Trials are deterministic, so a run is cached by what
 * decides it (character file and legs, leg setup, course versions) and reused.
 */
import crypto from 'node:crypto';
import type { Db } from '../db';
import { HttpError } from '../errors';
import { defaultLegSetup, LegSetupSchema, type LegSetup } from '../../engine/gait/leg-setup';
import type { Rig } from '../../engine/gait/rig';
import { runSuite, type SuiteRun } from '../../engine/profile/run-suite';
import { roundProfileNumbers } from '../../engine/profile/export';
import { TRIAL_SECONDS } from '../../schemas/trials';
import { findSuite } from './suites';
import { loadSuiteCoursesToRun, type LoadedCourse } from './courses';
import { rigOf, type TrialCharacter } from './characters';
import { assertFitsRig } from './leg-setups';

export interface LoadedSuite {
  id: number;
  name: string;
  courses: LoadedCourse[];
}

/**
 * Checks a setup against the rig; a setup that does not fit (leg names, phase offsets) is a 400. Its numbers are
 * rounded as a published file carries them (and as saved versions are stored), so Compare, a profile and a build
 * check walk exactly the same setup: a trial can turn on a difference of 10⁻⁷.
 */
export function setupFor(rig: Rig, setup: unknown | undefined): LegSetup {
  const parsed = roundProfileNumbers(setup === undefined ? defaultLegSetup(rig) : LegSetupSchema.parse(setup));
  assertFitsRig(parsed, rig, 'legSetup');
  return parsed;
}

export async function loadSuite(db: Db, teamId: number, suiteId: number): Promise<LoadedSuite> {
  const suite = await findSuite(db, teamId, suiteId);
  const courses = await loadSuiteCoursesToRun(db, teamId, suiteId);
  return { id: suite.id, name: suite.name, courses };
}

const cache = new Map<string, SuiteRun>();
const CACHE_SIZE = 48;

export function runCharacterSuite(c: TrialCharacter, setup: LegSetup, suite: LoadedSuite): SuiteRun {
  const key = crypto
    .createHash('sha256')
    .update(JSON.stringify([c.sha256, c.unitScale ?? 1, c.legs, setup, suite.courses.map((k) => [k.id, k.version])]))
    .digest('hex');
  const hit = cache.get(key);
  if (hit) return hit;
  const rig = rigOf(c);
  let run: SuiteRun;
  try {
    // As long as a trial of record (and a dial-in's), so a course's score here is the one its trial shows.
    run = runSuite(rig, setup, suite.courses.map((k) => ({ name: k.name, heightfield: k.heightfield })), { duration: TRIAL_SECONDS });
  } catch (err) {
    throw new HttpError(400, 'trial_failed', `${c.name} could not walk the suite "${suite.name}": ${(err as Error).message}`);
  }
  if (cache.size >= CACHE_SIZE) cache.delete(cache.keys().next().value as string);
  cache.set(key, run);
  return run;
}
