import type { Agent } from './characters-helpers';
import { seedDemoCourses } from '../../seeds/demo-courses';
import { createStudio, signedIn } from '../support/studio';
import type { TestApp } from '../support/test-app';

export type Who = 'owner' | 'designer' | 'programmer' | 'artlead' | 'outsider';

/**
 * A studio with one member per role and the demo courses and suite (seeded on their own, so these tests do not
 * wait for the rest of the demo studio), signed in as each role, plus the owner of another studio.
 */
export async function studioWithCourses(t: TestApp): Promise<{ as: Record<Who, Agent>; teamId: number; outsiderTeamId: number }> {
  const home = await createStudio(t.db, 'yard');
  const away = await createStudio(t.db, 'faraway');
  await seedDemoCourses(t.db, home.teamId, home.members.owner.id, t.clock.now());
  const as = {
    owner: await signedIn(t.app, home.members.owner.email),
    designer: await signedIn(t.app, home.members.designer.email),
    programmer: await signedIn(t.app, home.members.programmer.email),
    artlead: await signedIn(t.app, home.members.art_lead.email),
    outsider: await signedIn(t.app, away.members.owner.email),
  };
  return { as, teamId: home.teamId, outsiderTeamId: away.teamId };
}

export const countRows = async (t: TestApp, table: string) => Number((await t.db(table).count({ n: '*' }).first())?.n);

export type { Agent };
