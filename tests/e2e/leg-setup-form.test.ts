/**
 * The leg setup form as a designer on a phone meets it: the small preview stays in view while the form
 * scrolls; only the chosen solver method's settings show; methods and gaits by name, not code; angles in
 * degrees; figures rounded; dates in the reader's locale. Then the wide layout; then a setting of its own (joint
 * speed limit, a foothold weight) saved and read back after a reload, the other foothold weights untouched.
 */
import type { Page } from 'playwright-core';
import { PHONE, WIDE, screenshot } from '../support/browser';
import { e2eStudio } from '../support/e2e';
import type { LegSetupList } from '../../schemas/leg-setups';

jest.setTimeout(240_000);

const studio = e2eStudio();

async function openWicketSetup(page: Page): Promise<{ id: number; list: LegSetupList }> {
  await studio.signIn(page, 'designer@brassmoth.test');
  const id = (await studio.server.db('characters').where({ name: 'Wicket' }).first('id')).id as number;
  const list = (await (await page.request.get(`${studio.server.url}/api/characters/${id}/leg-setups`)).json()) as LegSetupList;
  await page.goto(`${studio.server.url}/characters/setup/${id}`);
  await page.getByRole('heading', { name: 'Wicket: leg setup' }).waitFor();
  return { id, list };
}

const field = (page: Page, label: string) => page.getByLabel(label, { exact: true });

