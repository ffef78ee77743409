import type { Page } from 'playwright-core';
import { PHONE, WIDE, screenshot } from '../support/browser';
import { e2eStudio } from '../support/e2e';
import { buildCharacterGlb } from '../../seeds/characters/rig-builder';
import { wicket } from '../../seeds/characters';

jest.setTimeout(180_000);

const studio = e2eStudio();

const { newPage, signIn } = studio;

/**
 * Reads the 3D view's pixels back through WebGL (the GLView asks for preserveDrawingBuffer on web) and counts
 * those that differ clearly from the clear colour, and those in the left-leg ember.
 */
async function viewerPixels(page: Page): Promise<{ width: number; height: number; drawn: number; ember: number }> {
  return page.evaluate(() => {
    const canvas = document.querySelector('[data-testid="character-viewer"] canvas') as HTMLCanvasElement | null;
    if (!canvas) throw new Error('no canvas in the viewer');
    const gl = (canvas.getContext('webgl2') ?? canvas.getContext('webgl')) as WebGLRenderingContext;
    const { drawingBufferWidth: w, drawingBufferHeight: h } = gl;
    const px = new Uint8Array(w * h * 4);
    gl.readPixels(0, 0, w, h, gl.RGBA, gl.UNSIGNED_BYTE, px);
    const clear = [0xec, 0xe6, 0xd8];
    let drawn = 0;
    let ember = 0;
    for (let i = 0; i < px.length; i += 4) {
      const d = Math.abs(px[i] - clear[0]) + Math.abs(px[i + 1] - clear[1]) + Math.abs(px[i + 2] - clear[2]);
      if (d > 40) drawn++;
      if (Math.abs(px[i] - 0xe4) < 20 && Math.abs(px[i + 1] - 0x57) < 25 && Math.abs(px[i + 2] - 0x2e) < 25) ember++;
    }
    return { width: w, height: h, drawn, ember };
  });
}

async function waitForMesh(page: Page) {
  await page.locator('[data-testid="character-viewer"] canvas').waitFor();
  await page.getByText('Loading the mesh…').waitFor({ state: 'detached' });
}

describe('characters in the browser', () => {
  it('uploads a demo .glb at phone size, shows the import report, the legs and a drawn 3D view', async () => {
    const page = await newPage(PHONE);
    // A studio of its own, so the upload is new rather than recognised as the seeded Wicket.
    await page.goto(`${studio.server.url}/sign-up`);
    await page.getByLabel('Your name').fill('Nell Sprocket');
    await page.getByLabel('Studio name').fill('Lantern Yard');
    await page.getByLabel('E-mail').fill('nell@lantern.test');
    await page.getByLabel('Password').fill('a walk over scrap rubble');
    await page.getByRole('button', { name: 'Create studio' }).click();
    await studio.finishSignUp(page, 'nell@lantern.test');
    await page.getByText('Lantern Yard', { exact: true }).first().waitFor();

    await page.goto(`${studio.server.url}/characters`);
    await page.getByText('Bring your first character').waitFor();
    await page.getByRole('button', { name: 'Upload character' }).click();
    const chooser = page.waitForEvent('filechooser');
    await page.getByRole('button', { name: 'Choose file' }).click();
    await (await chooser).setFiles({ name: 'wicket.glb', mimeType: 'model/gltf-binary', buffer: Buffer.from(await buildCharacterGlb(wicket)) });

    await page.getByText('wicket is in, with 2 legs found.').waitFor();
    await page.getByText('The file passes the Khronos glTF validator with nothing to report.').waitFor();
    await screenshot(page, 'characters-upload-report-phone');

    await page.getByText('Open wicket').click();
    await page.waitForURL('**/characters/*');
    await page.getByRole('heading', { name: 'wicket', level: 1 }).waitFor();
    await page.getByText('Left leg', { exact: true }).waitFor();
    await page.getByText('Right leg', { exact: true }).waitFor();
    await waitForMesh(page);
    const pixels = await viewerPixels(page);
    expect(pixels.width).toBeGreaterThan(300);
    // Non-blank: a good share of the view is mesh, grid or skeleton, and the left leg shows in ember.
    expect(pixels.drawn).toBeGreaterThan(0.02 * pixels.width * pixels.height);
    expect(pixels.ember).toBeGreaterThan(20);
    await screenshot(page, 'character-page-phone');

    // Orbit by dragging: the picture changes.
    const box = (await page.locator('[data-testid="character-viewer"]').boundingBox())!;
    const before = await page.locator('[data-testid="character-viewer"]').screenshot();
    await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2);
    await page.mouse.down();
    await page.mouse.move(box.x + box.width / 2 + 120, box.y + box.height / 2 + 20, { steps: 6 });
    await page.mouse.up();
    const after = await page.locator('[data-testid="character-viewer"]').screenshot();
    expect(after.equals(before)).toBe(false);

    await page.getByRole('heading', { name: 'Import report' }).scrollIntoViewIfNeeded();
    await screenshot(page, 'character-report-phone');
    await page.context().close();
  });

  it('lists the seeded characters as cards on a phone and hides the upload button from a programmer', async () => {
    const page = await newPage(PHONE);
    await signIn(page, 'programmer@brassmoth.test');
    await page.goto(`${studio.server.url}/characters`);
    for (const name of ['Wicket', 'Burrow', 'Skitter']) await page.getByRole('listitem', { name }).waitFor();
    expect(await page.getByRole('button', { name: 'Upload character' }).count()).toBe(0);
    await screenshot(page, 'characters-phone');
    await page.context().close();
  });

  it('shows the table and a character page side by side on a wide screen', async () => {
    const page = await newPage(WIDE);
    await signIn(page, 'owner@brassmoth.test');
    await page.goto(`${studio.server.url}/characters`);
    await page.getByRole('table', { name: 'Characters' }).waitFor();
    await page.getByRole('columnheader', { name: 'File size' }).waitFor();
    await page.getByRole('button', { name: 'Upload character' }).waitFor();
    await screenshot(page, 'characters-wide');
    await page.getByRole('row', { name: 'Skitter' }).click();
    await page.getByRole('heading', { name: 'Skitter', level: 1 }).waitFor();
    await page.getByText('Left middle', { exact: true }).waitFor();
    await waitForMesh(page);
    const pixels = await viewerPixels(page);
    expect(pixels.drawn).toBeGreaterThan(0.02 * pixels.width * pixels.height);
    await screenshot(page, 'character-page-wide');

    await page.getByRole('button', { name: 'Edit legs' }).click();
    await page.getByLabel('Leg 1 name').fill('Fore left');
    await page.getByRole('button', { name: 'Save legs' }).click();
    await page.getByText('Mapping confirmed by your team.').waitFor();
    await page.getByText('Fore left', { exact: true }).waitFor();
    await page.context().close();
  });
});
