/**
 * What a designer and a programmer check on screen: Drive on the leg setup screen walks the character while the
 * stick is pushed (phone) or W held (wide), with positions that are numbers; the Profiles screen's download link
 * serves the runtime tarball; the sample game walks the studio's character with the packaged runtime; and on the
 * course screen a dragged walk-path point is saved with the course.
 */
import type { Page } from 'playwright-core';
import { PHONE, WIDE, screenshot } from '../support/browser';
import { e2eStudio } from '../support/e2e';
import type { CourseDetail, CourseList } from '../../schemas/courses';
import { RUNTIME_TARBALL } from '../../packages/runtime/src/version';

jest.setTimeout(300_000);

const studio = e2eStudio();

async function openSetup(page: Page, name = 'Wicket') {
  await studio.signIn(page, 'designer@brassmoth.test');
  const id = (await studio.server.db('characters').where({ name }).first('id')).id as number;
  await page.goto(`${studio.server.url}/characters/setup/${id}`);
  await page.getByRole('heading', { name: `${name}: leg setup` }).waitFor();
}

/** The drive readout's x, z and distance walked, as the user reads them. */
async function readout(page: Page) {
  const text = (await page.getByTestId('drive-position').first().textContent()) ?? '';
  const m = /x (\S+) m · z (\S+) m · walked (\S+?) m/.exec(text);
  if (!m) throw new Error(`the drive readout says "${text}"`);
  return { text, x: Number(m[1]), z: Number(m[2]), walked: Number(m[3]) };
}

/** Waits until the readout's z has moved past `from` by more than `by` metres. */
async function zMovesPast(page: Page, from: number, by: number) {
  await page.waitForFunction(
    (least) => {
      const m = /z (\S+) m/.exec(document.querySelector('[data-testid="drive-position"]')?.textContent ?? '');
      return !!m && Number(m[1]) > least;
    },
    from + by,
    { timeout: 60_000 },
  );
}

