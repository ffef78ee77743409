/**
 * The dial-in as a designer meets it: each tuned setting with its value now, the cost against the month's
 * allowance before starting, progress in view once started, and a dial-in that finds nothing saying so
 * without offering Accept. One that finds a gain is accepted and points on to a trial and publishing.
 * Phone (390×844) and wide (1440×900).
 */
import type { Page } from 'playwright-core';
import { PHONE, WIDE, screenshot } from '../support/browser';
import { e2eStudio } from '../support/e2e';
import type { CourseList, SuiteResponse } from '../../schemas/courses';
import type { DialInAllowance } from '../../schemas/dial-in-allowance';
import type { LegSetupList } from '../../schemas/leg-setups';

jest.setTimeout(420_000);

const studio = e2eStudio();
const MOSS = 'rgb(91, 140, 90)';

async function get<T>(page: Page, path: string): Promise<T> {
  return (await (await page.request.get(`${studio.server.url}/api${path}`)).json()) as T;
}

/** A one-course suite over one of the studio's courses (made through the API, as the suite editor would). */
async function oneCourseSuite(page: Page, name: string, course: string): Promise<void> {
  const { courses } = await get<CourseList>(page, '/courses');
  const res = await page.request.post(`${studio.server.url}/api/suites`, { data: { name, courseIds: [courses.find((c) => c.name === course)!.id] } });
  expect(res.status()).toBe(201);
  (await res.json()) as SuiteResponse;
}

/** Tunes only the named settings (within their suggested bounds), keeping the rest; groups are found by the label they start with. */
async function tuneOnly(page: Page, tuned: string[]) {
  for (const label of ALL) {
    const group = page.getByRole('radiogroup', { name: new RegExp(`^${label}( \\(|  ·|$| ·)`) });
    await group.getByRole('radio', { name: tuned.includes(label) ? 'tune' : 'keep' }).click();
  }
}

const ALL = ['DLS damping λ', 'Iteration budget', 'Largest joint change per iteration', 'Duty factor', 'Step height', 'Body settling time', 'Body follows the feet’s height', 'Crouch per radian of slope', 'Body height offset'];

