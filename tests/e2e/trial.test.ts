/**
 * The designer's loop at phone size in the real server and a headless browser: open Burrow's leg setup
 * (with its live preview), run a trial over a demo course as a background job, watch the progress bar
 * finish, open the trial and see the metric cards and the stumble timeline. Then the same pages wide, and
 * the dial-in screen. Screenshots at 390×844 and 1440×900.
 */
import fs from 'node:fs';
import type { Browser, Page } from 'playwright-core';
import { launchBrowser, PHONE, WIDE, screenshot } from '../support/browser';
import { startTestServer } from '../support/test-server';
import { DEMO_PASSWORD } from '../../seeds/demo-studio';

jest.setTimeout(240_000);

let server: Awaited<ReturnType<typeof startTestServer>>;
let browser: Browser;
let closeBrowser: () => Promise<void>;
let burrowId = 0;

beforeAll(async () => {
  server = await startTestServer();
  ({ browser, close: closeBrowser } = await launchBrowser());
  burrowId = (await server.db('characters').where({ name: 'Burrow' }).first('id')).id;
});
afterEach(async () => {
  for (const context of browser?.contexts() ?? []) await context.close();
});
afterAll(async () => {
  await closeBrowser?.();
  await server?.stop();
});

async function signedInPage(size: { width: number; height: number }): Promise<Page> {
  // Signs in at phone size, then takes the asked size (the page it lands on first is not part of this test).
  const context = await browser.newContext({ viewport: PHONE, deviceScaleFactor: 1 });
  const page = await context.newPage();
  const problems: string[] = [];
  page.on('pageerror', (err) => problems.push(err.message));
  await page.goto(`${server.url}/sign-in`);
  await page.getByLabel('E-mail').fill('designer@brassmoth.test');
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
  await page.getByRole('button', { name: 'Sign out' }).first().waitFor().catch(async (err) => {
    await screenshot(page, `trial-sign-in-failed-${size.width}`);
    throw new Error(`${(err as Error).message}; page errors: ${problems.join(' | ')}`);
  });
  await page.setViewportSize(size);
  (page as Page & { problems?: string[] }).problems = problems;
  return page;
}

