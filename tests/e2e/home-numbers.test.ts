/**
 * Home as the designer reads it: each score names what it is of (one course and the leg setup version), the
 * trend never compares two courses, the same course's score is the one Compare shows, every tap target is at
 * least 44 × 44 CSS px (WCAG 2.2 SC 2.5.5 "Target Size (Enhanced)"; DEVELOPERS.md), and a card opens its character.
 */
import type { Locator } from 'playwright-core';
import { PHONE, WIDE, screenshot } from '../support/browser';
import { e2eStudio } from '../support/e2e';

jest.setTimeout(240_000);

const studio = e2eStudio();

async function box(target: Locator) {
  const b = await target.boundingBox();
  if (!b) throw new Error('target has no box (not shown)');
  return b;
}

/** Each demo character's newest stored trial, the one Home shows. */
async function latestTrials() {
  const rows = await studio.server
    .db('trials as t')
    .join('characters as c', 'c.id', 't.character_id')
    .leftJoin('leg_setups as s', 's.id', 't.leg_setup_id')
    .orderBy('t.id', 'desc')
    .select('t.id', 'c.id as characterId', 'c.name', 't.course_name as course', 't.footing_score as score', 's.version');
  const latest = new Map<string, (typeof rows)[number]>();
  for (const r of rows) if (!latest.has(r.name)) latest.set(r.name, r);
  return latest;
}

describe('Home', () => {
  it('names the course and leg setup of every score, compares like with like, and has 44 px targets (phone)', async () => {
    const page = await studio.newPage(PHONE);
    await studio.signIn(page, 'designer@brassmoth.test');
    await page.getByRole('heading', { name: 'Home', level: 1 }).waitFor();
    const latest = await latestTrials();
    expect(latest.size).toBe(3);
    for (const [name, t] of latest) {
      const card = page.getByLabel(`${name} footing`);
      await card.getByText(`${t.course} · leg setup v${t.version}`).waitFor();
      expect(await card.getByText(Number(t.score).toFixed(1), { exact: true }).count()).toBe(1);
      // The seed runs each course once per character: there is nothing on the same course to compare with.
      await card.getByText(`First trial on ${t.course}`).waitFor();
      expect(await card.getByText(/better than|worse than/).count()).toBe(0);
      // Its other course is shown beside it, with its own score and version, not as a change.
      const other = await studio.server.db('trials').where({ character_id: t.characterId }).whereNot({ course_name: t.course }).orderBy('id', 'desc').first('course_name', 'footing_score');
      await card.getByText(`Latest on other courses: ${other.course_name} ${Number(other.footing_score).toFixed(1)} (leg setup v${t.version})`).waitFor();

      const open = card.getByRole('link', { name: `Open ${name}'s latest trial, on ${t.course}` });
      const trialBox = await box(open);
      expect(trialBox.width).toBeGreaterThanOrEqual(44);
      expect(trialBox.height).toBeGreaterThanOrEqual(44);
      const main = card.getByRole('link', { name: new RegExp(`^${name}: .* Open the character$`) });
      const mainBox = await box(main);
      expect(mainBox.height).toBeGreaterThanOrEqual(44);
      expect(mainBox.width).toBeGreaterThanOrEqual(44);
    }
    await screenshot(page, 'home-numbers-phone');

    // The card itself is a way in.
    const wicket = latest.get('Wicket')!;
    await page.getByRole('link', { name: /^Wicket: .* Open the character$/ }).click();
    await page.waitForURL(`**/characters/${wicket.characterId}`);

    // The trial page's speed chips are 44 px wide too (1× was 41).
    await page.goto(`${studio.server.url}/trials/${wicket.id}`);
    await page.getByRole('radio', { name: '1×', exact: true }).waitFor({ timeout: 60_000 });
    const speeds = page.getByRole('radiogroup', { name: 'Speed' }).getByRole('radio');
    expect(await speeds.count()).toBeGreaterThan(1);
    for (const chip of await speeds.all()) {
      const b = await box(chip);
      expect([await chip.getAttribute('aria-label'), b.width >= 44 && b.height >= 44]).toEqual([await chip.getAttribute('aria-label'), true]);
    }
    await page.context().close();
  });

  it('shows the same course score as Compare, which says it is of the suite and names the leg setup (wide)', async () => {
    const page = await studio.newPage(WIDE);
    await studio.signIn(page, 'artlead@brassmoth.test');
    await page.getByRole('heading', { name: 'Home', level: 1 }).waitFor();
    await screenshot(page, 'home-numbers-wide');
    const latest = await latestTrials();
    const wicket = latest.get('Wicket')!;
    const skitter = latest.get('Skitter')!;
    expect(skitter.course).toBe(wicket.course);
    const suite = await studio.server.db('suites').where({ name: 'Scrapyard crossing' }).first('id');
    await page.goto(`${studio.server.url}/compare?suite=${suite.id}&pick=c${wicket.characterId},c${skitter.characterId}`);
    const table = page.getByRole('table', { name: 'Metrics side by side' });
    await table.waitFor({ timeout: 90_000 });
    await table.getByText(`leg setup v${wicket.version}`).first().waitFor();
    // The per-course row of the course Home shows: Compare re-runs the same setup for as long as a trial of record.
    const row = table.getByRole('row').filter({ has: page.getByRole('rowheader').filter({ hasText: wicket.course }) });
    await row.getByRole('cell', { name: new RegExp(`^Wicket: ${Number(wicket.score).toFixed(1)}`) }).waitFor();
    await row.getByRole('cell', { name: new RegExp(`^Skitter: ${Number(skitter.score).toFixed(1)}`) }).waitFor();
    await page.getByText('Suite figures pool all 4 courses', { exact: false }).waitFor();
    await screenshot(page, 'compare-per-course-wide');

    // The suite score of the same leg setup is the one its published profile version shows.
    const published = await studio.server
      .db('profile_versions as v')
      .join('profiles as p', 'p.id', 'v.profile_id')
      .join('leg_setups as s', 's.id', 'v.leg_setup_id')
      .where({ 'p.character_id': wicket.characterId, 's.version': wicket.version })
      .first('v.version', 'v.footing_score', 'p.id');
    const suiteRow = table.getByRole('row').filter({ has: page.getByRole('rowheader').filter({ hasText: /^Footing score/ }) });
    await suiteRow.getByRole('cell', { name: new RegExp(`^Wicket: ${Number(published.footing_score).toFixed(1)}`) }).waitFor();
    await page.goto(`${studio.server.url}/profiles/${published.id}`);
    const version = page.getByLabel(`Version ${published.version}`, { exact: true });
    await version.getByText(Number(published.footing_score).toFixed(1), { exact: false }).first().waitFor();
    await version.getByText(`on suite Scrapyard crossing (4 courses) · leg setup v${wicket.version}`).waitFor();
    await screenshot(page, 'profile-score-of-wide');
    await page.context().close();
  });
});