describe('dialling in', () => {
  it('on a phone: cost before, progress in view, and no Accept when nothing was found', async () => {
    const page = await studio.newPage(PHONE);
    await studio.signIn(page, 'designer@brassmoth.test');
    // Flat ground: how far the body follows the feet's height cannot matter where the ground never rises,
    // so every candidate scores as the start does (common practice, no source: a setting with nothing to act on).
    expect((await page.request.post(`${studio.server.url}/api/courses/starter`, { data: {} })).status()).toBe(201);
    await oneCourseSuite(page, 'Level only', 'Starter: level ground');
    const wicketId = (await studio.server.db('characters').where({ name: 'Wicket' }).first('id')).id as number;
    const setups = await get<LegSetupList>(page, `/characters/${wicketId}/leg-setups`);
    const current = setups.versions[0]?.setup ?? setups.defaults;
    const allowance = await get<DialInAllowance>(page, '/dial-ins/allowance');
    // A stored trial of the starting version on that course: where the no-gain panel reads the start's stumbles.
    const { courses } = await get<CourseList>(page, '/courses');
    const level = courses.find((c) => c.name === 'Starter: level ground')!.id;
    const trial = await page.request.post(`${studio.server.url}/api/trials`, { data: { characterId: wicketId, courseId: level, legSetupId: setups.versions[0].id } });
    expect(trial.status()).toBe(202);
    const jobId = ((await trial.json()) as { job: { id: number } }).job.id;
    let job: { status: string; result?: { trialIds: number[] } } = { status: 'queued' };
    while (job.status === 'queued' || job.status === 'running') {
      await page.waitForTimeout(500);
      job = await get(page, `/jobs/${jobId}`);
    }
    expect(job.status).toBe('done');
    const trialId = job.result!.trialIds[0];

    await page.goto(`${studio.server.url}/characters/dial-in/${wicketId}`);
    await page.getByRole('heading', { name: 'Wicket: dial-in' }).waitFor();
    // Each setting says its value now: the start's follow-height, as the leg setup API gives it.
    await page.getByRole('radiogroup', { name: `Body follows the feet’s height · now ${parseFloat(current.body.followHeight.toPrecision(3))}` }).waitFor();
    // Angles in degrees: the schema's radians × 180/π (ISO 80000-3).
    const stepDeg = parseFloat(((current.solver.maxStepAngle * 180) / Math.PI).toPrecision(3));
    await page.getByRole('radiogroup', { name: `Largest joint change per iteration (°) · now ${stepDeg}°` }).waitFor();
    await tuneOnly(page, ['Body follows the feet’s height']);
    await page.getByRole('radio', { name: 'Level only' }).click();
    await page.getByLabel('Budget (candidates; each is a trial per course)').fill('6');

    // The cost, before starting: 6 × 1 course, against what the month has left.
    const cost = page.getByTestId('dial-in-cost');
    await cost.getByText(/Cost: 6 candidates × 1 course = 6 trials\./).waitFor();
    const left = allowance.limit - allowance.used;
    await cost.getByText(new RegExp(`${allowance.used.toLocaleString('en-US')} of ${allowance.limit.toLocaleString('en-US')} dial-in candidates used, ${left.toLocaleString('en-US')} left; this one would leave ${(left - 6).toLocaleString('en-US')}\\.`)).waitFor();
    await cost.scrollIntoViewIfNeeded();
    await screenshot(page, 'dial-in-cost-phone');

    await page.getByRole('button', { name: 'Start the dial-in' }).click();
    // Progress is in view at once, not below the long form.
    const progress = page.getByTestId('job-progress');
    await progress.waitFor();
    await page.waitForTimeout(600);
    const box = (await progress.boundingBox())!;
    expect(box.y).toBeGreaterThanOrEqual(0);
    expect(box.y + box.height).toBeLessThanOrEqual(PHONE.height);
    await screenshot(page, 'dial-in-progress-phone');

    await page.getByTestId('dial-in-result').waitFor({ timeout: 300_000 });
    const noGain = page.getByTestId('dial-in-no-gain');
    await noGain.getByText('Nothing better than the start').waitFor();
    expect(await page.getByRole('button', { name: /^Accept/ }).count()).toBe(0);
    // The unchanged mean is not in the "better" colour, and the change reads ± 0.0.
    expect(await page.getByTestId('dial-in-best-mean').evaluate((el) => getComputedStyle(el).color)).not.toBe(MOSS);
    await page.getByTestId('dial-in-result').getByText('± 0.0').first().waitFor();
    // The tuned setting shows where it started and what was found.
    await page.getByLabel(new RegExp(`^Body follows the feet’s height: start ${parseFloat(current.body.followHeight.toPrecision(3))}, found `)).waitFor();
    // Why: the start's stumbles on the course, from that stored trial, each kind a number.
    await noGain.getByRole('link', { name: `From trial ${trialId} of the same leg setup: open it →` }).waitFor();
    for (const kind of ['Sink', 'Skid', 'Reach-miss', 'Scuff', 'Snap']) await noGain.getByLabel(new RegExp(`^${kind} \\d+\\.\\d per 100 steps$`)).waitFor();
    await noGain.scrollIntoViewIfNeeded();
    await screenshot(page, 'dial-in-no-gain-phone');
  });

  it('wide: a dial-in that gains is accepted, then leads on to a trial and to publishing', async () => {
    const page = await studio.newPage(WIDE);
    await studio.signIn(page, 'designer@brassmoth.test');
    await oneCourseSuite(page, 'Rubble only', 'Scrap rubble');
    const wicketId = (await studio.server.db('characters').where({ name: 'Wicket' }).first('id')).id as number;
    // The seeded setup was itself dialled in and leaves nothing to gain: a designer's version with the step
    // height at the bottom of its suggested range (2 cm, toes low over the rubble) is what this dial-in starts from.
    const { versions } = await get<LegSetupList>(page, `/characters/${wicketId}/leg-setups`);
    const low = { ...versions[0].setup, gait: { ...versions[0].setup.gait, stepHeight: 0.02 } };
    const saved = await page.request.post(`${studio.server.url}/api/characters/${wicketId}/leg-setups`, { data: { setup: low, note: 'Low steps' } });
    expect(saved.status()).toBe(201);
    await page.goto(`${studio.server.url}/characters/dial-in/${wicketId}`);
    await page.getByRole('heading', { name: 'Wicket: dial-in' }).waitFor();
    await tuneOnly(page, ['Step height', 'Duty factor']);
    await page.getByRole('radio', { name: 'Rubble only' }).click();
    await page.getByLabel('Budget (candidates; each is a trial per course)').fill('12');
    await page.getByTestId('dial-in-cost').getByText(/12 candidates × 1 course = 12 trials/).waitFor();
    await screenshot(page, 'dial-in-setup-wide');
    await page.getByRole('button', { name: 'Start the dial-in' }).click();
    const progress = page.getByTestId('job-progress');
    await progress.waitFor();
    const box = (await progress.boundingBox())!;
    expect(box.y + box.height).toBeLessThanOrEqual(WIDE.height);
    await page.getByTestId('dial-in-result').waitFor({ timeout: 300_000 });
    await screenshot(page, 'dial-in-result-wide');
    expect(await page.getByTestId('dial-in-no-gain').count()).toBe(0);
    expect(await page.getByTestId('dial-in-best-mean').evaluate((el) => getComputedStyle(el).color)).toBe(MOSS);
    await page.getByRole('button', { name: 'Accept: save as a new leg setup version' }).click();
    const onward = page.getByTestId('dial-in-accepted');
    await onward.waitFor();
    expect(await onward.getByRole('link', { name: 'Run a trial with it →' }).getAttribute('href')).toBe(`/characters/setup/${wicketId}`);
    expect(await onward.getByRole('link', { name: 'Publish it as a leg profile →' }).getAttribute('href')).toBe('/profiles');
    await screenshot(page, 'dial-in-accepted-wide');
    await onward.getByRole('link', { name: 'Run a trial with it →' }).click();
    await page.getByRole('heading', { name: 'Wicket: leg setup' }).waitFor();
  });
});