describe('running a trial and reading it', () => {
  it('runs a trial from the leg setup page on a phone and shows its metric cards and stumble timeline', async () => {
    const page = await signedInPage(PHONE);
    await page.goto(`${server.url}/characters/setup/${burrowId}`);
    await page.getByRole('heading', { name: 'Burrow: leg setup' }).waitFor();
    await page.getByTestId('live-preview').getByTestId('walk-view').waitFor();
    await page.waitForTimeout(800);
    await screenshot(page, 'leg-setup-phone');

    // A field message from the shared schema, then back to a valid value.
    const duty = page.getByLabel('Duty factor (share of the cycle in stance)');
    await duty.fill('1.5');
    const message = page.getByText(/0\.98/).first();
    await message.waitFor();
    await message.scrollIntoViewIfNeeded();
    await screenshot(page, 'leg-setup-error-phone');
    await duty.fill('0.6');

    const run = page.getByTestId('run-trial');
    await run.scrollIntoViewIfNeeded();
    await run.getByRole('radio', { name: 'Loading dock steps' }).click();
    await run.getByRole('button', { name: 'Run trial' }).click();
    const bar = run.getByTestId('job-progress');
    await bar.waitFor();
    await page.waitForFunction(() => document.querySelector('[data-testid="job-progress"]')?.getAttribute('aria-valuenow') === '100', null, { timeout: 120_000 });
    await run.getByText('Trial finished').waitFor();
    await screenshot(page, 'trial-run-done-phone');
    await run.getByRole('button', { name: 'Open the trial' }).click();

    await page.waitForURL('**/trials/*');
    await page.getByRole('heading', { name: 'Burrow on Loading dock steps' }).waitFor();
    await page.getByTestId('metric-cards').waitFor();
    await page.getByTestId('stumble-timeline').waitFor();
    await page.getByText('Stumbles per 100 steps').waitFor();
    await page.getByText(/footing score = 100 · exp\(−P\)/).waitFor();
    await page.waitForTimeout(500);
    await screenshot(page, 'trial-phone');
    await page.getByRole('button', { name: 'Play' }).click();
    await page.waitForTimeout(1200);
    await page.getByRole('button', { name: 'Pause' }).click();
    await page.getByTestId('metric-cards').scrollIntoViewIfNeeded();
    await screenshot(page, 'trial-metrics-phone');
    await page.getByTestId('stumble-timeline').scrollIntoViewIfNeeded();
    await screenshot(page, 'trial-timeline-phone');
    expect((page as Page & { problems?: string[] }).problems).toEqual([]);
    await page.context().close();
  });

  it('shows the trial, the leg setup and the dial-in side by side on a wide screen', async () => {
    const page = await signedInPage(WIDE);
    const trial = await server.db('trials').where({ character_id: burrowId }).orderBy('id', 'desc').first('id');
    await page.goto(`${server.url}/trials/${trial.id}`);
    await page.getByTestId('metric-cards').waitFor().catch(async (err) => {
      await screenshot(page, 'trial-wide-failed');
      throw new Error(`${(err as Error).message}; page errors: ${(page as Page & { problems?: string[] }).problems?.join(' | ')}`);
    });
    await page.waitForTimeout(800);
    await screenshot(page, 'trial-wide');
    await page.goto(`${server.url}/characters/setup/${burrowId}`);
    await page.getByRole('heading', { name: 'Burrow: leg setup' }).waitFor();
    await page.waitForTimeout(800);
    await screenshot(page, 'leg-setup-wide');
    await page.goto(`${server.url}/characters/dial-in/${burrowId}`);
    await page.getByRole('heading', { name: 'Burrow: dial-in' }).waitFor();
    await page.getByLabel('Budget (candidates; each is a trial per course)').fill('12');
    await page.getByRole('button', { name: 'Start the dial-in' }).click();
    await page.getByTestId('dial-in-result').waitFor({ timeout: 180_000 });
    await screenshot(page, 'dial-in-wide');
    expect((page as Page & { problems?: string[] }).problems).toEqual([]);
    await page.context().close();
  });
});

/**
 * Reads the walk's pixels back through WebGL (the stage asks for preserveDrawingBuffer on web). Counts pixels
 * of the demo characters' own finishes that the course never shows (seeds/characters/rig-builder.ts: accent
 * #E4572E, lit, so by hue: red well above green and blue; dark #1E252B as filled areas: near-black pixels with
 * all eight neighbours near-black), and thin dark strokes (ink pixels with at most three ink neighbours: lines,
 * not the filled foot dots).
 */
async function walkPixels(page: Page): Promise<{ width: number; height: number; warm: number; solidDark: number; thinInk: number; sum: number }> {
  return page.evaluate(() => {
    const canvas = document.querySelector('[data-testid="walk-view"] canvas') as HTMLCanvasElement | null;
    if (!canvas) throw new Error('no canvas in the walk view');
    const gl = (canvas.getContext('webgl2') ?? canvas.getContext('webgl')) as WebGLRenderingContext;
    const { drawingBufferWidth: w, drawingBufferHeight: h } = gl;
    const px = new Uint8Array(w * h * 4);
    gl.readPixels(0, 0, w, h, gl.RGBA, gl.UNSIGNED_BYTE, px);
    const ink = new Uint8Array(w * h);
    let warm = 0;
    let sum = 0;
    for (let i = 0, p = 0; i < px.length; i += 4, p++) {
      const [r, g, b] = [px[i], px[i + 1], px[i + 2]];
      sum = (sum + r * 3 + g * 5 + b * 7 + p) % 1_000_000_007;
      if (r > g + 50 && r > b + 70) warm++;
      if (r < 70 && g < 75 && b < 80) ink[p] = 1;
    }
    let thinInk = 0;
    let solidDark = 0;
    for (let y = 1; y + 1 < h; y++) {
      for (let x = 1; x + 1 < w; x++) {
        if (!ink[y * w + x]) continue;
        let n = 0;
        for (let dy = -1; dy <= 1; dy++) for (let dx = -1; dx <= 1; dx++) if (dx || dy) n += ink[(y + dy) * w + x + dx];
        if (n <= 3) thinInk++;
        if (n === 8) solidDark++;
      }
    }
    return { width: w, height: h, warm, solidDark, thinInk, sum };
  });
}

