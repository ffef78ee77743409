/**
 * Compare by eye: two demo characters walking the same course on one clock. Wide: side by side, both walks move
 * when the shared playhead moves and both read the same time; ghosts overlay them in one view. Phone: one walk
 * at a time, a swipe on the name strip shows the next without moving the clock. Screenshots at 390×844 and
 * 1440×900.
 */
import type { Page } from 'playwright-core';
import { PHONE, WIDE, screenshot } from '../support/browser';
import { e2eStudio } from '../support/e2e';

jest.setTimeout(240_000);

const studio = e2eStudio();

async function comparePage(size: { width: number; height: number }): Promise<Page> {
  const page = await studio.newPage(size);
  await studio.signIn(page, 'artlead@brassmoth.test');
  const chars = await studio.server.db('characters').select('id', 'name');
  const id = (name: string) => chars.find((c: { name: string }) => c.name === name).id as number;
  const suite = await studio.server.db('suites').where({ name: 'Scrapyard crossing' }).first('id');
  await page.goto(`${studio.server.url}/compare?suite=${suite.id}&pick=c${id('Wicket')},c${id('Skitter')}`);
  await page.getByTestId('compare-walk').waitFor({ timeout: 120_000 });
  return page;
}

/** A checksum of each walk view's pixels, read back through WebGL (preserveDrawingBuffer on web). */
async function viewSums(page: Page): Promise<number[]> {
  return page.evaluate(() =>
    [...document.querySelectorAll('[data-testid="compare-walk-view"] canvas')].map((c) => {
      const gl = ((c as HTMLCanvasElement).getContext('webgl2') ?? (c as HTMLCanvasElement).getContext('webgl')) as WebGLRenderingContext;
      const { drawingBufferWidth: w, drawingBufferHeight: h } = gl;
      const px = new Uint8Array(w * h * 4);
      gl.readPixels(0, 0, w, h, gl.RGBA, gl.UNSIGNED_BYTE, px);
      let sum = 0;
      for (let i = 0; i < px.length; i++) sum = (sum * 31 + px[i]) % 1_000_000_007;
      return sum;
    }),
  );
}

const clock = async (page: Page) => {
  const text = (await page.getByTestId('compare-clock').innerText()).trim();
  const m = /^([\d.]+) \/ ([\d.]+) s$/.exec(text);
  if (!m) throw new Error(`the shared clock reads "${text}"`);
  return { at: Number(m[1]), of: Number(m[2]) };
};

async function scrubTo(page: Page, share: number) {
  const bar = page.getByRole('slider', { name: 'Shared playhead' });
  await bar.scrollIntoViewIfNeeded();
  const box = (await bar.boundingBox())!;
  await page.mouse.click(box.x + box.width * share, box.y + box.height / 2);
}

describe('compare walks', () => {
  it('shows two walks side by side on a wide screen, moving together on the shared playhead, and as ghosts', async () => {
    const page = await comparePage(WIDE);
    await page.getByRole('radio', { name: 'Side by side', checked: true }).waitFor();
    await page.waitForFunction(() => document.querySelectorAll('[data-testid="compare-walk-view"] canvas').length === 2, null, { timeout: 120_000 });
    await page.getByTestId('compare-walk').scrollIntoViewIfNeeded();
    await page.waitForTimeout(1500);
    const before = await viewSums(page);
    expect(before).toHaveLength(2);
    await scrubTo(page, 0.3);
    const { at, of } = await clock(page);
    expect(of).toBeGreaterThan(1);
    expect(at).toBeGreaterThan(0.2 * of);
    // Both walks read the shared time (each at most its own length), and both pictures moved.
    const times = (await page.getByTestId('compare-walk-time').allInnerTexts()).map((t) => Number(t.replace(' s', '')));
    expect(times).toHaveLength(2);
    for (const t of times) expect(t).toBeCloseTo(at, 1);
    await page.waitForTimeout(300);
    const after = await viewSums(page);
    expect(after[0]).not.toBe(before[0]);
    expect(after[1]).not.toBe(before[1]);
    await page.getByTestId('compare-walk').scrollIntoViewIfNeeded();
    await screenshot(page, 'compare-walk-side-wide');

    await page.getByRole('radio', { name: 'Ghosts' }).click();
    await page.waitForFunction(() => document.querySelectorAll('[data-testid="compare-walk-view"] canvas').length === 1);
    await page.getByText(/^Solid: Wicket/).waitFor();
    await page.waitForTimeout(1500);
    await page.getByTestId('compare-walk').scrollIntoViewIfNeeded();
    await screenshot(page, 'compare-walk-ghosts-wide');
  });

  it('shows one walk at a time on a phone; a swipe on the name strip shows the next at the same time', async () => {
    const page = await comparePage(PHONE);
    await page.getByRole('radio', { name: 'One at a time', checked: true }).waitFor();
    await page.waitForFunction(() => document.querySelectorAll('[data-testid="compare-walk-view"] canvas').length === 1, null, { timeout: 120_000 });
    await scrubTo(page, 0.5);
    const { at } = await clock(page);
    const strip = page.getByTestId('compare-walk-strip');
    await strip.getByText(/1 of 2/).waitFor();
    await strip.scrollIntoViewIfNeeded();
    await page.waitForTimeout(1000);
    await screenshot(page, 'compare-walk-one-phone');
    const box = (await strip.boundingBox())!;
    await page.mouse.move(box.x + box.width * 0.7, box.y + box.height / 2);
    await page.mouse.down();
    await page.mouse.move(box.x + box.width * 0.2, box.y + box.height / 2, { steps: 8 });
    await page.mouse.up();
    await strip.getByText(/2 of 2/).waitFor();
    expect((await clock(page)).at).toBeCloseTo(at, 2);
    await page.getByRole('img', { name: /^Skitter.* walking the course \(2 of 2\)/ }).waitFor();
    await page.waitForTimeout(1000);
    await screenshot(page, 'compare-walk-two-phone');
    // The arrows do the same for a finger that does not swipe.
    await page.getByRole('button', { name: 'Previous walk' }).click();
    await strip.getByText(/1 of 2/).waitFor();
  });
});
