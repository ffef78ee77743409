import request from 'supertest';
import type { Express } from 'express';
import type { Db } from '../../server/db';
import type { Role } from '../../schemas/roles';
import { hashPassword } from '../../server/services/accounts';

export const STUDIO_PASSWORD = 'gantry walk at dusk';
let passwordHash: Promise<string> | null = null;

export interface StudioMember {
  id: number;
  email: string;
  role: Role;
}

/** A team with one member per role (invented names), written straight to the database. */
export async function createStudio(db: Db, slug: string, now = 1): Promise<{ teamId: number; members: Record<Role, StudioMember> }> {
  passwordHash ??= hashPassword(STUDIO_PASSWORD);
  const hash = await passwordHash;
  const [teamId] = await db('teams').insert({ name: `Studio ${slug}`, created_at: now });
  const members = {} as Record<Role, StudioMember>;
  for (const [i, role] of (['owner', 'designer', 'programmer', 'art_lead'] as Role[]).entries()) {
    const email = `${role.replace('_', '')}@${slug}.test`;
    const [id] = await db('users').insert({ email, name: `${role} of ${slug}`, password_hash: hash, created_at: now });
    await db('memberships').insert({ team_id: teamId, user_id: id, role, created_at: now + i });
    members[role] = { id, email, role };
  }
  return { teamId, members };
}

/** A supertest agent holding a signed-in session of that member. */
export async function signedIn(app: Express, email: string, password = STUDIO_PASSWORD) {
  const agent = request.agent(app);
  const res = await agent.post('/api/auth/sign-in').send({ email, password });
  if (res.status !== 200) throw new Error(`sign-in of ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
  return agent;
}

/**
 * Sets up a studio the way a person does: sign-up, the link in the mail, the confirm step. Answers the signed-in
 * agent. `mail` is the test's mail catcher; use an address no other mail in the test went to.
 */
export async function signUpThroughMail(
  app: Express,
  mail: { waitFor(m: (x: { to: string; text: string }) => boolean): Promise<{ text: string }> },
  input: { name: string; email: string; password: string; teamName: string },
) {
  const agent = request.agent(app);
  const res = await agent.post('/api/auth/sign-up').send(input);
  if (res.status !== 202) throw new Error(`sign-up of ${input.email} failed: ${res.status} ${JSON.stringify(res.body)}`);
  const letter = await mail.waitFor((m) => m.to === input.email && /sign-up-confirm\//.test(m.text));
  const token = /sign-up-confirm\/([A-Za-z0-9_-]+)/.exec(letter.text)![1];
  const confirmed = await agent.post('/api/auth/sign-up/confirm').send({ token });
  if (confirmed.status !== 201) throw new Error(`confirming ${input.email} failed: ${confirmed.status} ${JSON.stringify(confirmed.body)}`);
  return agent;
}
