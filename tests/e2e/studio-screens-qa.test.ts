/**
 * Bugs a user met walking the studio screens, each checked the way that user would see it, at 390×844 and
 * 1440×900:
 * - the trial's plots label their axes with plain numbers at one precision, inside the plot (a foot-height axis read a
 *   clipped "-0.00039", the solver's log axis ".000076").
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
});
