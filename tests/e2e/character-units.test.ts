/**
 * Characters from real exporters in the browser: the one-tap unit fix on a quadruped authored in centimetres (the
 * figure shown turns to metres and the button goes away), the validator's findings grouped by what they mean for
 * walking with links to the glTF 2.0 rules, and a 3D view that frames the whole character (nothing drawn in the
 * canvas's top rows, where a cropped head would show). Screenshots at phone and wide sizes.
 */
import type { Page } from 'playwright-core';
import { PHONE, WIDE, screenshot } from '../support/browser';
import { e2eStudio } from '../support/e2e';
import { exporterCorpus } from '../fixtures/gltf/exporter-corpus';

jest.setTimeout(240_000);

const studio = e2eStudio();
const corpus = exporterCorpus();
const glbOf = (id: string) => corpus.find((c) => c.id === id)!.glb();

/** Uploads through the API in the page's own session (as the upload form does) and returns the character's id. */
async function uploadAs(page: Page, id: string, name: string): Promise<number> {
  const res = await page.request.post(`${studio.server.url}/api/characters`, {
    headers: { Origin: studio.server.url },
    multipart: { name, file: { name: `${id}.glb`, mimeType: 'model/gltf-binary', buffer: Buffer.from(await glbOf(id)) } },
  });
  if (res.status() !== 201) throw new Error(`upload of ${id} answered ${res.status()}: ${await res.text()}`);
  return (await res.json()).character.id;
}

/** Pixels of the 3D view that differ clearly from its clear colour: in all, and in the top rows of the canvas. */
async function drawnPixels(page: Page): Promise<{ drawn: number; top: number }> {
  return page.evaluate(() => {
    const canvas = document.querySelector('[data-testid="character-viewer"] canvas') as HTMLCanvasElement | null;
    if (!canvas) throw new Error('no canvas in the viewer');
    const gl = (canvas.getContext('webgl2') ?? canvas.getContext('webgl')) as WebGLRenderingContext;
    const { drawingBufferWidth: w, drawingBufferHeight: h } = gl;
    const px = new Uint8Array(w * h * 4);
    gl.readPixels(0, 0, w, h, gl.RGBA, gl.UNSIGNED_BYTE, px);
    const clear = [0xec, 0xe6, 0xd8];
    const band = Math.max(2, Math.round(h * 0.02));
    let drawn = 0;
    let top = 0;
    for (let y = 0; y < h; y++) {
      for (let x = 0; x < w; x++) {
        const i = 4 * (y * w + x);
        const d = Math.abs(px[i] - clear[0]) + Math.abs(px[i + 1] - clear[1]) + Math.abs(px[i + 2] - clear[2]);
        if (d <= 40) continue;
        drawn++;
        // readPixels starts at the bottom row: the top of the picture is y near h.
        if (y >= h - band) top++;
      }
    }
    return { drawn, top };
  });
}

async function waitForMesh(page: Page) {
  await page.locator('[data-testid="character-viewer"] canvas').waitFor();
  await page.getByText('Loading the mesh…').waitFor({ state: 'detached' });
  await page.waitForTimeout(200);
}

