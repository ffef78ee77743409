import type { Db } from '../server/db';
import type { Role } from '../schemas/roles';
import { hashPassword } from '../server/services/accounts';
import { seedDemoCharacters } from './demo-characters';
import { seedDemoCourses } from './demo-courses';
import { seedDemoTrials } from './demo-trials';
import { seedDemoProfiles } from './demo-profiles';

/** Demo-only sign-ins for the invented studio; never use these outside a local demo. */
export const DEMO_PASSWORD = 'treadle-demo';
export const DEMO_TEAM = 'Brassmoth Interactive';
export const DEMO_USERS: readonly { email: string; name: string; role: Role }[] = [
  { email: 'owner@brassmoth.test', name: 'Ottilie Brass', role: 'owner' },
  { email: 'designer@brassmoth.test', name: 'Dario Moth', role: 'designer' },
  { email: 'programmer@brassmoth.test', name: 'Priya Kettle', role: 'programmer' },
  { email: 'artlead@brassmoth.test', name: 'Anselm Vane', role: 'art_lead' },
];

/** Creates the demo studio, its members and its content; running it again changes nothing. */
export async function seedDemoStudio(db: Db, { now, dataDir }: { now: number; dataDir: string }): Promise<{ teamId: number }> {
  // The studio's story happened over the last two weeks: every seeded time is before `now` (each step below
  // spaces its rows by minutes at most, well inside the day between steps).
  const daysAgo = (d: number) => now - d * 86_400_000;
  const { teamId, ownerId } = await seedMembers(db, daysAgo(14));
  await seedDemoCharacters(db, teamId, ownerId, dataDir, daysAgo(10));
  await seedDemoCourses(db, teamId, ownerId, daysAgo(9));
  await seedDemoTrials(db, teamId, ownerId, daysAgo(6));
  await seedDemoProfiles(db, teamId, ownerId, daysAgo(2));
  return { teamId };
}

async function seedMembers(db: Db, now: number): Promise<{ teamId: number; ownerId: number }> {
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  return db.transaction(async (trx) => {
    let ownerId = 0;
    let team = await trx('teams').where({ name: DEMO_TEAM }).first('id');
    if (!team) {
      const [id] = await trx('teams').insert({ name: DEMO_TEAM, created_at: now });
      team = { id };
    }
    for (const [index, demo] of DEMO_USERS.entries()) {
      let user = await trx('users').where({ email: demo.email }).first('id');
      if (!user) {
        const [id] = await trx('users').insert({ email: demo.email, name: demo.name, password_hash: passwordHash, created_at: now });
        user = { id };
      }
      if (demo.role === 'owner') ownerId = user.id;
      const member = await trx('memberships').where({ team_id: team.id, user_id: user.id }).first();
      if (!member) {
        await trx('memberships').insert({ team_id: team.id, user_id: user.id, role: demo.role, created_at: now + index });
      }
    }
    return { teamId: team.id as number, ownerId };
  });
}

export async function databaseIsEmpty(db: Db): Promise<boolean> {
  const row = await db('users').count<{ n: number }[]>({ n: '*' }).first();
  return Number(row?.n ?? 0) === 0;
}
