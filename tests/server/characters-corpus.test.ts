/**
 * Characters shaped like real exporters' (tests/fixtures/gltf/exporter-corpus.ts) through the import: each passes
 * the Khronos glTF validator (the reference implementation of the glTF 2.0 rules) with no errors unless the case
 * is about validator errors, imports with the right legs, unit and notes, and its joints stand where three.js's
 * GLTFLoader (the reference loader) puts them, with the stored unit fix as the scene's scale, within 1e-6 m.
 * Then the one-tap unit fix through the API: a centimetre-scale quadruped, scaled by 0.01, runs a trial to "done".
 */
import * as THREE from 'three';
import { GLTFLoader } from 'three/examples/jsm/loaders/GLTFLoader.js';
import * as validator from 'gltf-validator';
import { analyseUpload, type ImportedCharacter } from '../../server/services/gltf-import-analyse';
import { jointWorldPositions } from '../../engine/rig/skeleton-world';
import { scaledSkeleton } from '../../engine/rig/skeleton-scale';
import { legPath } from '../../engine/rig/detect-legs';
import { characterDetailSchema, characterSchema } from '../../schemas/characters';
import { biped, exporterCorpus, zUpUnconverted, type CorpusCase } from '../fixtures/gltf/exporter-corpus';
import { buildCharacterDocument } from '../../seeds/characters/rig-builder';
import { memoryNodeIO } from '../../server/services/gltf-import-library';
import { testApp, type TestApp } from '../support/test-app';
import { signedIn } from '../support/studio';
import { upload, type Agent } from './characters-helpers';
import { pollJob, trialStudio, type TrialStudio } from './trials-helpers';

jest.setTimeout(180_000);

const corpus = exporterCorpus();
const bytes = new Map<string, Uint8Array>();
const imported = new Map<string, ImportedCharacter>();

beforeAll(async () => {
  for (const c of corpus) {
    const glb = await c.glb();
    bytes.set(c.id, glb);
    imported.set(c.id, await analyseUpload([{ originalname: `${c.id}.glb`, buffer: Buffer.from(glb) }]));
  }
});

/** three.js's joint world positions for the file, with the unit fix as the scene's uniform scale. */
async function threeJointPositions(glb: Uint8Array, unitScale: number): Promise<THREE.Vector3[]> {
  const data = glb.buffer.slice(glb.byteOffset, glb.byteOffset + glb.byteLength) as ArrayBuffer;
  const gltf = await new GLTFLoader().parseAsync(data, '');
  gltf.scene.scale.setScalar(unitScale);
  gltf.scene.updateMatrixWorld(true);
  const jointNodes: number[] = gltf.parser.json.skins[0].joints;
  const objects = await Promise.all(jointNodes.map((n) => gltf.parser.getDependency('node', n) as Promise<THREE.Object3D>));
  return objects.map((o) => new THREE.Vector3().setFromMatrixPosition(o.matrixWorld));
}

const sorted = <T>(xs: T[]) => [...xs].sort();

/** The stored file's bytes as served. */
async function fileOf(agent: Agent, id: number): Promise<Buffer> {
  const res = await agent.get(`/api/characters/${id}/file`).buffer(true).parse((r, cb) => {
    const chunks: Buffer[] = [];
    r.on('data', (c: Buffer) => chunks.push(c));
    r.on('end', () => cb(null, Buffer.concat(chunks)));
  });
  expect(res.status).toBe(200);
  return res.body as Buffer;
}

describe.each(corpus.map((c) => [c.id, c] as const))('%s', (_id, c: CorpusCase) => {
  it(`passes the Khronos glTF validator with ${c.expect.validatorErrors ? 'only the errors the case is about' : 'no errors'}`, async () => {
    const report = await validator.validateBytes(bytes.get(c.id)!, { format: 'glb' });
    if (c.expect.validatorErrors) expect(report.issues.numErrors).toBeGreaterThan(0);
    else expect(report.issues.numErrors).toBe(0);
  });

  it('imports with the right legs, sides, unit and notes', () => {
    const a = imported.get(c.id)!;
    expect(sorted(a.detection.legs.map((l) => l.side))).toEqual(sorted(c.expect.sides));
    expect(sorted(a.detection.legs.map((l) => legPath(l).length))).toEqual(sorted(c.expect.legJoints));
    expect(a.report.units?.guess?.factor ?? 1).toBe(c.expect.unitScale);
    const codes = a.report.notes.map((n) => n.code);
    for (const code of c.expect.notes) expect(codes).toContain(code);
    // Sides follow the names: every leg's joints carry its side's tag (names are our own designs' "_L"/"L" suffixes).
    for (const leg of a.detection.legs) {
      const tag = leg.side === 'left' ? /L$/ : /R$/;
      for (const j of legPath(leg)) expect(a.skeleton.joints[j].name).toMatch(tag);
    }
    const inLegs = new Set(a.detection.legs.flatMap((l) => legPath(l).map((j) => a.skeleton.joints[j].name)));
    for (const name of c.expect.outsideLegs ?? []) expect(inLegs).not.toContain(name);
  });

  it('puts every joint where three.js does, after the unit fix, within 1e-6 m', async () => {
    const a = imported.get(c.id)!;
    const factor = c.expect.unitScale;
    const ours = jointWorldPositions(scaledSkeleton(a.skeleton, factor));
    const theirs = await threeJointPositions(bytes.get(c.id)!, factor);
    expect(theirs).toHaveLength(a.skeleton.joints.length);
    let worst = 0;
    theirs.forEach((p, j) => {
      worst = Math.max(worst, Math.abs(p.x - ours[3 * j]), Math.abs(p.y - ours[3 * j + 1]), Math.abs(p.z - ours[3 * j + 2]));
    });
    expect(worst).toBeLessThan(1e-6);
    // And in metres: the fixed skeleton is the design's size (its authored height, lowest joint to highest).
    const ys = c.design.bones.map((b) => b.at[1]);
    let lo = Infinity;
    let hi = -Infinity;
    for (let j = 0; j < a.skeleton.joints.length; j++) {
      lo = Math.min(lo, ours[3 * j + 1]);
      hi = Math.max(hi, ours[3 * j + 1]);
    }
    expect(hi - lo).toBeCloseTo(Math.max(...ys) - Math.min(...ys), 6);
  });
});

