/** A studio with the demo characters and a few generated courses and a suite, for the trial, job and dial-in tests. */
import type { Db } from '../../server/db';
import { storeCharacterUpload } from '../../server/services/gltf-import-store';
import { insertCourse } from '../../server/services/courses';
import { createSuite } from '../../server/services/suites';
import { buildCharacterGlb } from '../../seeds/characters/rig-builder';
import { burrow, wicket } from '../../seeds/characters';
import { generateCourse, type CourseSpecInput } from '../../engine/course/generators';
import { createStudio, type StudioMember } from '../support/studio';
import type { Role } from '../../schemas/roles';
import type { Job } from '../../schemas/jobs';
import type { Agent } from './characters-helpers';

/** Courses of our own: short rubble, a curb and a trench, each with flat run-in and run-out. */
export const TEST_COURSES: Record<string, CourseSpecInput> = {
  rubble: { segments: [{ kind: 'flat', length: 3 }, { kind: 'rubble', length: 8, amplitude: 0.05, featureSize: 0.5, seed: 11 }, { kind: 'flat', length: 3 }] },
  curb: { segments: [{ kind: 'flat', length: 5 }, { kind: 'curb', length: 4, height: 0.12 }, { kind: 'flat', length: 5 }] },
  trench: { segments: [{ kind: 'flat', length: 5 }, { kind: 'trench', length: 3, width: 0.5, depth: 0.2 }, { kind: 'flat', length: 6 }] },
};

export interface TrialStudio {
  teamId: number;
  members: Record<Role, StudioMember>;
  characters: { wicket: number; burrow: number };
  courses: Record<keyof typeof TEST_COURSES, number>;
  suiteId: number;
}

export async function trialStudio(db: Db, dataDir: string, slug: string, now: number): Promise<TrialStudio> {
  const { teamId, members } = await createStudio(db, slug, now);
  const store = { db, dataDir, now: () => now };
  const characters = { wicket: 0, burrow: 0 };
  for (const [key, design] of [['wicket', wicket], ['burrow', burrow]] as const) {
    const glb = await buildCharacterGlb(design);
    const stored = await storeCharacterUpload(store, { teamId, userId: members.owner.id, name: design.name, files: [{ originalname: `${key}.glb`, buffer: Buffer.from(glb) }] });
    characters[key] = stored.id;
  }
  const courses = {} as Record<string, number>;
  for (const [name, spec] of Object.entries(TEST_COURSES)) {
    courses[name] = await insertCourse(db, { teamId, userId: members.owner.id, name: `Test ${name}`, heightfield: generateCourse(spec), generator: null, now });
  }
  const suiteId = await createSuite(db, { teamId, userId: members.owner.id, name: 'Test suite', courseIds: Object.values(courses), now });
  return { teamId, members, characters, courses: courses as TrialStudio['courses'], suiteId };
}

/** Polls GET /api/jobs/:id until the job is finished; returns every progress value seen, in order. */
export async function pollJob(agent: Agent, id: number, timeoutMs = 120_000): Promise<{ job: Job; seen: number[] }> {
  const seen: number[] = [];
  const until = Date.now() + timeoutMs;
  for (;;) {
    const res = await agent.get(`/api/jobs/${id}`);
    if (res.status !== 200) throw new Error(`GET /api/jobs/${id} answered ${res.status} ${JSON.stringify(res.body)}`);
    const job = res.body as Job;
    seen.push(job.progress);
    if (job.status === 'done' || job.status === 'failed' || job.status === 'cancelled') return { job, seen };
    if (Date.now() > until) throw new Error(`job ${id} still ${job.status} at ${job.progress}%`);
    await new Promise((r) => setTimeout(r, 15));
  }
}