describe('drive mode', () => {
  it('on a phone walks the character while the stick is pushed up, and holds it when let go', async () => {
    const page = await studio.newPage(PHONE, { hasTouch: true });
    await openSetup(page);
    const sticky = page.getByTestId('sticky-preview');
    await sticky.getByRole('radio', { name: 'Drive' }).click();
    await sticky.getByTestId('drive-view').waitFor();
    await sticky.getByTestId('walk-view').waitFor();
    await page.waitForFunction(() => /z -?\d/.test(document.querySelector('[data-testid="drive-position"]')?.textContent ?? ''));
    const before = await readout(page);
    expect(Number.isFinite(before.z)).toBe(true);

    // The stick is big enough for a thumb (touch targets at least 44 × 44 px, product.md).
    const stick = (await page.getByTestId('drive-stick').boundingBox())!;
    expect(stick.width).toBeGreaterThanOrEqual(44);
    expect(stick.height).toBeGreaterThanOrEqual(44);
    expect(stick.y + stick.height).toBeLessThanOrEqual(PHONE.height);

    // Push it up and hold it there.
    const cx = stick.x + stick.width / 2;
    const cy = stick.y + stick.height / 2;
    await page.mouse.move(cx, cy);
    await page.mouse.down();
    await page.mouse.move(cx, cy - stick.height / 2, { steps: 6 });
    await zMovesPast(page, before.z, 0.3);
    await screenshot(page, 'drive-phone');
    await page.mouse.up();

    const walked = await readout(page);
    expect(walked.text).not.toMatch(/NaN|Infinity|—/);
    expect(walked.z).toBeGreaterThan(before.z + 0.3);
    expect(walked.walked).toBeGreaterThan(0.3);
    // Let go: the feet come to a planted rest and the body stays where it stopped.
    await page.getByTestId('drive-position').getByText('standing', { exact: false }).waitFor({ timeout: 60_000 });
    const held = await readout(page);
    await page.waitForTimeout(600);
    expect((await readout(page)).z).toBeCloseTo(held.z, 2);
  });

  it('on a wide screen walks while W is held', async () => {
    const page = await studio.newPage(WIDE);
    await openSetup(page);
    await page.getByRole('radio', { name: 'Drive' }).click();
    await page.getByTestId('drive-view').waitFor();
    // No stick on a wide screen: the keys drive.
    expect(await page.getByTestId('drive-stick').count()).toBe(0);
    await page.waitForFunction(() => /z -?\d/.test(document.querySelector('[data-testid="drive-position"]')?.textContent ?? ''));
    const before = await readout(page);
    await page.keyboard.down('w');
    await zMovesPast(page, before.z, 0.3);
    await page.keyboard.up('w');
    await page.getByTestId('drive-view').scrollIntoViewIfNeeded();
    await screenshot(page, 'drive-wide');
    const after = await readout(page);
    expect(after.text).not.toMatch(/NaN|Infinity/);
    expect(after.z).toBeGreaterThan(before.z + 0.3);

    // W with A turns left while walking: the body leaves the straight line, towards +X (the character's left, glTF).
    await page.keyboard.down('w');
    await page.keyboard.down('a');
    await page.waitForFunction(
      (x0) => {
        const m = /x (\S+) m/.exec(document.querySelector('[data-testid="drive-position"]')?.textContent ?? '');
        return !!m && Number(m[1]) > x0 + 0.1;
      },
      after.x,
      { timeout: 60_000 },
    );
    await page.keyboard.up('a');
    await page.keyboard.up('w');
    const turned = await readout(page);
    expect(turned.text).not.toMatch(/NaN|Infinity/);
    expect(turned.x).toBeGreaterThan(after.x + 0.1);
    await screenshot(page, 'drive-wide-turned');

    // An unsaved setup that cannot keep up: joints held to 120 °/s leave the feet behind their targets (skids,
    // reach-misses), and the drive shows each stumble as it is counted, by name and glyph. (One solver
    // iteration per frame no longer stumbles: the warm start and the preshaped knee leave little to solve.)
    await page.getByLabel(/^Joint speed limit/).fill('120');
    await page.getByRole('button', { name: 'Back to the start' }).click();
    await page.keyboard.down('w');
    const flash = page.getByTestId('drive-flash');
    await flash.waitFor({ timeout: 60_000 });
    await page.keyboard.up('w');
    expect(await flash.textContent()).toMatch(/^(Sink|Skid|Reach-miss|Scuff|Snap)$/);
    await screenshot(page, 'drive-wide-stumble');
  });
});

describe('the runtime package', () => {
  it('downloads from the Profiles screen as the npm tarball, and the sample game walks the studio character', async () => {
    const page = await studio.newPage(WIDE);
    await studio.signIn(page, 'programmer@brassmoth.test');
    const profile = await studio.server.db('profiles as p').join('characters as c', 'c.id', 'p.character_id').where('c.name', 'Wicket').first('p.id');
    await page.goto(`${studio.server.url}/profiles/${profile.id}`);
    const link = page.getByRole('link', { name: `Download the runtime package (${RUNTIME_TARBALL})` });
    await link.waitFor();
    const href = await link.getAttribute('href');
    expect(href).toBe(`/api/runtime/${RUNTIME_TARBALL}`);
    // The first request builds the package (packages/runtime/build.ts), which takes a while on a busy machine.
    const res = await page.request.get(`${studio.server.url}${href}`, { timeout: 180_000 });
    expect(res.status()).toBe(200);
    expect(res.headers()['content-disposition']).toContain(RUNTIME_TARBALL);
    const body = await res.body();
    // gzip's magic bytes (RFC 1952 §2.3.1).
    expect([body[0], body[1]]).toEqual([0x1f, 0x8b]);
    await page.getByText('npm install ./' + RUNTIME_TARBALL, { exact: false }).first().scrollIntoViewIfNeeded();
    await screenshot(page, 'profile-runtime-wide');
    const phone = await studio.newPage(PHONE, { hasTouch: true });
    await studio.signIn(phone, 'programmer@brassmoth.test');
    await phone.goto(`${studio.server.url}/profiles/${profile.id}`);
    const phoneLink = phone.getByRole('link', { name: `Download the runtime package (${RUNTIME_TARBALL})` });
    await phoneLink.scrollIntoViewIfNeeded();
    // A link a thumb can hit (touch targets at least 44 px high, product.md).
    expect((await phoneLink.boundingBox())!.height).toBeGreaterThanOrEqual(44);
    await screenshot(phone, 'profile-runtime-phone');

    const sample = page.getByRole('link', { name: 'Play the sample game with this profile' });
    expect(await sample.getAttribute('href')).toBe(`/api/runtime/sample/${profile.id}`);
    for (const [size, name] of [
      [PHONE, 'sample-game-phone'],
      [WIDE, 'sample-game-wide'],
    ] as const) {
      const game = await page.context().newPage();
      await game.setViewportSize(size);
      const errors: string[] = [];
      game.on('pageerror', (e) => errors.push(e.message));
      await game.goto(`${studio.server.url}/api/runtime/sample/${profile.id}`);
      await game.waitForFunction(() => /Wicket v\d/.test(document.getElementById('status')?.textContent ?? '') || document.body.dataset.failed === 'true', undefined, { timeout: 90_000 });
      expect(await game.locator('#status').textContent()).toMatch(/^Wicket v\d+ · x -?\d+\.\d\d z -?\d+\.\d\d m$/);
      const z0 = Number(await game.evaluate(() => document.body.dataset.bodyZ));
      await game.keyboard.down('w');
      await game.waitForFunction((z) => Number(document.body.dataset.bodyZ) > z + 0.2, z0, { timeout: 60_000 });
      await game.keyboard.up('w');
      const z1 = Number(await game.evaluate(() => document.body.dataset.bodyZ));
      expect(Number.isFinite(z1)).toBe(true);
      await screenshot(game, name);
      expect(errors).toEqual([]);
      await game.close();
    }
  });
});

