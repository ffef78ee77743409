import fs from 'node:fs';
import * as validator from 'gltf-validator';
import { testApp, type TestApp } from '../support/test-app';
import { seedDemoStudio } from '../../seeds/demo-studio';
import { characterDetailSchema, characterUploadResultSchema } from '../../schemas/characters';
import { buildCharacterGlb } from '../../seeds/characters/rig-builder';
import { DEMO_DESIGNS } from '../../seeds/characters';
import { brokenCorpus, file, wicketAsGltf, wicket, type BrokenCase } from '../fixtures/gltf/build-fixtures';
import { footprint, signedIn, upload, type Agent } from './characters-helpers';

// Generous ceiling for loading the glTF libraries on a busy machine; no test asserts time.
jest.setTimeout(60_000);

let t: TestApp;
let designer: Agent;
let corpus: BrokenCase[];

beforeAll(async () => {
  // A small cap for the "too large" refusal (TREADLE_MAX_UPLOAD_MB is read when the router is built).
  process.env.TREADLE_MAX_UPLOAD_MB = '0.5';
  t = await testApp();
  delete process.env.TREADLE_MAX_UPLOAD_MB;
  await seedDemoStudio(t.db, { now: t.clock.now(), dataDir: t.dataDir });
  designer = await signedIn(t.app, 'designer@brassmoth.test');
  corpus = await brokenCorpus();
});
afterAll(() => t.cleanup());

describe('the demo characters', () => {
  it.each(DEMO_DESIGNS.map((d) => [d.name, d] as const))('%s passes the Khronos glTF validator with no errors and no warnings', async (_name, design) => {
    // Reference: the Khronos gltf-validator package, which implements the glTF 2.0 specification's rules.
    const report = await validator.validateBytes(await buildCharacterGlb(design), { format: 'glb' });
    expect(report.issues.numErrors).toBe(0);
    expect(report.issues.numWarnings).toBe(0);
  });
});

describe('broken uploads', () => {
  it('refuses each with its own code and message, leaves no row or file behind, and keeps serving', async () => {
    const before = await footprint(t.db, t.dataDir);
    const messages = new Set<string>();
    for (const c of corpus) {
      const res = await upload(designer, c.files);
      expect({ what: c.what, status: res.status, code: res.body.error?.code }).toEqual({ what: c.what, status: 422, code: c.code });
      expect(res.body.error.message.length).toBeGreaterThan(20);
      messages.add(res.body.error.message);
      expect(await footprint(t.db, t.dataDir)).toEqual(before);
      expect((await designer.get('/api/health')).status).toBe(200);
    }
    // Every broken input gets a message of its own that names what is wrong with it.
    expect(messages.size).toBe(corpus.length);
    expect((await designer.get('/api/characters')).body.characters).toHaveLength(3);
  });

  it('covers every refusal an upload can meet', () => {
    const codes = new Set(corpus.map((c) => c.code));
    for (const code of ['empty_file', 'truncated_glb', 'not_gltf', 'broken_glb_chunk', 'missing_buffer', 'gltf_1', 'no_skin', 'no_joints', 'too_many_joints', 'too_deep', 'bad_transform', 'broken_buffer', 'no_legs']) {
      expect(codes).toContain(code);
    }
  });

  it('refuses a file over the size cap with 413 too_large', async () => {
    const before = await footprint(t.db, t.dataDir);
    const res = await upload(designer, [file('huge.glb', new Uint8Array(600 * 1024))]);
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('too_large');
    expect(res.body.error.message).toMatch(/limit/);
    expect(await footprint(t.db, t.dataDir)).toEqual(before);
  });
});

describe('.gltf uploads', () => {
  it('takes a .gltf with its .bin, packs it into one stored .glb, and recognises the same upload again', async () => {
    const { gltf, bin, binName } = await wicketAsGltf();
    const res = await upload(designer, [file('wicket.gltf', gltf), file(binName, bin)], 'Wicket from parts');
    expect(res.status).toBe(201);
    const body = characterUploadResultSchema.parse(res.body);
    expect(body.character.format).toBe('gltf');
    expect(body.character.legs).toHaveLength(2);
    expect(body.report.validator.errors).toBe(0);
    const again = await upload(designer, [file('wicket.gltf', gltf), file(binName, bin)]);
    expect(again.status).toBe(200);
    expect(again.body.existing).toBe(true);
    const stored = await designer.get(`/api/characters/${body.character.id}/file`).buffer(true).parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => cb(null, Buffer.concat(chunks)));
    });
    // glTF 2.0 §4.4.2: a GLB starts with "glTF", version 2.
    expect((stored.body as Buffer).subarray(0, 4).toString('latin1')).toBe('glTF');
  });

  it('takes a .gltf whose buffer is a base64 data URI, and knows it for the same character as the one sent with a .bin', async () => {
    const { gltf } = await wicketAsGltf(true);
    const res = await upload(designer, [file('wicket-embedded.gltf', gltf)], 'Wicket embedded');
    // Both pack into the same .glb bytes, so the sha256 matches the upload of the test above.
    expect(res.status).toBe(200);
    expect(res.body.existing).toBe(true);
    expect(res.body.character.name).toBe('Wicket from parts');
    expect(res.body.character.legCount).toBe(2);
  });
});

describe('the import report', () => {
  it('keeps the validator report and warns when the character looks like centimetres', async () => {
    // Wicket scaled ×100, as if exported in centimetres: 142 m tall instead of 1.42 m.
    const big = { ...wicket, name: 'Wicket cm', bones: wicket.bones.map((b) => ({ ...b, at: b.at.map((v) => v * 100) as [number, number, number] })), parts: [] };
    const res = await upload(designer, [file('wicket-cm.glb', await buildCharacterGlb(big))]);
    expect(res.status).toBe(201);
    const body = characterUploadResultSchema.parse(res.body);
    const unit = body.report.notes.find((n) => n.code === 'unit_scale');
    expect(unit?.message).toMatch(/centimetres/);
    expect(body.report.stats.height).toBeGreaterThan(50);
    const detail = characterDetailSchema.parse((await designer.get(`/api/characters/${body.character.id}`)).body);
    expect(detail.report).toEqual(body.report);
    expect(detail.detectedLegs).toHaveLength(2);
    expect(typeof detail.report.validator.version).toBe('string');
  });

  it('writes files only under their sha256 name, with no temporary files left', async () => {
    const { files } = await footprint(t.db, t.dataDir);
    for (const f of files) expect(f).toMatch(/^[0-9a-f]{64}\.glb$/);
    const rows = await t.db('characters').select('sha256');
    for (const r of rows) expect(fs.existsSync(`${t.dataDir}/characters/${r.sha256}.glb`)).toBe(true);
  });
});