const clockOf = async (page: Page) => (await page.getByTestId('playback-clock').innerText()).trim();
const clockSeconds = async (page: Page) => {
  const text = await clockOf(page);
  const m = /^(-?[\d.]+) \/ ([\d.]+) s$/.exec(text);
  if (!m) throw new Error(`the clock reads "${text}", not "<number> / <number> s"`);
  return Number(m[1]);
};

async function openTrialWithMesh(page: Page, trialId: number) {
  await page.goto(`${server.url}/trials/${trialId}`);
  await page.getByTestId('walk-view').waitFor();
  // The character is shown once the replay matched the record and its mesh was bound.
  await page.getByRole('radio', { name: 'Character' }).and(page.locator('[aria-checked="true"]')).waitFor({ timeout: 60_000 });
  await page.waitForFunction(() => !document.querySelector('[data-testid="walk-note"]'), null, { timeout: 60_000 });
  await page.waitForTimeout(300);
}

async function trialOf(name: string, course: string): Promise<{ id: number; events: { time: number; leg: number; kind: string }[]; simSeconds: number }> {
  const c = await server.db('characters').where({ name }).first('id');
  const row = await server.db('trials').where({ character_id: c.id, course_name: course }).orderBy('id', 'desc').first('id', 'metrics');
  const metrics = JSON.parse(row.metrics);
  return { id: row.id, events: metrics.events, simSeconds: metrics.simSeconds };
}

