/**
 * What a designer checks on screen: in Drive the camera swings round behind the character as it turns (through
 * ±180° too) and the fixed angle stays on offer; on a course with a walk path the driven character starts at the
 * path's first point facing along it; the walk-path editor's speed field says why an out-of-range speed is
 * refused and saves one in range.
 */
import type { Page } from 'playwright-core';
import { PHONE, WIDE, screenshot } from '../support/browser';
import { e2eStudio } from '../support/e2e';
import type { CourseDetail, CourseList } from '../../schemas/courses';

jest.setTimeout(300_000);

const studio = e2eStudio();

/** Wicket's leg setup in Drive, for a member already signed in. */
async function openDrive(page: Page, phone = false) {
  const id = (await studio.server.db('characters').where({ name: 'Wicket' }).first('id')).id as number;
  await page.goto(`${studio.server.url}/characters/setup/${id}`);
  await page.getByRole('heading', { name: 'Wicket: leg setup' }).waitFor();
  const where = phone ? page.getByTestId('sticky-preview') : page;
  await where.getByRole('radio', { name: 'Drive' }).click();
  await where.getByTestId('walk-view').waitFor();
  // The readout reads the walk itself once it has run a few frames: "facing" then carries a number.
  await page.waitForFunction(() => /facing -?\d+°/.test(document.querySelector('[data-testid="drive-position"]')?.textContent ?? ''));
}

/** The heading and the drawn view's direction, degrees, as the drive view states them. */
async function angles(page: Page): Promise<{ heading: number; view: number }> {
  return page.evaluate(() => {
    const el = document.querySelector('[data-testid="drive-view"]') as HTMLElement;
    return { heading: Number(el.dataset.heading), view: Number(el.dataset.view) };
  });
}

/** Difference of two angles in degrees, the short way round: (−180, 180]. */
const gap = (a: number, b: number) => {
  const d = (((a - b) % 360) + 540) % 360 - 180;
  return d === -180 ? 180 : d;
};

/**
 * While the turn is held: waits until the heading has turned `by` degrees (unwrapped, so through ±180°), noting
 * the widest gap between view and heading it saw on the way.
 */
async function turnBy(page: Page, by: number): Promise<{ turned: number; widest: number }> {
  await page.evaluate(() => {
    (window as unknown as { turnWatch: unknown }).turnWatch = { last: NaN, turned: 0, widest: 0 };
  });
  await page.waitForFunction(
    (target) => {
      const el = document.querySelector('[data-testid="drive-view"]') as HTMLElement;
      const w = (window as unknown as { turnWatch: { last: number; turned: number; widest: number } }).turnWatch;
      const h = Number(el.dataset.heading);
      const v = Number(el.dataset.view);
      const short = (d: number) => ((((d % 360) + 540) % 360) - 180);
      if (!Number.isNaN(w.last)) w.turned += short(h - w.last);
      w.last = h;
      w.widest = Math.max(w.widest, Math.abs(short(v - h)));
      return Math.abs(w.turned) >= target;
    },
    by,
    { timeout: 120_000, polling: 50 },
  );
  return page.evaluate(() => (window as unknown as { turnWatch: { turned: number; widest: number } }).turnWatch);
}

/** Waits until the drawn view points the way the character faces (within a degree and a half). */
async function viewSettles(page: Page) {
  await page.waitForFunction(
    () => {
      const el = document.querySelector('[data-testid="drive-view"]') as HTMLElement;
      const d = Math.abs(((((Number(el.dataset.view) - Number(el.dataset.heading)) % 360) + 540) % 360) - 180);
      return d < 1.5;
    },
    undefined,
    { timeout: 60_000 },
  );
}

