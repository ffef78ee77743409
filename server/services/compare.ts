/** Compare: 2–4 characters (their newest saved leg setup, or the default) or saved leg setup versions on one suite. */
import type { Db } from '../db';
import { HttpError } from '../errors';
import type { CompareQuery } from '../../schemas/compare';
import type { TrialResult } from '../../engine/gait/trial';
import type { SuiteMetrics } from '../../engine/profile/suite-metrics';
import { findCharacterRow, rigOf, trialCharacterOf } from './characters';
import { findLegSetupVersion } from './profile-leg-setups';
import { loadSuite, runCharacterSuite, setupFor } from './suite-runs';

const PLOT_POINTS = 150;

export interface ComparePlot {
  course: string;
  time: number[];
  /** Body position along the course, m: the axis that lines walks up (one stumbles where the ground does). */
  distance: number[];
  /** Body height above its start, m. */
  bodyHeight: (number | null)[];
  /** Mean foot-to-target distance over the legs, mm. */
  footError: (number | null)[];
}

export interface CompareEntry {
  pick: string;
  label: string;
  characterId: number;
  characterName: string;
  metrics: SuiteMetrics;
  plots: ComparePlot[];
}

function plotOf(course: string, r: TrialResult): ComparePlot {
  const s = r.series;
  const stride = Math.max(1, Math.ceil(s.length / PLOT_POINTS));
  const out: ComparePlot = { course, time: [], distance: [], bodyHeight: [], footError: [] };
  const h0 = s.length ? s.bodyHeight[0] : 0;
  for (let k = 0; k < s.length; k += stride) {
    out.time.push(Math.round((k / s.rate) * 1000) / 1000);
    out.distance.push(Math.round(s.bodyZ[k] * 1000) / 1000);
    out.bodyHeight.push(Math.round((s.bodyHeight[k] - h0) * 1e5) / 1e5);
    let e = 0;
    for (let i = 0; i < s.legs; i++) e += s.error[k * s.legs + i];
    out.footError.push(Math.round((e / s.legs) * 1e6) / 1e3);
  }
  return out;
}

async function newestSetupOf(db: Db, teamId: number, characterId: number): Promise<{ setup: unknown; version: number } | undefined> {
  const row = await db('leg_setups').where({ team_id: teamId, character_id: characterId }).orderBy('version', 'desc').first('setup', 'version');
  return row ? { setup: JSON.parse(row.setup), version: row.version } : undefined;
}

export async function compare(db: Db, teamId: number, q: CompareQuery) {
  const suite = await loadSuite(db, teamId, q.suite);
  const entries: CompareEntry[] = [];
  for (const pick of q.pick) {
    const id = Number(pick.slice(1));
    let characterId = id;
    let setupJson: unknown;
    let label: string;
    if (pick[0] === 's') {
      const saved = await findLegSetupVersion(db, teamId, id);
      characterId = saved.characterId;
      setupJson = saved.setup;
      label = `leg setup v${saved.version}`;
    } else {
      const newest = await newestSetupOf(db, teamId, id);
      setupJson = newest?.setup;
      label = newest ? `leg setup v${newest.version}` : 'engine defaults';
    }
    const row = await findCharacterRow(db, teamId, characterId);
    if (!row) throw new HttpError(404, 'not_found', `Pick ${pick}: that character was not found.`, { pick: `${pick} is not a character of your team.` });
    const character = trialCharacterOf(row);
    const setup = setupFor(rigOf(character, 'pick'), setupJson);
    const run = runCharacterSuite(character, setup, suite);
    entries.push({
      pick,
      label: `${row.name} · ${label}`,
      characterId: row.id,
      characterName: row.name,
      metrics: run.metrics,
      plots: run.trials.map((t) => plotOf(t.course, t.result)),
    });
  }
  return { suite: { id: suite.id, name: suite.name, courses: suite.courses.map((c) => c.name) }, entries };
}