describe('validator findings grouped by what they mean for walking', () => {
  it('calls a byte stride on animation and inverse-bind-matrix data harmless, each group linked to its glTF 2.0 rule', () => {
    const groups = imported.get('validator-strides')!.report.validator.groups!;
    const byCode = new Map(groups.map((g) => [g.code, g]));
    // glTF 2.0 §3.6.1.1: "Buffer views with other types of data MUST NOT not define byteStride" — the rule both break.
    for (const code of ['SKIN_IBM_ACCESSOR_WITH_BYTESTRIDE', 'ANIMATION_SAMPLER_ACCESSOR_WITH_BYTESTRIDE']) {
      expect(byCode.get(code)?.meaning).toBe('harmless');
      expect(byCode.get(code)?.severity).toBe('error');
    }
    for (const code of ['SKIN_IBM_ACCESSOR_WITH_BYTESTRIDE', 'ANIMATION_SAMPLER_ACCESSOR_WITH_BYTESTRIDE']) {
      expect(byCode.get(code)!.rule).toEqual({ section: '3.6.1 Buffers and Buffer Views', url: 'https://registry.khronos.org/glTF/specs/2.0/glTF-2.0.html#buffers-and-buffer-views-overview' });
    }
    expect(byCode.get('UNUSED_OBJECT')?.meaning).toBe('harmless');
    // The counts add up to the validator's own.
    const report = imported.get('validator-strides')!.report.validator;
    expect(groups.reduce((n, g) => n + g.count, 0)).toBe(report.issues.length);
    expect(groups.filter((g) => g.severity === 'error').reduce((n, g) => n + g.count, 0)).toBe(report.errors);
    const note = imported.get('validator-strides')!.report.notes.find((n) => n.code === 'validator_errors')!;
    expect(note.message).toMatch(new RegExp(`${report.errors} errors \\(of those listed: ${report.errors} harmless to walking\\)`));
  });

  it('calls a skinned mesh below the root a mesh matter, not a skeleton one', () => {
    const groups = imported.get('non-root-skinned-mesh')!.report.validator.groups!;
    expect(groups.map((g) => [g.code, g.meaning])).toEqual([['NODE_SKINNED_MESH_NON_ROOT', 'mesh']]);
    expect(groups[0].rule.url).toMatch(/#joint-hierarchy$/);
  });
});

describe('a Z-up file exported without converting', () => {
  it('is refused with no legs found, saying it looks authored Z-up and what to do', async () => {
    // glTF 2.0 §3.4: +Y is up. The same biped stood on its back has no chain hanging down in +Y.
    const glb = await zUpUnconverted(biped('Pell'));
    await expect(analyseUpload([{ originalname: 'lying.glb', buffer: Buffer.from(glb) }])).rejects.toMatchObject({
      code: 'no_legs',
      message: expect.stringMatching(/looks authored Z-up and exported without converting.*Export with \+Y up/),
    });
  });
});

describe('a validator error in the skeleton', () => {
  it('refuses the upload, naming the finding and the glTF 2.0 rule', async () => {
    // An inverse bind matrix whose last row is not (0, 0, 0, 1): glTF 2.0 §3.7.3 says IBMs are affine; the validator reports ACCESSOR_INVALID_IBM.
    const doc = buildCharacterDocument(biped('Pell'));
    const ibm = doc.getRoot().listSkins()[0].getInverseBindMatrices()!;
    const values = new Float32Array(ibm.getArray()!);
    values[16 * 2 + 3] = 0.5;
    ibm.setArray(values);
    const glb = await memoryNodeIO().writeBinary(doc);
    const report = await validator.validateBytes(glb, { format: 'glb' });
    expect(report.issues.messages.map((m) => m.code)).toContain('ACCESSOR_INVALID_IBM');
    await expect(analyseUpload([{ originalname: 'bent.glb', buffer: Buffer.from(glb) }])).rejects.toMatchObject({
      code: 'skeleton_invalid',
      message: expect.stringMatching(/ACCESSOR_INVALID_IBM.*glTF 2\.0 3\.7\.3 Skins \(https:\/\/registry\.khronos\.org\/glTF\/specs\/2\.0\/glTF-2\.0\.html#skins\)/),
    });
  });
});

describe('evidence in the unit the file is in', () => {
  it('prints a centimetre file’s lengths in cm before the fix', () => {
    const a = imported.get('quadruped-centimetres')!;
    for (const leg of a.detection.legs) for (const e of leg.evidence.filter((x) => /hangs/.test(x))) expect(e).toMatch(/^hangs \d+(\.\d)? cm over a length of \d+(\.\d)? cm$/);
  });
});

describe('the one-tap unit fix, through the API', () => {
  let t: TestApp;
  let studio: TrialStudio;
  let id: number;

  beforeAll(async () => {
    t = await testApp();
    studio = await trialStudio(t.db, t.dataDir, 'gorse', t.clock.now());
    const agent = await signedIn(t.app, studio.members.designer.email);
    const res = await upload(agent, [{ originalname: 'loper-cm.glb', buffer: Buffer.from(bytes.get('quadruped-centimetres')!) }], 'Loper in centimetres');
    expect(res.status).toBe(201);
    id = res.body.character.id;
  });
  afterAll(() => t.cleanup());

  it('offers 0.01, stores it with the character, keeps the file byte for byte, and shows metres afterwards', async () => {
    const agent = await signedIn(t.app, studio.members.designer.email);
    const before = characterDetailSchema.parse((await agent.get(`/api/characters/${id}`)).body);
    expect(before.character.unitScale).toBe(1);
    expect(before.report.units?.guess).toMatchObject({ unit: 'centimetres', factor: 0.01, certainty: 'likely' });
    const fileBefore = await fileOf(agent, id);

    const res = await agent.put(`/api/characters/${id}/unit-scale`).send({ unitScale: 0.01 });
    expect(res.status).toBe(200);
    expect(characterSchema.parse(res.body.character).unitScale).toBe(0.01);
    const after = characterDetailSchema.parse((await agent.get(`/api/characters/${id}`)).body);
    // Every rest position scaled by exactly the factor about the origin.
    after.skeleton.joints.forEach((j, i) => {
      for (let a = 0; a < 3; a++) expect(j.position[a]).toBeCloseTo(before.skeleton.joints[i].position[a] * 0.01, 9);
    });
    for (const leg of after.detectedLegs) for (const e of leg.evidence.filter((x) => /hangs/.test(x))) expect(e).toMatch(/ m over a length of \d\.\d{3} m$/);
    const fileAfter = await fileOf(agent, id);
    expect(Buffer.compare(fileAfter, fileBefore)).toBe(0);
    expect(Buffer.compare(fileAfter, Buffer.from(bytes.get('quadruped-centimetres')!))).toBe(0);
  });

  it('undoes the fix with 1: positions and evidence back in the file’s centimetres', async () => {
    const agent = await signedIn(t.app, studio.members.designer.email);
    expect((await agent.put(`/api/characters/${id}/unit-scale`).send({ unitScale: 1 })).status).toBe(200);
    const undone = characterDetailSchema.parse((await agent.get(`/api/characters/${id}`)).body);
    expect(undone.character.unitScale).toBe(1);
    expect(Math.max(...undone.skeleton.joints.map((j) => j.position[1]))).toBeGreaterThan(50);
    for (const leg of undone.detectedLegs) for (const e of leg.evidence.filter((x) => /hangs/.test(x))) expect(e).toMatch(/ cm over a length of \d+(\.\d)? cm$/);
    expect((await agent.put(`/api/characters/${id}/unit-scale`).send({ unitScale: 0.01 })).status).toBe(200);
  });

  it('refuses a scale that is not a positive number with a field message, changing nothing', async () => {
    const agent = await signedIn(t.app, studio.members.designer.email);
    for (const unitScale of [0, -0.01, 'a lot', 1e9]) {
      const res = await agent.put(`/api/characters/${id}/unit-scale`).send({ unitScale });
      expect(res.status).toBe(400);
      expect(res.body.error.fields.unitScale).toMatch(/scale/);
    }
    expect((await t.db('characters').where({ id }).first('unit_scale')).unit_scale).toBe(0.01);
    const artLead = await signedIn(t.app, studio.members.art_lead.email);
    expect((await artLead.put(`/api/characters/${id}/unit-scale`).send({ unitScale: 1 })).status).toBe(403);
  });

  it('runs a trial of the fixed centimetre quadruped to "done", with no failed job', async () => {
    const agent = await signedIn(t.app, studio.members.designer.email);
    const res = await agent.post('/api/trials').send({ characterId: id, courseId: studio.courses.curb });
    expect(res.status).toBe(202);
    const { job } = await pollJob(agent, res.body.job.id);
    expect(job.status).toBe('done');
    expect(Number((await t.db('jobs').where({ status: 'failed' }).count({ n: '*' }).first())?.n)).toBe(0);
  });
});
