/**
 * A brand-new studio never dead-ends: Home's next steps are links; with a character but no ground, the leg
 * setup says why there is no trial to run and the dial-in why it cannot start; one tap on Courses adds the
 * starter courses and suite, after which "Run trial" is there. Phone first, then wide.
 */
import type { Page } from 'playwright-core';
import { PHONE, WIDE, screenshot } from '../support/browser';
import { e2eStudio } from '../support/e2e';
import { createStudio, STUDIO_PASSWORD } from '../support/studio';
import type { CourseList, SuiteList } from '../../schemas/courses';

jest.setTimeout(240_000);

const studio = e2eStudio();
let characterId = 0;

/** A new studio with one character (a copy of the demo's Wicket row: the file is content-addressed) and nothing else. */
async function freshStudio(slug: string): Promise<{ designer: string }> {
  const db = studio.server.db;
  const { teamId, members } = await createStudio(db, slug, Date.now() - 60_000);
  const wicket = await db('characters').where({ name: 'Wicket' }).first();
  const { id: _id, ...row } = wicket;
  const [id] = await db('characters').insert({ ...row, team_id: teamId, uploaded_by: members.owner.id });
  characterId = id;
  return { designer: members.designer.email };
}

async function signIn(page: Page, email: string, team: string) {
  await page.goto(`${studio.server.url}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(STUDIO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByText(team, { exact: true }).first().waitFor();
}

describe('a new studio', () => {
  it('is led from Home to starter courses and its first trial on a phone', async () => {
    const { designer } = await freshStudio('fresh');
    const page = await studio.newPage(PHONE);
    await signIn(page, designer, 'Studio fresh');

    // Home: next steps, each a link; the character step is done, the ground step is not.
    const steps = page.getByLabel('Next steps');
    await steps.waitFor();
    await steps.getByText('Bring a character').waitFor();
    expect(await steps.getByText('(done)').count()).toBe(1);
    const toCourses = steps.getByRole('link', { name: 'Go to the course list' });
    expect(await toCourses.getAttribute('href')).toBe('/courses');
    expect(await steps.getByRole('link', { name: "Open Wicket's leg setup" }).getAttribute('href')).toBe(`/characters/setup/${characterId}`);
    expect(await steps.getByRole('button', { name: 'Add starter courses' }).count()).toBe(1);
    await screenshot(page, 'new-studio-home-phone');

    // The leg setup: no disabled "Run trial" without a reason; the reason and the way out instead.
    await steps.getByRole('link', { name: "Open Wicket's leg setup" }).click();
    await page.getByRole('heading', { name: 'Wicket: leg setup' }).waitFor();
    const why = page.getByText('“Run trial” needs ground to walk over, and this studio has no course or suite yet.');
    await why.waitFor();
    expect(await page.getByRole('button', { name: 'Run trial' }).count()).toBe(0);
    await why.scrollIntoViewIfNeeded();
    await screenshot(page, 'new-studio-setup-no-ground-phone');

    // The dial-in says why it cannot start.
    await page.goto(`${studio.server.url}/characters/dial-in/${characterId}`);
    await page.getByText('A dial-in runs over a suite, and this studio has none yet.').waitFor();
    const start = page.getByRole('button', { name: 'Start the dial-in' });
    expect(await start.getAttribute('aria-disabled')).toBe('true');
    await page.getByText('Start needs a suite to run over: add the starter courses above.').waitFor();

    // Courses: one tap.
    await page.getByRole('link', { name: 'Courses' }).first().click();
    await page.waitForURL('**/courses');
    await page.getByText('No courses yet. Start with the starter set in one tap, or make your own from a generator.').waitFor();
    await screenshot(page, 'new-studio-courses-empty-phone');
    await page.getByRole('button', { name: 'Add starter courses' }).click();
    for (const name of ['Starter: level ground', 'Starter: gentle slope', 'Starter: three steps', 'Starter: loose gravel']) {
      await page.getByRole('link', { name: `Open ${name}` }).waitFor();
    }
    await page.getByText('Starter suite', { exact: true }).first().waitFor();
    const { courses } = (await (await page.request.get(`${studio.server.url}/api/courses`)).json()) as CourseList;
    const { suites } = (await (await page.request.get(`${studio.server.url}/api/suites`)).json()) as SuiteList;
    expect(courses).toHaveLength(4);
    expect(suites.map((s) => [s.name, s.courses.length])).toEqual([['Starter suite', 4]]);
    await screenshot(page, 'new-studio-courses-added-phone');

    // Back on the leg setup, the trial can run over them.
    await page.goto(`${studio.server.url}/characters/setup/${characterId}`);
    const run = page.getByTestId('run-trial');
    await run.waitFor();
    await run.getByRole('radio', { name: 'Starter: level ground' }).waitFor();
    expect(await run.getByRole('button', { name: 'Run trial' }).getAttribute('aria-disabled')).not.toBe('true');

    // Home: the ground step is done now.
    await page.getByRole('link', { name: 'Home' }).first().click();
    await page.getByLabel('Next steps').getByText('Give it ground to walk over').waitFor();
    await page.waitForFunction(() => document.body.innerText.split('(done)').length - 1 === 2);
    await screenshot(page, 'new-studio-home-after-phone');
  });

  it('shows the same next steps and the starter offer on a wide screen', async () => {
    const { designer } = await freshStudio('wide');
    const page = await studio.newPage(WIDE);
    await signIn(page, designer, 'Studio wide');
    await page.getByLabel('Next steps').waitFor();
    await screenshot(page, 'new-studio-home-wide');
    await page.goto(`${studio.server.url}/courses`);
    await page.getByRole('button', { name: 'Add starter courses' }).waitFor();
    await screenshot(page, 'new-studio-courses-empty-wide');
    await page.getByRole('button', { name: 'Add starter courses' }).click();
    await page.getByRole('row', { name: 'Open Starter: three steps' }).waitFor();
    await screenshot(page, 'new-studio-courses-added-wide');
  });
});
