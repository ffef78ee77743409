import type { Page } from 'playwright-core';
import { PHONE, WIDE, screenshot } from '../support/browser';
import { e2eStudio } from '../support/e2e';
import { decodeCourse } from '../../engine/course/encoding';
import type { CourseDetail, CourseList, SuiteList } from '../../schemas/courses';

jest.setTimeout(180_000);

const studio = e2eStudio();

const newPage = (size: { width: number; height: number }, touch = false) => studio.newPage(size, { hasTouch: touch, isMobile: false });
const signInAsDesigner = (page: Page) => studio.signIn(page, 'designer@brassmoth.test');

async function courseByName(page: Page, name: string): Promise<CourseDetail> {
  const list = (await (await page.request.get(`${studio.server.url}/api/courses`)).json()) as CourseList;
  const id = list.courses.find((c) => c.name === name)!.id;
  return (await (await page.request.get(`${studio.server.url}/api/courses/${id}`)).json()) as CourseDetail;
}

/** A finger drag through the DevTools protocol: real touch input, which Chromium turns into pointer events of type "touch". */
async function touchDrag(page: Page, from: { x: number; y: number }, to: { x: number; y: number }, steps = 12) {
  const cdp = await page.context().newCDPSession(page);
  const point = (x: number, y: number) => [{ x, y, radiusX: 4, radiusY: 4, force: 1, id: 1 }];
  await cdp.send('Input.dispatchTouchEvent', { type: 'touchStart', touchPoints: point(from.x, from.y) });
  for (let i = 1; i <= steps; i++) {
    const t = i / steps;
    await cdp.send('Input.dispatchTouchEvent', { type: 'touchMove', touchPoints: point(from.x + (to.x - from.x) * t, from.y + (to.y - from.y) * t) });
  }
  await cdp.send('Input.dispatchTouchEvent', { type: 'touchEnd', touchPoints: [] });
  await cdp.detach();
}

/** scrollTop of every scrolling ancestor of the canvas (react-native-web scrolls a div, not the window). */
const scrollOffsets = (page: Page) =>
  page.getByTestId('sculpt-canvas').evaluate((el) => {
    const tops: number[] = [window.scrollY];
    for (let p = el.parentElement; p; p = p.parentElement) if (p.scrollHeight > p.clientHeight) tops.push(p.scrollTop);
    return tops;
  });

/** The part of the map the phone shows (the map scrolls along the walk in its own window), brought into view. */
async function dragZone(page: Page) {
  await page.getByTestId('sculpt-viewport').evaluate((el) => el.scrollIntoView({ block: 'start' }));
  const box = (await page.getByTestId('sculpt-canvas').boundingBox())!;
  const view = (await page.getByTestId('sculpt-viewport').boundingBox())!;
  // The brush strip sticks to the top of the page over whatever scrolls under it.
  const tools = await page.getByTestId('sculpt-tools').boundingBox();
  const top = Math.max(box.y, view.y, 70, tools ? tools.y + tools.height + 4 : 0);
  const bottom = Math.min(box.y + box.height, view.y + view.height, PHONE.height - 90);
  expect(bottom - top).toBeGreaterThan(120);
  return { cx: box.x + box.width / 2, top, bottom };
}

/** Samples that rose and fell between two encodings of the same grid. */
function difference(before: CourseDetail, after: CourseDetail) {
  const a = decodeCourse(before.encoding).heights;
  const b = decodeCourse(after.encoding).heights;
  let rose = 0;
  let fell = 0;
  let most = 0;
  for (let i = 0; i < a.length; i++) {
    if (b[i] > a[i]) rose++;
    if (b[i] < a[i]) fell++;
    most = Math.max(most, b[i] - a[i]);
  }
  return { rose, fell, most };
}