describe('watching the character walk', () => {
  it('shows the mesh, toggles the skeleton, seeks by timeline taps and stumbles, steps frames and records a clip at phone size', async () => {
    const page = await signedInPage(PHONE);
    const trial = await trialOf('Wicket', 'Loading dock steps');
    await openTrialWithMesh(page, trial.id);
    await page.getByTestId('walk-view').scrollIntoViewIfNeeded();
    const mesh = await walkPixels(page);
    // Wicket's accent parts (pack, visor, hands) are on screen: the mesh, not a box, is drawn.
    expect(mesh.warm).toBeGreaterThan(40);
    await screenshot(page, 'walk-wicket-steps-phone');

    // Reset view sits in reach: at least 44 × 44 px (DEVELOPERS.md, touch targets).
    const reset = await page.getByRole('button', { name: 'Reset view' }).boundingBox();
    expect(reset!.width).toBeGreaterThanOrEqual(44);
    expect(reset!.height).toBeGreaterThanOrEqual(44);

    // One finger orbits: the picture changes; Reset view brings back the same picture.
    const view = (await page.getByTestId('walk-view').boundingBox())!;
    await page.mouse.move(view.x + view.width / 2, view.y + view.height / 2);
    await page.mouse.down();
    await page.mouse.move(view.x + view.width / 2 + 80, view.y + view.height / 2 + 20, { steps: 5 });
    await page.mouse.up();
    const orbited = await walkPixels(page);
    expect(orbited.sum).not.toBe(mesh.sum);
    await page.getByRole('button', { name: 'Reset view' }).click();
    await page.waitForTimeout(100);
    expect((await walkPixels(page)).sum).toBe(mesh.sum);

    // The skeleton toggle: the mesh gives way to the stick figure, its leg lines drawn after scrubbing.
    await page.getByRole('radio', { name: 'Skeleton' }).click();
    await page.getByRole('img', { name: /as a skeleton/ }).waitFor();
    const bar = (await page.getByTestId('scrub-bar').boundingBox())!;
    await page.mouse.click(bar.x + bar.width * 0.55, bar.y + bar.height / 2);
    expect(await clockSeconds(page)).toBeGreaterThan(0.4 * trial.simSeconds);
    await page.waitForTimeout(200);
    const stick = await walkPixels(page);
    expect(stick.thinInk).toBeGreaterThan(40);
    await screenshot(page, 'walk-wicket-skeleton-phone');
    await page.getByRole('radio', { name: 'Character' }).click();
    await page.getByRole('img', { name: /The character walking/ }).waitFor();

    // A tap on the timeline away from any stumble moves the playhead there, and the clock shows a number.
    const timeline = page.getByTestId('stumble-timeline').locator('> *').first();
    await timeline.scrollIntoViewIfNeeded();
    const box = (await timeline.boundingBox())!;
    const duration = (await clockOf(page)).split(' / ')[1].replace(' s', '');
    const xOf = (t: number) => box.x + 10 + (t / Number(duration)) * (box.width - 20);
    const gap = (t: number) => Math.min(Infinity, ...trial.events.map((e) => Math.abs(xOf(e.time) - xOf(t))));
    const candidates = Array.from({ length: 91 }, (_, i) => ((i + 5) / 100) * Number(duration));
    const free = candidates.reduce((best, t) => (gap(t) > gap(best) ? t : best), candidates[0]);
    await page.mouse.click(xOf(free), box.y + box.height / 2);
    const seconds = await clockSeconds(page);
    // Away from every mark (more than the 12 px snap) the playhead lands where tapped; next to one, on that stumble.
    if (gap(free) > 14) expect(Math.abs(seconds - free)).toBeLessThan(0.1);
    else expect(trial.events.some((e) => Math.abs(e.time - seconds) < 0.01)).toBe(true);
    // The re-solve and plots follow the clock: nowhere on the page reads NaN.
    expect(await page.getByText(/NaN/).count()).toBe(0);

    // A tap on a stumble's mark jumps to that stumble and says which leg.
    if (trial.events.length) {
      const e = trial.events[Math.floor(trial.events.length / 2)];
      await page.mouse.click(xOf(e.time), box.y + box.height / 2);
      expect(await clockOf(page)).toMatch(new RegExp(`^${e.time.toFixed(2)} / `));
      await page.getByText(/^At the playhead: /).waitFor();
      await page.getByTestId('walk-view').scrollIntoViewIfNeeded();
      await page.waitForTimeout(200);
      await screenshot(page, 'walk-wicket-stumble-phone');
    }

    // Frame stepping: next then previous frame move by one sample (1/30 s at the trial's record rate).
    const before = await clockSeconds(page);
    await page.getByRole('button', { name: 'Next frame' }).click();
    expect(await clockSeconds(page)).toBeCloseTo(Math.min(Number(duration), before + 1 / 30), 1);
    await page.getByRole('button', { name: 'Previous frame' }).click();
    expect(await clockSeconds(page)).toBeCloseTo(before, 1);

    // A clip: a non-empty WebM download starting with the EBML header 1A 45 DF A3 (Matroska/WebM specification).
    const clip = page.waitForEvent('download');
    await page.getByRole('button', { name: /Record a \d+ s clip/ }).click();
    const download = await clip;
    expect(download.suggestedFilename()).toMatch(/\.webm$/);
    const bytes = fs.readFileSync((await download.path())!);
    expect(bytes.length).toBeGreaterThan(1000);
    expect([...bytes.subarray(0, 4)]).toEqual([0x1a, 0x45, 0xdf, 0xa3]);
    // And it plays: chromium's own <video> reads its frames at the walk view's size.
    // In a blank page (Treadle's own pages allow no media URLs); a source string, since the test's transpiler
    // would rewrite an async function into helpers the page lacks.
    const player = await page.context().newPage();
    const played = (await player.evaluate(`new Promise((resolve, reject) => {
      const raw = Uint8Array.from(atob(${JSON.stringify(bytes.toString('base64'))}), (c) => c.charCodeAt(0));
      const video = document.createElement('video');
      video.muted = true;
      video.src = URL.createObjectURL(new Blob([raw], { type: 'video/webm' }));
      video.onloadeddata = () => resolve({ width: video.videoWidth, height: video.videoHeight });
      video.onerror = () => reject(new Error('the clip does not play: ' + (video.error ? video.error.message : 'unknown error')));
    })`)) as { width: number; height: number };
    await player.close();
    expect(played.width).toBeGreaterThan(300);
    expect(played.height).toBeGreaterThan(200);
    // A still: a PNG (PNG specification §5.2 signature 89 50 4E 47 0D 0A 1A 0A).
    const still = page.waitForEvent('download');
    await page.getByRole('button', { name: 'Save still (PNG)' }).click();
    const png = fs.readFileSync((await (await still).path())!);
    expect([...png.subarray(0, 8)]).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
    expect((page as Page & { problems?: string[] }).problems).toEqual([]);
  });

  it('steps frames with the arrow keys on a wide screen', async () => {
    const page = await signedInPage(WIDE);
    const trial = await trialOf('Burrow', 'Loading dock steps');
    await openTrialWithMesh(page, trial.id);
    const start = await clockSeconds(page);
    await page.keyboard.press('ArrowRight');
    await page.keyboard.press('ArrowRight');
    expect(await clockSeconds(page)).toBeCloseTo(start + 2 / 30, 1);
    await page.keyboard.press('Shift+ArrowRight');
    expect(await clockSeconds(page)).toBeCloseTo(start + 12 / 30, 1);
    await page.keyboard.press('ArrowLeft');
    expect(await clockSeconds(page)).toBeCloseTo(start + 11 / 30, 1);
    expect((page as Page & { problems?: string[] }).problems).toEqual([]);
  });

  it.each([
    ['Wicket', 'phone', PHONE],
    ['Burrow', 'phone', PHONE],
    ['Skitter', 'phone', PHONE],
    ['Wicket', 'wide', WIDE],
    ['Burrow', 'wide', WIDE],
    ['Skitter', 'wide', WIDE],
  ] as const)('shows %s walking the steps (%s)', async (name, label, size) => {
    const page = await signedInPage(size);
    const trial = await trialOf(name, 'Loading dock steps');
    await openTrialWithMesh(page, trial.id);
    const bar = (await page.getByTestId('scrub-bar').boundingBox())!;
    await page.mouse.click(bar.x + bar.width * 0.45, bar.y + bar.height / 2);
    await page.getByTestId('walk-view').scrollIntoViewIfNeeded();
    await page.waitForTimeout(300);
    const mesh = await walkPixels(page);
    // Every demo character has dark parts (feet, legs); Wicket and Burrow have accent parts too.
    expect(mesh.solidDark).toBeGreaterThan(60);
    if (name !== 'Skitter') expect(mesh.warm).toBeGreaterThan(20);
    await screenshot(page, `walk-${name.toLowerCase()}-steps-${label}`);
    // As a skeleton the mesh gives way to the stick figure: a different picture, with leg lines.
    await page.getByRole('radio', { name: 'Skeleton' }).click();
    await page.getByRole('img', { name: /as a skeleton/ }).waitFor();
    const stick = await walkPixels(page);
    expect(stick.sum).not.toBe(mesh.sum);
    expect(stick.thinInk).toBeGreaterThan(20);
    expect((page as Page & { problems?: string[] }).problems).toEqual([]);
  });
});
