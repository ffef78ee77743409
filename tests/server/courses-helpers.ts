import request from 'supertest';
import type { Express } from 'express';
import { seedDemoStudio } from '../../seeds/demo-studio';
import { createStudio } from '../support/studio';
import { signedIn as signedInDemo, type Agent } from './characters-helpers';
import { signedIn as signedInStudio } from '../support/studio';
import type { TestApp } from '../support/test-app';

export type Who = 'owner' | 'designer' | 'programmer' | 'artlead' | 'outsider';

/** The demo studio (with its courses and suite) signed in as each role, plus the owner of another studio. */
export async function demoAgents(t: TestApp): Promise<{ as: Record<Who, Agent>; teamId: number; outsiderTeamId: number }> {
  const { teamId } = await seedDemoStudio(t.db, { now: t.clock.now(), dataDir: t.dataDir });
  const away = await createStudio(t.db, 'faraway');
  const as = {} as Record<Who, Agent>;
  for (const who of ['owner', 'designer', 'programmer', 'artlead'] as const) as[who] = await signedInDemo(t.app, `${who}@brassmoth.test`);
  as.outsider = await signedInStudio(t.app, away.members.owner.email);
  return { as, teamId, outsiderTeamId: away.teamId };
}

export const countRows = async (t: TestApp, table: string) => Number((await t.db(table).count({ n: '*' }).first())?.n);

export type { Agent };
export const anonymous = (app: Express) => request(app);
