import request from 'supertest';
import { testApp, type TestApp } from '../support/test-app';
import { seedDemoStudio } from '../../seeds/demo-studio';
import { characterDetailSchema, characterListSchema, characterUploadResultSchema, type CharacterDetail, type LegMapping } from '../../schemas/characters';
import { buildCharacterGlb } from '../../seeds/characters/rig-builder';
import { anonymised, file, wicket } from '../fixtures/gltf/build-fixtures';
import { footprint, signedIn, upload, type Agent } from './characters-helpers';
import { signUpThroughMail } from '../support/studio';

// Generous ceiling for loading the glTF libraries on a busy machine; no test asserts time.
jest.setTimeout(60_000);

let t: TestApp;
const as: Record<'owner' | 'designer' | 'programmer' | 'artlead' | 'outsider', Agent> = {} as never;

beforeAll(async () => {
  t = await testApp();
  await seedDemoStudio(t.db, { now: t.clock.now(), dataDir: t.dataDir });
  for (const who of ['owner', 'designer', 'programmer', 'artlead'] as const) as[who] = await signedIn(t.app, `${who}@brassmoth.test`);
  as.outsider = await signUpThroughMail(t.app, t.mail, { name: 'Oona Rivet', email: 'oona@rivet.test', password: 'a long enough phrase', teamName: 'Rivet Works' });
});
afterAll(() => t.cleanup());

async function detailOf(agent: Agent, id: number): Promise<CharacterDetail> {
  const res = await agent.get(`/api/characters/${id}`);
  expect(res.status).toBe(200);
  return characterDetailSchema.parse(res.body);
}

describe('the demo characters in the seed', () => {
  it('are listed for every role with legs, joints, size and uploader', async () => {
    for (const who of ['owner', 'designer', 'programmer', 'artlead'] as const) {
      const res = await as[who].get('/api/characters');
      expect(res.status).toBe(200);
      const { characters } = characterListSchema.parse(res.body);
      expect(characters.map((c) => [c.name, c.legCount]).sort()).toEqual([
        ['Burrow', 4],
        ['Skitter', 6],
        ['Wicket', 2],
      ]);
      for (const c of characters) {
        expect(c.uploadedBy.name).toBe('Ottilie Brass');
        expect(c.byteSize).toBeGreaterThan(1000);
        expect(c.sha256).toMatch(/^[0-9a-f]{64}$/);
      }
    }
  });

  it('serves the stored file as GLB bytes with the sha256 the row names', async () => {
    const { characters } = characterListSchema.parse((await as.artlead.get('/api/characters')).body);
    const wicketRow = characters.find((c) => c.name === 'Wicket')!;
    const res = await as.artlead.get(`/api/characters/${wicketRow.id}/file`).buffer(true).parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => cb(null, Buffer.concat(chunks)));
    });
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/model\/gltf-binary/);
    const body = res.body as Buffer;
    // glTF 2.0 §4.4.2: the GLB header starts with the magic "glTF" and version 2.
    expect(body.subarray(0, 4).toString('latin1')).toBe('glTF');
    expect(body.readUInt32LE(4)).toBe(2);
    expect(Buffer.from(await buildCharacterGlb(wicket)).equals(body)).toBe(true);
  });
});

describe('uploading', () => {
  it('lets a designer upload a .glb and answers 201 with the character, its legs and the import report', async () => {
    const { design } = anonymised(wicket);
    const glb = await buildCharacterGlb(design);
    const res = await upload(as.designer, [file('courier-anon.glb', glb)], 'Courier, anonymous bones');
    expect(res.status).toBe(201);
    const body = characterUploadResultSchema.parse(res.body);
    expect(body.existing).toBe(false);
    expect(body.character.name).toBe('Courier, anonymous bones');
    expect(body.character.legs.map((l) => l.side).sort()).toEqual(['left', 'right']);
    expect(body.character.uploadedBy.name).toBe('Dario Moth');
    // gltf-validator (Khronos reference validator): the generated rig has no errors.
    expect(body.report.validator.errors).toBe(0);
    expect(body.report.stats.joints).toBe(design.bones.length);
  });

  it('recognises the same file uploaded again by its sha256 and writes nothing new', async () => {
    const before = await footprint(t.db, t.dataDir);
    const res = await upload(as.owner, [file('wicket-again.glb', await buildCharacterGlb(wicket))]);
    expect(res.status).toBe(200);
    const body = characterUploadResultSchema.parse(res.body);
    expect(body.existing).toBe(true);
    expect(body.character.name).toBe('Wicket');
    expect(await footprint(t.db, t.dataDir)).toEqual(before);
  });

  it.each([
    ['programmer', 'programmer'],
    ['art lead', 'artlead'],
  ] as const)('refuses a %s with 403 and keeps nothing', async (_label, who) => {
    const before = await footprint(t.db, t.dataDir);
    const res = await upload(as[who], [file('mine.glb', await buildCharacterGlb(anonymised(wicket, 99).design))]);
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('forbidden');
    expect(await footprint(t.db, t.dataDir)).toEqual(before);
  });

  it('refuses a signed-out upload with 401', async () => {
    const res = await upload(request.agent(t.app), [file('x.glb', await buildCharacterGlb(wicket))]);
    expect(res.status).toBe(401);
  });

  it('refuses a request without a file with no_file', async () => {
    const res = await as.designer.post('/api/characters').field('name', 'Nothing');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('no_file');
  });

  it('refuses files sent under another field name', async () => {
    const res = await as.designer.post('/api/characters').attach('model', Buffer.from('glTF'), 'x.glb');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('no_file');
  });

  it('keeps the same file separately per team: another studio gets its own row, the bytes stay stored once', async () => {
    const before = await footprint(t.db, t.dataDir);
    const res = await upload(as.outsider, [file('wicket.glb', await buildCharacterGlb(wicket))]);
    expect(res.status).toBe(201);
    const after = await footprint(t.db, t.dataDir);
    expect(after.rows).toBe(before.rows + 1);
    expect(after.files).toEqual(before.files);
  });
});