describe('the drive camera', () => {
  it('on a wide screen turns with the character through ±180°, and the fixed angle stays put', async () => {
    const page = await studio.newPage(WIDE);
    await studio.signIn(page, 'designer@brassmoth.test');
    await openDrive(page);
    // Behind the character is where Drive starts.
    expect(await page.getByRole('radio', { name: 'Follows behind' }).getAttribute('aria-checked')).toBe('true');
    await viewSettles(page);
    const start = await angles(page);
    expect(Number.isFinite(start.heading)).toBe(true);

    // Hold A (turn left) until the character has turned past facing backwards: its heading wraps past ±180°.
    await page.keyboard.down('a');
    const turn = await turnBy(page, 200);
    await page.keyboard.up('a');
    expect(turn.turned).toBeGreaterThanOrEqual(200);
    // The view trails the turn a little (the camera is smoothed) but never swings the other way round at the wrap,
    // which would open a gap of 180°: at most the lag of a full-rate turn, about 30°, plus a frame or two.
    expect(turn.widest).toBeLessThan(60);
    await viewSettles(page);
    const after = await angles(page);
    expect(Math.abs(gap(after.view, after.heading))).toBeLessThan(1.5);
    expect((await page.getByTestId('drive-position').textContent()) ?? '').toMatch(new RegExp(`facing ${Math.round(after.heading)}°`));
    await page.getByTestId('drive-view').scrollIntoViewIfNeeded();
    await screenshot(page, 'drive-camera-wide-turned');

    // The fixed angle: the view keeps its direction while the character turns under it.
    await page.getByRole('radio', { name: 'Fixed angle' }).click();
    // A first stretch of turning lets the readout catch up with the switch; over the next 45° the view stays put.
    await page.keyboard.down('a');
    await turnBy(page, 20);
    const fixed = await angles(page);
    const more = await turnBy(page, 45);
    await page.keyboard.up('a');
    expect(more.turned).toBeGreaterThanOrEqual(45);
    expect(Math.abs(gap((await angles(page)).view, fixed.view))).toBeLessThan(1);
    await screenshot(page, 'drive-camera-wide-fixed');
  });

  it('on a phone turns with the character when the stick is pushed sideways', async () => {
    const page = await studio.newPage(PHONE, { hasTouch: true });
    await studio.signIn(page, 'designer@brassmoth.test');
    await openDrive(page, true);
    await viewSettles(page);
    const stick = (await page.getByTestId('drive-stick').boundingBox())!;
    const cx = stick.x + stick.width / 2;
    const cy = stick.y + stick.height / 2;
    await page.mouse.move(cx, cy);
    await page.mouse.down();
    // Left on the stick turns left.
    await page.mouse.move(cx - stick.width / 2, cy, { steps: 6 });
    const turn = await turnBy(page, 70);
    await page.mouse.up();
    expect(turn.turned).toBeGreaterThanOrEqual(70);
    expect(turn.widest).toBeLessThan(60);
    await viewSettles(page);
    const after = await angles(page);
    expect(Math.abs(gap(after.view, after.heading))).toBeLessThan(1.5);
    await screenshot(page, 'drive-camera-phone-turned');

    // The camera choice sits on the view (the preview sticks above the form), big enough for a thumb (44 px,
    // product.md), and the fixed angle is one tap away (what it does is checked on the wide screen above).
    const fixed = page.getByTestId('sticky-preview').getByRole('radio', { name: 'Fixed angle' });
    const chip = (await fixed.boundingBox())!;
    const view = (await page.getByTestId('walk-view').boundingBox())!;
    expect(chip.height).toBeGreaterThanOrEqual(44);
    expect(chip.y).toBeGreaterThanOrEqual(view.y);
    expect(chip.x + chip.width).toBeLessThanOrEqual(view.x + view.width);
    await fixed.click();
    expect(await fixed.getAttribute('aria-checked')).toBe('true');
  });
});

