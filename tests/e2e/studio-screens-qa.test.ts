/**
 * Bugs a user met walking the studio screens, each checked the way that user would see it, at 390×844 and
 * 1440×900:
 * - the trial's plots label their axes with plain numbers at one precision, inside the plot (a foot-height axis read a
 *   clipped "-0.00039", the solver's log axis ".000076");
 * - the leg setup form says "Enter a number." beside a box holding no number, not the schema's "expected number,
 *   received NaN", and "Run trial" waits while the edited form is not valid (it walked the saved version instead);
 * - the invite form drops its last "Invite sent" when the next invite is refused (a member already, or no seat left);
 * - the course editor keeps unsaved sculpting: leaving by a tab and coming Back finds the unsaved heights with
 *   their undo (they were gone without a word), and closing the page with them unsaved asks first.
 */
import type { Page } from 'playwright-core';
import { PHONE, WIDE, screenshot } from '../support/browser';
import { e2eStudio } from '../support/e2e';

jest.setTimeout(240_000);

const studio = e2eStudio();

const SIZES = [
  [PHONE, 'phone'],
  [WIDE, 'wide'],
] as const;

async function characterId(name: string): Promise<number> {
  return (await studio.server.db('characters').where({ name }).first('id')).id as number;
}

/** Each plot's tick labels, and whether each lies wholly inside its plot (not cut off at the left edge). */
async function plotTicks(page: Page, title: string): Promise<{ text: string; inside: boolean }[]> {
  const svg = page.locator(`svg[aria-label^="${title}:"]`).first();
  await svg.waitFor();
  return svg.evaluate((el) => {
    const box = el.getBoundingClientRect();
    return Array.from(el.querySelectorAll('text'))
      .filter((t) => /\d/.test(t.textContent ?? ''))
      .map((t) => {
        const b = t.getBoundingClientRect();
        return { text: t.textContent ?? '', inside: b.left >= box.left - 0.5 && b.right <= box.right + 0.5 };
      });
  });
}

/** Drags the mouse across the map where it shows: inside its scrolling view, below the brush strip that sticks over it. */
async function sculptStroke(page: Page, across: number): Promise<void> {
  // The phone's map scrolls in a view of its own; a wide screen shows it whole.
  const canvas = page.getByTestId('sculpt-canvas');
  const viewport = (await page.getByTestId('sculpt-viewport').count()) ? page.getByTestId('sculpt-viewport') : canvas;
  await viewport.evaluate((el) => el.scrollIntoView({ block: 'start' }));
  const box = (await canvas.boundingBox())!;
  const view = (await viewport.boundingBox())!;
  const tools = (await page.getByTestId('sculpt-tools').count()) ? await page.getByTestId('sculpt-tools').boundingBox() : null;
  const top = Math.max(box.y, view.y, 70, tools ? tools.y + tools.height + 4 : 0);
  const bottom = Math.min(box.y + box.height, view.y + view.height, page.viewportSize()!.height - 90);
  const y = top + (bottom - top) * across;
  await page.mouse.move(box.x + box.width * 0.3, y);
  await page.mouse.down();
  await page.mouse.move(box.x + box.width * 0.6, y + 12, { steps: 10 });
  await page.mouse.up();
}

const PLAIN_NUMBER = /^-?\d+(\.\d+)?(e-?\d+)?$/;

