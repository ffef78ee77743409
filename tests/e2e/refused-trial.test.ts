/**
 * A trial that cannot run is refused with words a designer can act on: a quadruped authored in centimetres
 * (100 times too large in glTF's metres, glTF 2.0 §3.5.1) gets default settings over their limits; its setup
 * page says so beside the step height, and "Run trial" is refused with the setting, its limit and the unit
 * fix, and no job is started. Phone and wide.
 */
import type { Page } from 'playwright-core';
import { PHONE, WIDE, screenshot } from '../support/browser';
import { e2eStudio } from '../support/e2e';
import { buildCharacterGlb, type RigDesign, type V3 } from '../../seeds/characters/rig-builder';
import { burrow } from '../../seeds/characters';

jest.setTimeout(240_000);

const studio = e2eStudio();

function inCentimetres(design: RigDesign): RigDesign {
  const s = (v: V3): V3 => [v[0] * 100, v[1] * 100, v[2] * 100];
  return {
    name: 'Burrow (cm)',
    bones: design.bones.map((b) => ({ ...b, at: s(b.at) })),
    parts: design.parts.map((p) => ({ ...p, from: s(p.from), to: s(p.to), width: p.width * 100, depth: p.depth === undefined ? undefined : p.depth * 100 })),
  };
}

let characterId = 0;

async function openSetup(page: Page): Promise<void> {
  await studio.signIn(page, 'designer@brassmoth.test');
  if (!characterId) {
    const glb = Buffer.from(await buildCharacterGlb(inCentimetres(burrow)));
    const res = await page.request.post(`${studio.server.url}/api/characters`, {
      headers: { Origin: studio.server.url },
      multipart: { name: 'Burrow (cm)', file: { name: 'burrow-cm.glb', mimeType: 'model/gltf-binary', buffer: glb } },
    });
    expect(res.status()).toBe(201);
    characterId = (await res.json()).character.id;
  }
  await page.goto(`${studio.server.url}/characters/setup/${characterId}`);
  await page.getByRole('heading', { name: 'Burrow (cm): leg setup' }).waitFor();
}

describe('a trial that cannot run', () => {
  for (const [size, name] of [
    [PHONE, 'phone'],
    [WIDE, 'wide'],
  ] as const) {
    it(`is refused with the setting, its limit and the fix (${name})`, async () => {
      const page = await studio.newPage(size);
      await openSetup(page);
      const jobsBefore = Number((await studio.server.db('jobs').count({ n: '*' }).first())?.n);
      // The form says it beside the field, before anything is sent.
      const beside = page.getByText(/^Step height \d+(\.\d+)? m is above the 1 m limit; is the character in centimetres\?/).first();
      await beside.waitFor();
      const run = page.getByTestId('run-trial');
      await run.scrollIntoViewIfNeeded();
      await run.getByRole('button', { name: 'Run trial' }).click();
      const refused = run.getByText(/^This cannot run yet: Step height \d+(\.\d+)? m is above the 1 m limit; is the character in centimetres \(its hips stand \d+(\.\d+)? m up\)\? Apply the unit fix/);
      await refused.waitFor();
      expect(await run.getByText(/too_big|"code"|\[\{/).count()).toBe(0);
      expect(await run.getByText('Walking the course').count()).toBe(0);
      expect(Number((await studio.server.db('jobs').count({ n: '*' }).first())?.n)).toBe(jobsBefore);
      // Just above the phone's tab bar, below the preview that stays in view.
      await refused.evaluate((el) => el.scrollIntoView({ block: 'end' }));
      await page.mouse.wheel(0, 90);
      await page.waitForTimeout(200);
      await screenshot(page, `refused-trial-${name}`);
      // Beside the field now: the server's words, with the rig's own height.
      const afterRefusal = page.getByText(/^Step height \d+(\.\d+)? m is above the 1 m limit; is the character in centimetres \(its hips stand/).first();
      await afterRefusal.scrollIntoViewIfNeeded();
      // The preview says why it cannot walk in the same words, not the schema's.
      expect(await page.getByText(/Too big|expected number/).count()).toBe(0);
      await screenshot(page, `refused-trial-field-${name}`);
      await page.context().close();
    });
  }

  for (const [size, name] of [
    [PHONE, 'phone'],
    [WIDE, 'wide'],
  ] as const) {
    it(`and its dial-in is refused the same way, before any candidate is held (${name})`, async () => {
      const page = await studio.newPage(size);
      await openSetup(page);
      await page.goto(`${studio.server.url}/characters/dial-in/${characterId}`);
      await page.getByRole('heading', { name: 'Burrow (cm): dial-in' }).waitFor();
      for (const label of ['DLS damping λ', 'Iteration budget', 'Largest joint change per iteration', 'Duty factor', 'Step height', 'Body settling time', 'Body follows the feet’s height', 'Crouch per radian of slope', 'Body height offset']) {
        const group = page.getByRole('radiogroup', { name: new RegExp(`^${label}( \\(|  ·|$| ·)`) });
        await group.getByRole('radio', { name: label === 'DLS damping λ' ? 'tune' : 'keep' }).click();
      }
      await page.getByRole('radio', { name: 'Scrapyard crossing' }).click();
      await page.getByLabel('Budget (candidates; each is a trial per course)').fill('6');
      const jobsBefore = Number((await studio.server.db('jobs').count({ n: '*' }).first())?.n);
      await page.getByRole('button', { name: 'Start the dial-in' }).click();
      const refused = page.getByText(/^This cannot run yet: Step height \d+(\.\d+)? m is above the 1 m limit; is the character in centimetres/);
      await refused.waitFor();
      expect(Number((await studio.server.db('jobs').count({ n: '*' }).first())?.n)).toBe(jobsBefore);
      await refused.evaluate((el) => el.scrollIntoView({ block: 'center' }));
      await page.waitForTimeout(200);
      await screenshot(page, `refused-dial-in-${name}`);
      await page.context().close();
    });
  }
});