describe('characters from real exporters', () => {
  it('scales a centimetre quadruped to metres in one tap at phone size, then hides the button', async () => {
    const page = await studio.newPage(PHONE);
    await studio.signIn(page, 'designer@brassmoth.test');
    const id = await uploadAs(page, 'quadruped-centimetres', 'Loper in centimetres');
    await page.goto(`${studio.server.url}/characters/${id}`);
    await waitForMesh(page);
    const fix = page.getByRole('button', { name: 'Scale by 0.01 (centimetres to metres)' });
    await fix.waitFor();
    // 86 units tall: until the fix the figures are labelled in the unit the file is in, never centimetres as "m".
    await page.getByText('86.0 cm', { exact: true }).waitFor();
    expect(await page.getByText('86.0 m', { exact: true }).count()).toBe(0);
    await page.getByText('This file looks authored in centimetres').waitFor();
    const before = await drawnPixels(page);
    expect(before.drawn).toBeGreaterThan(500);
    expect(before.top).toBe(0);
    await screenshot(page, 'character-units-before-phone');
    await page.setViewportSize(WIDE);
    await fix.waitFor();
    await screenshot(page, 'character-units-before-wide');
    await page.getByLabel('Import report').scrollIntoViewIfNeeded();
    await screenshot(page, 'character-units-report-before-wide');
    await page.setViewportSize(PHONE);
    // The phone layout replaces the wide one's elements; click() scrolls to the new button and retries while it settles.
    await fix.waitFor();

    await fix.click();
    await page.getByText('Scaled by 0.01 to metres').waitFor();
    await page.getByText('0.860 m', { exact: true }).waitFor();
    expect(await page.getByText('86.0 cm', { exact: true }).count()).toBe(0);
    expect(await fix.count()).toBe(0);
    // The legs' evidence is measured again in metres.
    expect(await page.getByText(/hangs \d+\.\d cm/).count()).toBe(0);
    await waitForMesh(page);
    const after = await drawnPixels(page);
    expect(after.drawn).toBeGreaterThan(500);
    expect(after.top).toBe(0);
    await screenshot(page, 'character-units-after-phone');
    await page.getByLabel('Import report').scrollIntoViewIfNeeded();
    await screenshot(page, 'character-units-report-phone');

    // Undo brings the file's own reading back, and the offer with it.
    await page.getByRole('button', { name: 'Undo the scale' }).click();
    await fix.waitFor();
    await page.getByText('86.0 cm', { exact: true }).waitFor();
    await page.getByText(/hangs 60\.0 cm over a length of/).first().waitFor();
    expect(await page.getByText('Scaled by 0.01 to metres').count()).toBe(0);
    await page.close();
  });

  it('groups validator findings by what they mean for walking, each linked to its glTF 2.0 rule (wide)', async () => {
    const page = await studio.newPage(WIDE);
    await studio.signIn(page, 'designer@brassmoth.test');
    const id = await uploadAs(page, 'validator-strides', 'Loper with strides');
    await page.goto(`${studio.server.url}/characters/${id}`);
    await waitForMesh(page);
    const groups = page.getByLabel('Validator findings by what they mean for walking');
    await groups.waitFor();
    await groups.getByText(/^Harmless to walking · \d+ findings$/).waitFor();
    expect(await groups.getByText(/^Affects the skeleton/).count()).toBe(0);
    // Both strides break glTF 2.0 §3.6.1: "Buffer views with other types of data MUST NOT define byteStride".
    const strideRules = groups.getByRole('link', { name: 'glTF 2.0 §3.6.1 Buffers and Buffer Views' });
    expect(await strideRules.count()).toBe(2);
    expect(await strideRules.first().getAttribute('href')).toBe('https://registry.khronos.org/glTF/specs/2.0/glTF-2.0.html#buffers-and-buffer-views-overview');
    // The digitigrade hind legs are named beside the legs, with what to do.
    await page.getByLabel('What to know about these legs').getByText(/Left hind is digitigrade/).waitFor();
    const view = await drawnPixels(page);
    expect(view.drawn).toBeGreaterThan(500);
    expect(view.top).toBe(0);
    await screenshot(page, 'character-units-findings-wide');
    await groups.scrollIntoViewIfNeeded();
    await screenshot(page, 'character-units-findings-report-wide');
    await page.close();
  });

  it('frames a tall biped whose head reaches above its last joint, whole, at both sizes', async () => {
    // A studio of its own: the demo studio's plan is full after the two uploads above.
    const page = await studio.newPage(PHONE);
    await page.goto(`${studio.server.url}/sign-up`);
    await page.getByLabel('Your name').fill('Ines Gorse');
    await page.getByLabel('Studio name').fill('Gorse Lane');
    await page.getByLabel('E-mail').fill('ines@gorse.test');
    await page.getByLabel('Password').fill('a long walk up the gantry');
    await page.getByRole('button', { name: 'Create studio' }).click();
    await studio.finishSignUp(page, 'ines@gorse.test');
    await page.getByText('Gorse Lane', { exact: true }).first().waitFor();
    const id = await uploadAs(page, 'z-up-root-matrix', 'Pell, Z-up');
    for (const size of [PHONE, WIDE]) {
      await page.setViewportSize(size);
      await page.goto(`${studio.server.url}/characters/${id}`);
      await waitForMesh(page);
      await page.getByText(/turns \+Z up into glTF's \+Y up/).waitFor();
      const view = await drawnPixels(page);
      expect(view.drawn).toBeGreaterThan(500);
      expect(view.top).toBe(0);
      await screenshot(page, `character-units-framing-${size === PHONE ? 'phone' : 'wide'}`);
    }
    await page.close();
  });
});