describe('drive on a course with a walk path', () => {
  it("starts at the path's first point, facing along it", async () => {
    const page = await studio.newPage(WIDE);
    await studio.signIn(page, 'designer@brassmoth.test');
    // Drive opens on the studio's first course: give it a path that starts off the middle and heads across.
    const list = (await (await page.request.get(`${studio.server.url}/api/courses`)).json()) as CourseList;
    const id = list.courses[0].id;
    const detail = (await (await page.request.get(`${studio.server.url}/api/courses/${id}`)).json()) as CourseDetail;
    const { cols, rows, cellSize } = detail.encoding;
    const half = ((cols - 1) * cellSize) / 2;
    const length = (rows - 1) * cellSize;
    const r2 = (v: number) => Math.round(v * 100) / 100;
    const first = { x: r2(-half / 3), z: r2(length * 0.3) };
    const second = { x: r2(half / 3), z: r2(length * 0.45) };
    const points = [first, second, { x: second.x, z: r2(length * 0.7) }];
    const put = await page.request.put(`${studio.server.url}/api/courses/${id}`, {
      data: { baseVersion: detail.course.version, encoding: { ...detail.encoding, walkPath: { points, closed: false, speed: null } } },
    });
    expect(put.status()).toBe(200);

    await openDrive(page);
    const text = (await page.getByTestId('drive-position').textContent()) ?? '';
    const m = /x (\S+) m · z (\S+) m · walked (\S+?) m · facing (-?\d+)°/.exec(text);
    expect(m).not.toBeNull();
    // Standing on point 1 (the readout's two decimals; the body settles over its planted feet by a few mm at most).
    expect(Math.abs(Number(m![1]) - first.x)).toBeLessThan(0.03);
    expect(Math.abs(Number(m![2]) - first.z)).toBeLessThan(0.03);
    // Facing along the path's first stretch: the chord from point 1 to point 2 (the curve leaves point 1 along it:
    // its end tangent mirrors point 2, common practice for open Catmull–Rom ends, no source), 0° = +Z, 90° = +X.
    const chord = (Math.atan2(second.x - first.x, second.z - first.z) * 180) / Math.PI;
    expect(Math.abs(gap(Number(m![4]), chord))).toBeLessThan(10);
    await page.getByTestId('drive-view').scrollIntoViewIfNeeded();
    await screenshot(page, 'drive-path-start-wide');
  });
});

describe('the walk-path speed field', () => {
  it('refuses an out-of-range speed with the schema message, and saves one in range', async () => {
    const page = await studio.newPage(WIDE);
    await studio.signIn(page, 'designer@brassmoth.test');
    const list = (await (await page.request.get(`${studio.server.url}/api/courses`)).json()) as CourseList;
    const id = list.courses[list.courses.length > 1 ? 1 : 0].id;
    const before = (await (await page.request.get(`${studio.server.url}/api/courses/${id}`)).json()) as CourseDetail;
    await page.goto(`${studio.server.url}/courses/${id}`);
    await page.getByRole('radio', { name: 'Walk path' }).click();
    await page.getByRole('button', { name: 'Set a walk path' }).click();
    const speed = page.getByLabel('Speed along the path (m/s)');
    await speed.waitFor();
    // Empty: the setup's own pace; the bounds come from the walk-path schema.
    expect(await speed.inputValue()).toBe('');
    await page.getByText('Above 0 and at most 10 m/s', { exact: false }).waitFor();

    await speed.fill('12');
    const refusal = page.getByRole('alert').filter({ hasText: 'Walk at most 10 m/s.' });
    await refusal.waitFor();
    expect(await speed.getAttribute('aria-invalid')).toBe('true');
    await page.getByRole('button', { name: 'Save', exact: true }).click();
    // Still refused and nothing written: the course keeps the version it had.
    await refusal.waitFor();
    const unchanged = (await (await page.request.get(`${studio.server.url}/api/courses/${id}`)).json()) as CourseDetail;
    expect(unchanged.course.version).toBe(before.course.version);
    await screenshot(page, 'walk-path-speed-wide-refused');

    await speed.fill('1.4');
    expect(await refusal.count()).toBe(0);
    await page.getByRole('button', { name: 'Save', exact: true }).click();
    await page.getByText(/Saved as version \d+\./).waitFor();
    const saved = (await (await page.request.get(`${studio.server.url}/api/courses/${id}`)).json()) as CourseDetail;
    expect(saved.encoding.walkPath?.speed).toBe(1.4);
    await speed.scrollIntoViewIfNeeded();
    await screenshot(page, 'walk-path-speed-wide');

    // On a phone the saved speed reads back; zero is refused with the schema's message.
    const phone = await studio.newPage(PHONE, { hasTouch: true });
    await studio.signIn(phone, 'designer@brassmoth.test');
    await phone.goto(`${studio.server.url}/courses/${id}`);
    await phone.getByRole('radio', { name: 'Walk path' }).click();
    const phoneSpeed = phone.getByLabel('Speed along the path (m/s)');
    await phoneSpeed.scrollIntoViewIfNeeded();
    expect(await phoneSpeed.inputValue()).toBe('1.4');
    await screenshot(phone, 'walk-path-speed-phone');
    await phoneSpeed.fill('0');
    await phone.getByRole('alert').filter({ hasText: 'The speed must be above 0.' }).waitFor();
    await phoneSpeed.scrollIntoViewIfNeeded();
    await screenshot(phone, 'walk-path-speed-phone-refused');
  });
});
