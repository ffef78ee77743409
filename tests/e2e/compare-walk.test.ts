/**
 * Compare by eye: two demo characters walking the same course on one clock. Wide: side by side, both walks move
 * when the shared playhead moves and both read the same time; ghosts overlay them in one view. Phone: one walk
 * at a time, a swipe on the name strip shows the next without moving the clock. Screenshots at 390×844 and
 * 1440×900.
 */
import type { BrowserContextOptions, Page } from 'playwright-core';
import { PHONE, WIDE, screenshot } from '../support/browser';
import { e2eStudio } from '../support/e2e';

jest.setTimeout(240_000);

const studio = e2eStudio();

async function comparePage(size: { width: number; height: number }, options: BrowserContextOptions = {}): Promise<Page> {
  const page = await studio.newPage(size, options);
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

/** The table rows lit up as under the cursor, and in each the picks whose cell is framed. */
async function litRows(page: Page): Promise<Record<string, string[]>> {
  return page.evaluate(() => {
    const out: Record<string, string[]> = {};
    for (const row of document.querySelectorAll('[data-testid^="metric-row-"][aria-current="true"]')) {
      const key = row.getAttribute('data-testid')!.slice('metric-row-'.length);
      out[key] = [...row.querySelectorAll('[data-testid^="metric-cell-"][aria-current="true"]')].map((c) => c.getAttribute('data-testid')!.split('-').pop()!);
    }
    return out;
  });
}

/** Points the mouse (or a finger) at a share of the plot's width and height. */
async function pointAtPlot(page: Page, x: number, y: number, how: 'hover' | 'tap' = 'hover') {
  const plot = page.getByTestId('compare-plot');
  await plot.scrollIntoViewIfNeeded();
  const box = (await plot.boundingBox())!;
  if (how === 'tap') await plot.tap({ position: { x: box.width * x, y: box.height * y } });
  else await page.mouse.move(box.x + box.width * x, box.y + box.height * y, { steps: 4 });
}

const readout = async (page: Page) => (await page.getByTestId('compare-plot-readout').innerText()).trim();

async function scrubTo(page: Page, share: number) {
  const bar = page.getByRole('slider', { name: 'Shared playhead' });
  await bar.scrollIntoViewIfNeeded();
  const box = (await bar.boundingBox())!;
  await page.mouse.click(box.x + box.width * share, box.y + box.height / 2);
}

describe('the table row under the cursor', () => {
  it('lights up the rows of the plotted quantity and course, the nearest line\'s cell, and follows the mouse and the playhead (wide)', async () => {
    const page = await comparePage(WIDE);
    const chars = await studio.server.db('characters').select('id', 'name');
    const pickOf = (name: string) => `c${chars.find((c: { name: string }) => c.name === name).id}`;
    const picks = [pickOf('Wicket'), pickOf('Skitter')];
    const plotCourses = await page.getByRole('radiogroup', { name: 'Course' }).first().getByRole('radio').allInnerTexts();
    expect(plotCourses.length).toBeGreaterThan(1);
    expect(await litRows(page)).toEqual({});

    // Body height: its two step-up rows and the course's own score row; exactly one entry's cell in each, the same one.
    await pointAtPlot(page, 0.4, 0.5);
    await page.waitForFunction(() => document.querySelector('[data-testid="metric-row-bodyOvershoot"][aria-current="true"]'));
    let lit = await litRows(page);
    expect(Object.keys(lit).sort()).toEqual(['bodyOvershoot', 'bodySettle', `course.${plotCourses[0]}`].sort());
    expect(lit.bodyOvershoot).toHaveLength(1);
    expect(picks).toContain(lit.bodyOvershoot[0]);
    expect(lit.bodySettle).toEqual(lit.bodyOvershoot);
    const first = await readout(page);
    const m1 = /^At ([\d.]+) m: (.+)$/.exec(first);
    expect(m1).not.toBeNull();
    expect(first).not.toMatch(/NaN/);
    expect(first).toMatch(/Wicket.* -?[\d.]+ cm · Skitter.* -?[\d.]+ cm/);
    await screenshot(page, 'compare-focus-plot-wide');

    // Further along: the readout's distance moves with the mouse, the rows stay those of the quantity.
    await pointAtPlot(page, 0.8, 0.5);
    await page.waitForFunction((d) => !document.querySelector('[data-testid="compare-plot-readout"]')!.textContent!.startsWith(`At ${d} m`), m1![1]);
    const m2 = /^At ([\d.]+) m/.exec(await readout(page))!;
    expect(Number(m2[1])).toBeGreaterThan(Number(m1![1]));

    // Another quantity and course: the highlight moves to tracking RMS and that course's row.
    await page.getByRole('radio', { name: 'Foot tracking error' }).click();
    await page.getByRole('radiogroup', { name: 'Course' }).first().getByRole('radio', { name: plotCourses[1] }).click();
    await pointAtPlot(page, 0.5, 0.3);
    await page.waitForFunction(() => document.querySelector('[data-testid="metric-row-trackingRms"][aria-current="true"]'));
    lit = await litRows(page);
    expect(Object.keys(lit).sort()).toEqual(['trackingRms', `course.${plotCourses[1]}`].sort());
    expect(await readout(page)).toMatch(/^At [\d.]+ m: .*Wicket.* [\d.]+ mm · .*Skitter.* [\d.]+ mm$/);

    // The mouse leaving the plot clears the highlight.
    await page.mouse.move(5, 5);
    await page.waitForFunction(() => !document.querySelector('[data-testid^="metric-row-"][aria-current="true"]'));

    // Scrubbing the shared walk: the walk's course row lights for both entries; stumble rows only with the cells of
    // entries stumbling within a quarter second of the playhead; the plot reads the same instant.
    await page.waitForFunction(() => document.querySelectorAll('[data-testid="compare-walk-view"] canvas').length === 2, null, { timeout: 120_000 });
    const walkCourse = await page.getByTestId('compare-walk').getByRole('radio', { checked: true }).first().innerText();
    await scrubTo(page, 0.45);
    await page.waitForFunction(() => document.querySelector('[data-testid^="metric-row-course."][aria-current="true"]'));
    lit = await litRows(page);
    expect(lit[`course.${walkCourse.trim()}`]?.sort()).toEqual([...picks].sort());
    for (const [key, cells] of Object.entries(lit)) {
      if (key.startsWith('course.')) continue;
      expect(key).toMatch(/^stumbles\./);
      expect(cells.length).toBeGreaterThan(0);
    }
    const { at } = await clock(page);
    // The plot shows the same instant when it shows the walk's course, and says which course the walk is on otherwise.
    if (walkCourse.trim() === plotCourses[1]) expect(await readout(page)).toContain(`At ${at.toFixed(2)} s:`);
    else {
      expect(await readout(page)).toBe(`The walk below is on ${walkCourse.trim()}; pick that course here to see its instant on the plot.`);
      await page.getByRole('radiogroup', { name: 'Course' }).first().getByRole('radio', { name: walkCourse.trim() }).click();
    }
    expect(await readout(page)).toMatch(new RegExp(`^At ${at.toFixed(2)} s: .*Wicket.* [\\d.]+ mm at [\\d.]+ m · .*Skitter.* [\\d.]+ mm at [\\d.]+ m$`));
    await page.getByTestId('compare-walk').scrollIntoViewIfNeeded();
    await screenshot(page, 'compare-focus-walk-wide');
    await page.getByTestId(`metric-row-course.${walkCourse.trim()}`).scrollIntoViewIfNeeded();
    await screenshot(page, 'compare-focus-walk-table-wide');
  });

  it('on a phone, a tap on the plot lights the row and turns the table to its group', async () => {
    const touch = await comparePage(PHONE, { hasTouch: true });
    const groups = touch.getByRole('radiogroup', { name: 'Metric group' });
    // The phone table starts on the score group; the tap on body height turns it to step response.
    await groups.getByRole('radio', { name: 'Score', checked: true }).waitFor();
    await pointAtPlot(touch, 0.5, 0.5, 'tap');
    await groups.getByRole('radio', { name: 'Step response', checked: true }).waitFor();
    const lit = await litRows(touch);
    expect(lit.bodyOvershoot).toHaveLength(1);
    expect(await readout(touch)).toMatch(/^At [\d.]+ m: .*Wicket.* -?[\d.]+ cm/);
    await touch.getByTestId('metric-row-bodyOvershoot').scrollIntoViewIfNeeded();
    await screenshot(touch, 'compare-focus-table-phone');
    await pointAtPlot(touch, 0.5, 0.5);
    await screenshot(touch, 'compare-focus-plot-phone');
  });
});

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