describe('sculpting a course', () => {
  it('raises a bump with a touch drag on a phone, saves it, and offers a copy when someone saved meanwhile', async () => {
    const page = await newPage(PHONE, true);
    await signInAsDesigner(page);
    await page.getByRole('link', { name: 'Courses' }).click();
    await page.waitForURL('**/courses');
    await page.getByRole('link', { name: 'Open Scrap rubble' }).waitFor();
    await screenshot(page, 'courses-list-phone');

    const before = await courseByName(page, 'Scrap rubble');
    await page.getByRole('link', { name: 'Open Scrap rubble' }).click();
    await page.waitForURL(`**/courses/${before.course.id}`);
    const canvas = page.getByTestId('sculpt-canvas');
    await canvas.waitFor();
    // Paint mode starts off on a phone: a swipe over the map is for scrolling, and the browser may scroll.
    expect(await page.getByRole('radio', { name: 'Scroll' }).getAttribute('aria-checked')).toBe('true');
    expect(await canvas.evaluate((el) => getComputedStyle(el).touchAction)).toBe('pan-x pan-y');
    await page.getByRole('heading', { name: 'Scrap rubble' }).scrollIntoViewIfNeeded();
    await screenshot(page, 'course-editor-scroll-mode-phone');

    let { cx, top, bottom } = await dragZone(page);
    let scrolled = await scrollOffsets(page);
    // A swipe up (finger from low to high) over the map moves the content; nothing is painted.
    await touchDrag(page, { x: cx, y: bottom - 10 }, { x: cx, y: top + 10 }, 16);
    await page.waitForTimeout(300);
    const afterSwipe = await scrollOffsets(page);
    expect(afterSwipe).not.toEqual(scrolled);
    expect(await page.getByRole('status').filter({ hasText: 'Version 1, nothing to save' }).count()).toBe(1);

    // Paint on: the brush controls sit above the map, and a drag sculpts without scrolling.
    await page.getByRole('radio', { name: 'Paint' }).click();
    expect(await canvas.evaluate((el) => getComputedStyle(el).touchAction)).toBe('none');
    await page.getByRole('radio', { name: 'Raise' }).click();
    await page.getByRole('radio', { name: 'Full' }).click();
    await page.getByRole('radio', { name: '0.35 m' }).click();
    await page.getByRole('heading', { name: 'Scrap rubble' }).scrollIntoViewIfNeeded();
    const tools = (await page.getByTestId('brush-bar').boundingBox())!;
    const map = (await page.getByTestId('sculpt-viewport').boundingBox())!;
    expect(tools.y + tools.height).toBeLessThanOrEqual(map.y + 1);
    // Radius and strength are reachable without leaving the map: both on screen with the map's top.
    expect(map.y).toBeLessThan(PHONE.height);
    await screenshot(page, 'course-editor-phone');
    ({ cx, top, bottom } = await dragZone(page));

    scrolled = await scrollOffsets(page);
    const cy = top + (bottom - top) * 0.3;
    await touchDrag(page, { x: cx - 12, y: cy }, { x: cx + 12, y: cy + 30 });
    // The drag sculpted; it did not scroll the page.
    expect(await scrollOffsets(page)).toEqual(scrolled);
    await page.getByText('Unsaved changes').waitFor();
    await screenshot(page, 'course-sculpted-phone');

    await page.getByRole('button', { name: 'Save' }).click();
    await page.getByText('Saved as version 2.').waitFor();
    const after = await courseByName(page, 'Scrap rubble');
    expect(after.course.version).toBe(2);
    const bump = difference(before, after);
    // A raise brush only lifts (engine/course/brushes.ts); a stroke lifts a sample by at most 0.05 m a dab.
    expect(bump.rose).toBeGreaterThan(10);
    expect(bump.fell).toBe(0);
    expect(bump.most).toBeGreaterThan(0.01);
    await screenshot(page, 'course-saved-phone');

    // Someone else saves version 3 while this editor still holds version 2.
    const other = await page.request.put(`${studio.server.url}/api/courses/${after.course.id}`, { data: { baseVersion: 2, name: 'Scrap rubble, west yard' } });
    expect(other.status()).toBe(200);
    ({ cx, top, bottom } = await dragZone(page));
    await touchDrag(page, { x: cx - 10, y: top + (bottom - top) * 0.75 }, { x: cx + 10, y: top + (bottom - top) * 0.85 });
    await page.getByRole('button', { name: 'Save' }).click();
    await page.getByText('Saved by someone else meanwhile').waitFor();
    await page.getByText(/version 2; it is now at version 3/).waitFor();
    await screenshot(page, 'course-conflict-phone');
    await page.getByRole('button', { name: 'Save mine as a copy' }).click();
    await page.getByRole('heading', { name: 'Scrap rubble (copy)' }).waitFor();
    const copy = await courseByName(page, 'Scrap rubble (copy)');
    expect(copy.course.version).toBe(1);
    // The copy holds both strokes: the saved bump and the one the conflict would otherwise have lost.
    expect(difference(before, copy).rose).toBeGreaterThan(bump.rose);
    const theirs = await courseByName(page, 'Scrap rubble, west yard');
    expect(theirs.course.version).toBe(3);
    expect(theirs.encoding).toEqual(after.encoding);

    // The generator form with its live preview, at phone size.
    await page.getByRole('link', { name: 'Courses' }).click();
    await page.getByRole('button', { name: 'New course' }).click();
    await page.getByLabel('Name', { exact: true }).fill('Short trench');
    await page.getByRole('radio', { name: 'Trench' }).nth(1).click();
    await page.getByLabel('Preview of the new course from above').waitFor();
    await page.getByLabel('Preview of the new course from above').scrollIntoViewIfNeeded();
    await screenshot(page, 'course-generator-phone');
  });

  it('sculpts with the mouse on a wide screen and shows the list, suites and generator form', async () => {
    const page = await newPage(WIDE);
    await signInAsDesigner(page);
    await page.goto(`${studio.server.url}/courses`);
    await page.getByRole('row', { name: 'Open Loading dock steps' }).waitFor();
    await page.getByText('Scrapyard crossing', { exact: true }).waitFor();
    await screenshot(page, 'courses-list-wide');

    await page.getByRole('button', { name: 'New course' }).click();
    await page.getByText('Preview', { exact: true }).waitFor();
    await page.getByLabel('Name', { exact: true }).fill('Gantry stairs');
    await page.getByLabel('Riser (m)').fill('0.9');
    await page.getByRole('button', { name: 'Make course' }).click();
    // The shared schema's message, beside the field, before anything is sent.
    await page.getByText('Use at most 0.5.').waitFor();
    await screenshot(page, 'course-generator-wide');
    await page.getByLabel('Riser (m)').fill('0.15');
    await page.getByRole('button', { name: 'Make course' }).click();
    await page.getByRole('heading', { name: 'Gantry stairs' }).waitFor();
    const made = await courseByName(page, 'Gantry stairs');
    expect(made.generator?.segments.map((s) => s.kind)).toEqual(['flat', 'stairs', 'flat']);

    const canvas = page.getByTestId('sculpt-canvas');
    await canvas.waitFor();
    const box = (await canvas.boundingBox())!;
    await page.mouse.move(box.x + box.width * 0.1, box.y + box.height * 0.5);
    await page.mouse.down();
    await page.mouse.move(box.x + box.width * 0.2, box.y + box.height * 0.4, { steps: 10 });
    await page.mouse.up();
    await page.getByText('Unsaved changes').waitFor();
    await page.getByRole('button', { name: 'Undo' }).click();
    await page.getByText('Version 1, nothing to save').waitFor();
    await page.getByRole('button', { name: 'Redo' }).click();
    await page.getByText('Unsaved changes').waitFor();
    await page.getByRole('button', { name: 'Save' }).click();
    await page.getByText('Saved as version 2.').waitFor();
    expect(difference(made, await courseByName(page, 'Gantry stairs')).rose).toBeGreaterThan(10);
    await screenshot(page, 'course-editor-wide');

    // Suites: put the ramp first in the demo suite.
    await page.getByRole('link', { name: 'Courses' }).click();
    await page.getByRole('button', { name: 'Edit Scrapyard crossing' }).click();
    for (let i = 0; i < 3; i++) await page.getByRole('button', { name: 'Move Ramp to the gantry earlier' }).click();
    await page.getByRole('checkbox', { name: 'Gantry stairs' }).click();
    await screenshot(page, 'suite-editor-wide');
    await page.getByRole('button', { name: 'Save suite' }).click();
    await page.getByRole('button', { name: 'Edit Scrapyard crossing' }).waitFor();
    const { suites } = (await (await page.request.get(`${studio.server.url}/api/suites`)).json()) as SuiteList;
    expect(suites[0].courses.map((c) => c.name)).toEqual([
      'Ramp to the gantry',
      'Loading dock steps',
      // The phone test above renamed it through a concurrent save.
      expect.stringMatching(/^Scrap rubble/),
      'Drainage trench',
      'Gantry stairs',
    ]);
  });
});