describe('the leg setup form', () => {
  it('on a phone keeps the preview in view and shows one method, in names, degrees and rounded figures', async () => {
    // A reader in Britain: dates come out day first, month in words.
    const page = await studio.newPage(PHONE, { locale: 'en-GB', timezoneId: 'Europe/London' });
    const { list } = await openWicketSetup(page);
    const setup = list.versions[0]?.setup ?? list.defaults;
    const preview = page.getByTestId('sticky-preview');
    await preview.getByTestId('walk-view').waitFor();
    await screenshot(page, 'leg-setup-form-phone');

    // Names, not codes.
    const methods = page.getByRole('radiogroup', { name: 'Method' });
    expect(await methods.getByRole('radio').allTextContents()).toEqual(['DLS', 'SDLS', 'Jacobian transpose', 'Pseudoinverse', 'Adaptive DLS', 'CCD']);
    const gaits = await page.getByRole('radiogroup', { name: 'Pattern' }).getByRole('radio').allTextContents();
    expect(gaits).toContain('Two-leg walk');
    expect(gaits.join(' ')).not.toMatch(/biped-walk|quadruped|hexapod/);

    // Only the chosen method's settings.
    await methods.getByRole('radio', { name: 'DLS', exact: true }).click();
    await field(page, 'DLS damping λ (m)').waitFor();
    expect(await field(page, 'SDLS largest joint change γmax (°)').count()).toBe(0);
    await methods.getByRole('radio', { name: 'SDLS' }).click();
    await field(page, 'SDLS largest joint change γmax (°)').waitFor();
    expect(await field(page, 'DLS damping λ (m)').count()).toBe(0);
    await methods.getByRole('radio', { name: 'CCD' }).click();
    expect(await field(page, 'DLS damping λ (m)').count()).toBe(0);
    expect(await field(page, 'SDLS largest joint change γmax (°)').count()).toBe(0);
    expect(await field(page, 'Task error clamp (m)').count()).toBe(0);
    expect(await page.getByRole('radiogroup', { name: 'Null-space bias' }).count()).toBe(0);
    await methods.scrollIntoViewIfNeeded();
    await screenshot(page, 'leg-setup-ccd-phone');
    await methods.getByRole('radio', { name: 'DLS', exact: true }).click();

    // Degrees for the angles people type: the stored radians × 180/π (ISO 80000-3), to 3 significant digits.
    const step = field(page, 'Largest joint change per iteration (°)');
    expect(Number(await step.inputValue())).toBeCloseTo((setup.solver.maxStepAngle * 180) / Math.PI, 1);
    // Rounded figures: no 1.12929 for a speed.
    if (setup.gait.timing.mode === 'speed') {
      const speed = await field(page, 'Walking speed (m/s)').inputValue();
      expect(speed).toBe(String(parseFloat(setup.gait.timing.speed.toPrecision(3))));
      expect(speed.replace(/^0\.0*|\./g, '').length).toBeLessThanOrEqual(3);
    }

    // The preview stays in view while the form scrolls down to the body settings.
    await page.getByRole('heading', { name: 'Body', exact: true }).scrollIntoViewIfNeeded();
    await page.getByRole('heading', { name: 'Limits per leg' }).scrollIntoViewIfNeeded();
    const box = (await preview.boundingBox())!;
    expect(box.y).toBeGreaterThanOrEqual(0);
    expect(box.y + box.height).toBeLessThan(PHONE.height / 2);
    await screenshot(page, 'leg-setup-scrolled-phone');

    // Joint limits in degrees here too, as on the legs page: a saved limit is its radians × 180/π.
    const saved = setup.legs.flatMap((l) => l.limits);
    if (saved.length) expect(Number(await page.getByLabel('Min (°)').first().inputValue())).toBeCloseTo((saved[0].min * 180) / Math.PI, 0);
    await page.getByRole('button', { name: 'Add a joint limit' }).click();
    await page.getByLabel('Min (°)').nth(saved.length).waitFor();
    expect(await page.getByLabel('Min (°)').nth(saved.length).inputValue()).toBe('-45');

    // Dates in the reader's locale (en-GB: "1 Dec 2026, 23:25"; CLDR medium pattern, from memory).
    if (list.versions.length) {
      await page.getByRole('heading', { name: 'Versions' }).scrollIntoViewIfNeeded();
      const meta = await page.getByRole('button', { name: `Load version ${list.versions[0].version}` }).innerText();
      expect(meta).toMatch(/\b\d{1,2} [A-Z][a-z]{2} \d{4}, \d{2}:\d{2}\b/);
      expect(meta).not.toMatch(/\d{1,2}\/\d{1,2}\/\d{4}/);
    }
  });

  it('wide: the form beside the full preview', async () => {
    const page = await studio.newPage(WIDE, { locale: 'en-US' });
    await openWicketSetup(page);
    await page.getByTestId('live-preview').getByTestId('walk-view').waitFor();
    await page.getByRole('radiogroup', { name: 'Preview course' }).waitFor();
    await page.waitForTimeout(600);
    await screenshot(page, 'leg-setup-form-wide');
  });

  it('keeps a joint speed limit and a foothold weight of its own through a save and a reload', async () => {
    const page = await studio.newPage(PHONE, { locale: 'en-GB', timezoneId: 'Europe/London' });
    const { id, list } = await openWicketSetup(page);
    const before = list.versions[0]?.setup ?? list.defaults;
    // Values no default would give (700 °/s and 0.18 of the stride are the engine's).
    expect(before.solver.maxJointSpeed).not.toBe(123);
    expect(before.footholds.searchRadius).not.toBe(0.9);

    await field(page, 'Joint speed limit (°/s)').fill('123');
    const radius = field(page, 'Search radius (share of the stride)');
    // Folded away on a phone until asked for.
    expect(await radius.count()).toBe(0);
    const show = page.getByRole('button', { name: 'Show the foothold settings' });
    await show.scrollIntoViewIfNeeded();
    await screenshot(page, 'leg-setup-footholds-folded-phone');
    await show.click();
    await radius.fill('0.9');
    // Over the schema's 1000 limit: said beside the field in the sentence the server would use.
    await field(page, 'Edge weight (cost per m of height jump)').fill('5000');
    await page.getByTestId('foothold-fields').getByRole('alert').filter({ hasText: 'Foothold edge weight 5000 is above the 1000 limit; set it to at most 1000.' }).waitFor();
    await field(page, 'Edge weight (cost per m of height jump)').fill(String(before.footholds.edgeWeight));
    await field(page, 'Reach weight (cost at the reach limit)').scrollIntoViewIfNeeded();
    await screenshot(page, 'leg-setup-footholds-phone');

    await page.getByRole('button', { name: 'Save as a new version' }).click();
    await page.getByText(/^Saved as version \d+\.$/).waitFor();

    await page.reload();
    await page.getByRole('heading', { name: 'Wicket: leg setup' }).waitFor();
    expect(await field(page, 'Joint speed limit (°/s)').inputValue()).toBe('123');
    await page.getByRole('button', { name: 'Show the foothold settings' }).click();
    expect(await radius.inputValue()).toBe('0.9');
    expect(Number(await field(page, 'Reach weight (cost at the reach limit)').inputValue())).toBeCloseTo(before.footholds.reachWeight, 2);

    // What the server stored: the two changed, every other foothold weight as it was.
    const after = ((await (await page.request.get(`${studio.server.url}/api/characters/${id}/leg-setups`)).json()) as LegSetupList).versions[0].setup;
    expect(after.solver.maxJointSpeed).toBe(123);
    expect(after.footholds).toEqual({ ...before.footholds, searchRadius: 0.9 });

    const wide = await studio.newPage(WIDE, { locale: 'en-US' });
    await openWicketSetup(wide);
    await wide.getByRole('button', { name: 'Show the foothold settings' }).click();
    expect(await field(wide, 'Search radius (share of the stride)').inputValue()).toBe('0.9');
    await wide.getByRole('heading', { name: 'Footholds', exact: true }).scrollIntoViewIfNeeded();
    await screenshot(wide, 'leg-setup-footholds-wide');
  });
});