describe("another team's characters", () => {
  it('are invisible: list, detail, file and leg edits answer as if they did not exist', async () => {
    const { characters } = characterListSchema.parse((await as.owner.get('/api/characters')).body);
    const ours = characters[0];
    const theirs = characterListSchema.parse((await as.outsider.get('/api/characters')).body).characters;
    expect(theirs.map((c) => c.name)).toEqual(['wicket']);
    for (const path of [`/api/characters/${ours.id}`, `/api/characters/${ours.id}/file`]) {
      const res = await as.outsider.get(path);
      expect(res.status).toBe(404);
    }
    const put = await as.outsider.put(`/api/characters/${ours.id}/legs`).send({ legs: ours.legs });
    expect(put.status).toBe(404);
  });

  it('answers 404 for ids that are not numbers or do not exist', async () => {
    expect((await as.owner.get('/api/characters/abc')).status).toBe(404);
    expect((await as.owner.get('/api/characters/999999')).status).toBe(404);
  });
});

describe('editing the leg mapping', () => {
  let burrowId: number;
  let detail: CharacterDetail;
  beforeAll(async () => {
    const { characters } = characterListSchema.parse((await as.designer.get('/api/characters')).body);
    burrowId = characters.find((c) => c.name === 'Burrow')!.id;
    detail = await detailOf(as.designer, burrowId);
  });

  it('stores a confirmed, edited mapping and marks it edited', async () => {
    const legs: LegMapping[] = detail.character.legs.map((l) => ({ ...l }));
    legs[0] = { ...legs[0], name: 'Front left (edited)', joints: legs[0].joints.map((j, k) => (k === 1 ? { ...j, limits: [{ min: -0.1, max: 2 }] } : j)) };
    const res = await as.designer.put(`/api/characters/${burrowId}/legs`).send({ legs });
    expect(res.status).toBe(200);
    const after = await detailOf(as.programmer, burrowId);
    expect(after.character.legsEdited).toBe(true);
    expect(after.character.legs[0].name).toBe('Front left (edited)');
    expect(after.character.legs[0].joints[1].limits).toEqual([{ min: -0.1, max: 2 }]);
    // What detection found stays available beside the edit.
    expect(after.detectedLegs[0].name).toBe('Left front');
  });

  it.each([['programmer'], ['artlead']] as const)('refuses a %s with 403', async (who) => {
    const res = await as[who].put(`/api/characters/${burrowId}/legs`).send({ legs: detail.character.legs });
    expect(res.status).toBe(403);
  });

  it('refuses a schema violation with field messages and changes nothing', async () => {
    const before = await detailOf(as.owner, burrowId);
    const legs = structuredClone(before.character.legs);
    legs[1].joints[0] = { ...legs[1].joints[0], dof: 'hinge' }; // a hinge needs one axis and one range; the ball had none
    legs[2].name = ' ';
    const res = await as.owner.put(`/api/characters/${burrowId}/legs`).send({ legs });
    expect(res.status).toBe(400);
    expect(res.body.error.fields['legs.1.joints.0.axes']).toMatch(/hinge joint has 1 axes/);
    expect(res.body.error.fields['legs.2.name']).toBe('Name the leg.');
    expect((await detailOf(as.owner, burrowId)).character).toEqual(before.character);
  });

  it('refuses joints that are not one branch, or a joint used by two legs, naming the joint', async () => {
    const before = await detailOf(as.owner, burrowId);
    const names = before.skeleton.joints.map((j) => j.name);
    const legs = structuredClone(before.character.legs);
    legs[1].end = legs[0].end; // the right front leg ending on the left front hoof
    const res = await as.owner.put(`/api/characters/${burrowId}/legs`).send({ legs });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_legs');
    expect(res.body.error.fields['legs.1.end']).toContain(`"${names[legs[0].end]}" is not below`);

    const twice = structuredClone(before.character.legs);
    twice[3] = { ...twice[2], name: 'Copy' };
    const res2 = await as.owner.put(`/api/characters/${burrowId}/legs`).send({ legs: twice });
    expect(res2.status).toBe(400);
    expect(res2.body.error.fields['legs.3.joints.0.joint']).toContain('is already part of');
    expect((await detailOf(as.owner, burrowId)).character).toEqual(before.character);
  });

  it('refuses duplicate leg names and joint indices outside the skeleton', async () => {
    const legs = structuredClone(detail.character.legs);
    legs[1].name = legs[0].name;
    const res = await as.owner.put(`/api/characters/${burrowId}/legs`).send({ legs });
    expect(res.status).toBe(400);
    expect(res.body.error.fields['legs.1.name']).toMatch(/already called/);
    const far = structuredClone(detail.character.legs);
    far[0].end = 9999;
    const res2 = await as.owner.put(`/api/characters/${burrowId}/legs`).send({ legs: far });
    expect(res2.status).toBe(400);
    expect(res2.body.error.fields['legs.0.end']).toMatch(/no joint 9999/);
  });
});