describe('the walk-path editor', () => {
  it('saves a dragged point with the course', async () => {
    const page = await studio.newPage(WIDE);
    await studio.signIn(page, 'designer@brassmoth.test');
    const list = (await (await page.request.get(`${studio.server.url}/api/courses`)).json()) as CourseList;
    const id = list.courses[0].id;
    await page.goto(`${studio.server.url}/courses/${id}`);
    await page.getByRole('radio', { name: 'Walk path' }).click();
    await page.getByRole('button', { name: 'Set a walk path' }).click();
    const point = page.getByTestId('walk-path-point-2');
    await point.waitFor();
    const label = (await point.getAttribute('aria-label'))!;
    expect(label).toMatch(/^Walk path point 2 of 3: x 0\.00 m/);
    // On a wide screen the walk runs to the right: across the course (x) is up and down the screen.
    const box = (await point.boundingBox())!;
    await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2);
    await page.mouse.down();
    await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2 - 40, { steps: 8 });
    await page.mouse.up();
    const moved = (await point.getAttribute('aria-label'))!;
    const shownX = Number(/x (-?\d+\.\d+) m/.exec(moved)![1]);
    expect(shownX).toBeGreaterThan(0.05);
    await screenshot(page, 'walk-path-wide');
    await page.getByRole('button', { name: 'Save', exact: true }).click();
    await page.getByText(/Saved as version \d+\./).waitFor();

    const saved = (await (await page.request.get(`${studio.server.url}/api/courses/${id}`)).json()) as CourseDetail;
    const path = saved.encoding.walkPath!;
    expect(path.points).toHaveLength(3);
    expect(path.points[1].x).toBeCloseTo(shownX, 2);
    expect(path.points[0].x).toBe(0);

    // The same course on a phone shows the saved path's points.
    const phone = await studio.newPage(PHONE, { hasTouch: true });
    await studio.signIn(phone, 'designer@brassmoth.test');
    await phone.goto(`${studio.server.url}/courses/${id}`);
    await phone.getByRole('radio', { name: 'Walk path' }).click();
    await phone.getByTestId('walk-path-point-2').scrollIntoViewIfNeeded();
    expect(await phone.getByTestId('walk-path-point-2').getAttribute('aria-label')).toContain(`x ${shownX.toFixed(2)} m`);
    await screenshot(phone, 'walk-path-phone');
  });
});
