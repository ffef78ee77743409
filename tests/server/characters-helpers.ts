import fs from 'node:fs';
import path from 'node:path';
import request from 'supertest';
import type { Express } from 'express';
import type { Db } from '../../server/db';
import { DEMO_PASSWORD } from '../../seeds/demo-studio';
import type { UploadedFile } from '../../server/services/gltf-import';

export type Agent = ReturnType<typeof request.agent>;

export async function signedIn(app: Express, email: string, password = DEMO_PASSWORD): Promise<Agent> {
  const agent = request.agent(app);
  const res = await agent.post('/api/auth/sign-in').send({ email, password });
  if (res.status !== 200 && res.status !== 204) throw new Error(`sign-in as ${email} answered ${res.status}`);
  return agent;
}

export function upload(agent: Agent, files: UploadedFile[], name?: string) {
  let req = agent.post('/api/characters');
  if (name !== undefined) req = req.field('name', name);
  for (const f of files) req = req.attach('file', f.buffer, f.originalname);
  return req;
}

/** Rows in the characters table and files (including temporary ones) under the data folder. */
export async function footprint(db: Db, dataDir: string): Promise<{ rows: number; files: string[] }> {
  const rows = Number((await db('characters').count({ n: '*' }).first())?.n);
  const dir = path.join(dataDir, 'characters');
  const files = fs.existsSync(dir) ? fs.readdirSync(dir).sort() : [];
  return { rows, files };
}
