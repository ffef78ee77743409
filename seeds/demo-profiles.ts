import type { Db } from '../server/db';
import { publishProfile } from '../server/services/profiles';
import { loadCharacterRig } from '../server/services/characters';
import { setupFor } from '../server/services/suite-runs';
import { DEMO_SUITE } from './demo-courses';

/**
 * A first published leg profile version for each demo character, measured on the demo suite, and a second one
 * for Wicket with a little more damping, so the profiles screen has a change to show. Characters that already
 * have a profile are left as they are, so running it again changes nothing.
 */
export async function seedDemoProfiles(db: Db, teamId: number, fallbackAuthorId: number, now: number): Promise<void> {
  const suite = await db('suites').where({ team_id: teamId, name: DEMO_SUITE }).first('id');
  if (!suite) return;
  const designer = await db('users as u')
    .join('memberships as m', 'm.user_id', 'u.id')
    .where({ 'm.team_id': teamId, 'm.role': 'designer' })
    .orderBy('u.id')
    .first('u.id', 'u.name');
  const owner = await db('users').where({ id: fallbackAuthorId }).first('id', 'name');
  const author = designer ?? owner;
  const characters = await db('characters').where({ team_id: teamId }).orderBy('created_at').orderBy('id').select('id', 'name');
  let tick = 0;
  for (const c of characters) {
    if (await db('profiles').where({ character_id: c.id }).first('id')) continue;
    const at = now + 60_000 * tick++;
    // Publishes the character's newest saved leg setup (the leg-setup seed's), or the engine's defaults.
    const first = { teamId, author, characterId: c.id, suiteId: suite.id, notes: `First profile of ${c.name}, measured on ${DEMO_SUITE}.`, now: at };
    await publishProfile(db, first);
    if (c.name !== 'Wicket') continue;
    // Version 2: the same setup with more DLS damping (steadier knees near full extension).
    const { rig } = await loadCharacterRig(db, teamId, c.id);
    const latest = await db('profile_versions as v').join('profiles as p', 'p.id', 'v.profile_id').where('p.character_id', c.id).orderBy('v.version', 'desc').first('v.document');
    const setup = setupFor(rig, JSON.parse(latest.document).legSetup);
    const damped = { ...setup, solver: { ...setup.solver, lambda: Math.round((setup.solver.lambda * 1.5 + 0.01) * 1000) / 1000 } };
    // The note says what was changed and why; the score beside it on the profile page says how it went.
    await publishProfile(db, { ...first, legSetup: damped, notes: 'More DLS damping (λ × 1.5 + 0.01), tried for a steadier knee near full extension on the dock steps.', now: at + 30 * 60_000 });
  }
}