describe('studio screens, as their users check them', () => {
  for (const [size, name] of SIZES) {
    it(`labels the trial's plot axes with plain numbers inside the plot (${name})`, async () => {
      const page = await studio.newPage(size);
      await studio.signIn(page, 'designer@brassmoth.test');
      const trial = await studio.server.db('trials').where({ character_id: await characterId('Wicket'), course_name: 'Scrap rubble' }).first('id');
      await page.goto(`${studio.server.url}/trials/${trial.id}`);
      await page.getByRole('button', { name: 'Play' }).waitFor({ timeout: 60_000 });

      // Time from 0: the axis reads 0.0, and no label is a stray -0.00039 or cut off at the edge.
      const foot = await plotTicks(page, 'Foot height against target');
      expect(foot.map((t) => t.text)).toContain('0.0');
      const body = await plotTicks(page, 'Body height (hip level)');
      for (const t of [...foot, ...body]) {
        expect([t.text, PLAIN_NUMBER.test(t.text), t.inside, /^-0(\.0*)?$/.test(t.text)]).toEqual([t.text, true, true, false]);
        // One precision per axis: at most three decimals on these metre and second axes.
        expect(t.text.split('.')[1]?.length ?? 0).toBeLessThanOrEqual(3);
      }
      await page.locator('svg[aria-label^="Foot height against target:"]').first().scrollIntoViewIfNeeded();
      await screenshot(page, `qa-trial-plot-axes-${name}`);

      // The solver's error per iteration: a log axis of metres in powers of ten, iterations as whole numbers.
      // A frame where the solve takes a few iterations, so the axis has a span to label (a warm start often needs one).
      const scrub = page.getByTestId('scrub-bar');
      let iterations = 0;
      let title = '';
      for (const at of [0.2, 0.35, 0.5, 0.65, 0.8, 0.95]) {
        await scrub.scrollIntoViewIfNeeded();
        const bar = (await scrub.boundingBox())!;
        await page.mouse.click(bar.x + bar.width * at, bar.y + bar.height / 2);
        const solve = page.getByRole('button', { name: /^Solve Left leg at/ });
        const time = /at ([\d.]+) s/.exec((await solve.textContent())!)![1];
        await solve.click();
        title = `Left leg at ${time} s`;
        const label = (await page.locator(`svg[aria-label^="${title}:"]`).first().getAttribute('aria-label', { timeout: 60_000 }))!;
        iterations = Number(/: (\d+) iterations?:/.exec(label)![1]);
        // One solve says "1 iteration", not "1 iterations".
        if (iterations === 1) expect(label).toMatch(/: 1 iteration:/);
        if (iterations >= 3) break;
      }
      expect(iterations).toBeGreaterThanOrEqual(3);
      const ticks = await plotTicks(page, title);
      expect(ticks.length).toBeGreaterThanOrEqual(5);
      for (const t of ticks) expect([t.text, PLAIN_NUMBER.test(t.text), t.inside]).toEqual([t.text, true, true]);
      expect(ticks.map((t) => t.text)).toContain('1');
      expect(ticks.some((t) => /\.0$/.test(t.text) && Number.isInteger(Number(t.text)))).toBe(false);
      await page.locator(`svg[aria-label^="${title}:"]`).first().scrollIntoViewIfNeeded();
      await screenshot(page, `qa-trial-solver-axes-${name}`);
      await page.context().close();
    });
  }

  for (const [size, name] of SIZES) {
    it(`says "Enter a number." beside a box with no number, and holds "Run trial" until the form is valid (${name})`, async () => {
      const page = await studio.newPage(size);
      await studio.signIn(page, 'designer@brassmoth.test');
      await page.goto(`${studio.server.url}/characters/setup/${await characterId('Wicket')}`);
      await page.getByRole('heading', { name: 'Wicket: leg setup' }).waitFor();
      const budget = page.getByLabel('Iteration budget', { exact: true });
      await budget.fill('abc');
      await page.getByText('Enter a number.', { exact: true }).first().waitFor();
      // The preview, away from the box, names it.
      await page.getByText('The preview keeps the last valid settings: Iteration budget needs a number.').first().waitFor();
      expect(await page.getByText(/NaN|expected number/).count()).toBe(0);
      await budget.scrollIntoViewIfNeeded();
      await screenshot(page, `qa-setup-not-a-number-${name}`);

      // Not a silent trial of the saved version: the button waits and says why; no job starts.
      const jobsBefore = Number((await studio.server.db('jobs').count({ n: '*' }).first())?.n);
      const run = page.getByTestId('run-trial');
      await run.scrollIntoViewIfNeeded();
      const button = run.getByRole('button', { name: 'Run trial' });
      expect(await button.getAttribute('aria-disabled')).toBe('true');
      await run.getByText('The trial runs the settings in the form: first fix the ones marked there.').waitFor();
      await button.click({ force: true });
      await page.waitForTimeout(500);
      expect(await run.getByText('Walking the course').count()).toBe(0);
      expect(Number((await studio.server.db('jobs').count({ n: '*' }).first())?.n)).toBe(jobsBefore);
      await screenshot(page, `qa-setup-run-waits-${name}`);

      // Fixed, it runs again.
      await budget.fill('24');
      expect(await page.getByText(/enter a number|needs a number/i).count()).toBe(0);
      expect(await button.getAttribute('aria-disabled')).not.toBe('true');
      expect(await run.getByText('The trial runs the settings in the form', { exact: false }).count()).toBe(0);
      await page.context().close();
    });
  }

  for (const [size, name] of SIZES) {
    it(`drops the last "Invite sent" when the next invite is refused (${name})`, async () => {
      const page = await studio.newPage(size);
      await studio.signIn(page, 'owner@brassmoth.test');
      await page.goto(`${studio.server.url}/team`);
      await page.getByRole('heading', { name: 'Invite someone' }).waitFor();
      // Each size starts from the seeded team with no open invite: 4 of the Solo plan's 5 seats taken.
      await studio.server.db('invites').whereNull('accepted_at').whereNull('revoked_at').update({ revoked_at: Date.now() });
      const email = `qa-${name}@brassmoth.test`;
      await page.getByLabel('E-mail to invite').fill(email);
      await page.getByRole('radio', { name: 'Art lead' }).last().click();
      await page.getByRole('button', { name: 'Send invite' }).click();
      await page.getByText(`Invite sent to ${email}`, { exact: false }).waitFor();
      // The list below has it at once.
      await page.getByText(email, { exact: true }).waitFor();

      await page.getByLabel('E-mail to invite').fill('designer@brassmoth.test');
      await page.getByRole('button', { name: 'Send invite' }).click();
      await page.getByText('designer@brassmoth.test is already in this studio.').waitFor();
      expect(await page.getByText('Invite sent to', { exact: false }).count()).toBe(0);
      // The fifth seat is now held by the open invite: the next one is refused in words, and nothing says it went.
      await page.getByLabel('E-mail to invite').fill(`qa-${name}-2@brassmoth.test`);
      await page.getByRole('button', { name: 'Send invite' }).click();
      await page.getByText('The Solo plan allows 5 seats and the team has used 5 (4 members and 1 open invite).', { exact: false }).waitFor();
      expect(await page.getByText('Invite sent to', { exact: false }).count()).toBe(0);
      await page.getByRole('button', { name: 'Send invite' }).scrollIntoViewIfNeeded();
      await screenshot(page, `qa-invite-refused-${name}`);
      await page.context().close();
    });
  }

  for (const [size, name, course] of [
    [PHONE, 'phone', 'Drainage trench'],
    [WIDE, 'wide', 'Ramp to the gantry'],
  ] as const) {
    it(`keeps unsaved sculpting when the designer leaves the course and comes back (${name})`, async () => {
      const page = await studio.newPage(size);
      await studio.signIn(page, 'designer@brassmoth.test');
      const { id } = await studio.server.db('courses').where({ name: course }).first('id');
      await page.goto(`${studio.server.url}/courses/${id}`);
      await page.getByRole('heading', { name: course }).waitFor();
      await page.getByRole('radio', { name: 'Paint' }).click();
      await sculptStroke(page, 0.3);
      const status = page.getByRole('status');
      await status.filter({ hasText: 'Unsaved changes' }).waitFor();

      // Off to the course list by the tab bar (phone) or side rail (wide), then Back.
      await page.getByRole('link', { name: 'Courses' }).first().click();
      await page.getByRole('heading', { name: 'Courses', level: 1 }).waitFor();
      await page.goBack();
      await page.getByRole('heading', { name: course }).waitFor();
      await page.getByText('Unsaved changes from before you left, still here').waitFor();
      expect(await page.getByRole('button', { name: 'Save' }).getAttribute('aria-disabled')).not.toBe('true');
      await screenshot(page, `qa-course-kept-${name}`);
      // Its undo history came back with it.
      await page.getByRole('button', { name: 'Undo' }).click();
      await status.filter({ hasText: 'Version 1, nothing to save' }).waitFor();
      await page.getByRole('button', { name: 'Redo' }).click();
      await status.filter({ hasText: 'Unsaved changes' }).waitFor();

      // Saved, nothing is kept: after a tab and Back the course reads as saved.
      await page.getByRole('button', { name: 'Save' }).click();
      await status.filter({ hasText: 'Saved as version 2.' }).waitFor();
      await page.getByRole('link', { name: 'Courses' }).first().click();
      await page.getByRole('heading', { name: 'Courses', level: 1 }).waitFor();
      await page.goBack();
      await status.filter({ hasText: 'Version 2, nothing to save' }).waitFor();
      expect(await page.getByText('Unsaved changes from before you left').count()).toBe(0);

      // Closing the page with something unsaved asks first.
      await page.getByRole('radio', { name: 'Paint' }).click();
      await sculptStroke(page, 0.6);
      await status.filter({ hasText: 'Unsaved changes' }).waitFor();
      const asked = new Promise<string>((resolve) =>
        page.once('dialog', (d) => {
          resolve(d.type());
          void d.dismiss();
        }),
      );
      await page.close({ runBeforeUnload: true });
      expect(await asked).toBe('beforeunload');
      await page.context().close();
    });
  }
});
