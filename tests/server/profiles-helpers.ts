/** The demo studio in a test app, with agents for its four members. */
import request from 'supertest';
import type { Role } from '../../schemas/roles';
import { DEMO_PASSWORD, DEMO_USERS, seedDemoStudio } from '../../seeds/demo-studio';
import { signedIn } from '../support/studio';
import type { TestApp } from '../support/test-app';

export async function demoStudio(t: TestApp) {
  const { teamId } = await seedDemoStudio(t.db, { now: t.clock.now(), dataDir: t.dataDir });
  const agents = {} as Record<Role, ReturnType<typeof request.agent>>;
  for (const u of DEMO_USERS) agents[u.role] = await signedIn(t.app, u.email, DEMO_PASSWORD);
  const profiles = await t.db('profiles as p').join('characters as c', 'c.id', 'p.character_id').where('p.team_id', teamId).select('p.id', 'c.name', 'c.id as characterId');
  const byName = Object.fromEntries(profiles.map((p) => [p.name, p])) as Record<'Wicket' | 'Burrow' | 'Skitter', { id: number; characterId: number }>;
  const suite = await t.db('suites').where({ team_id: teamId }).first('id');
  return { teamId, agents, profiles: byName, suiteId: suite.id as number };
}
