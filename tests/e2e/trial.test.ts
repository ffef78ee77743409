/**
 * The designer's loop at phone size in the real server and a headless browser: open Burrow's leg setup
 * (with its live preview), run a trial over a demo course as a background job, watch the progress bar
 * finish, open the trial and see the metric cards and the stumble timeline. Then the same pages wide, and
 * the dial-in screen. Screenshots at 390×844 and 1440×900.
 */
import type { Browser, Page } from 'playwright-core';
import { launchBrowser, PHONE, WIDE, screenshot } from '../support/browser';
import { startTestServer } from '../support/test-server';
import { DEMO_PASSWORD } from '../../seeds/demo-studio';

jest.setTimeout(240_000);

let server: Awaited<ReturnType<typeof startTestServer>>;
let browser: Browser;
let closeBrowser: () => Promise<void>;
let burrowId = 0;

beforeAll(async () => {
  server = await startTestServer();
  ({ browser, close: closeBrowser } = await launchBrowser());
  burrowId = (await server.db('characters').where({ name: 'Burrow' }).first('id')).id;
});
afterEach(async () => {
  for (const context of browser?.contexts() ?? []) await context.close();
});
afterAll(async () => {
  await closeBrowser?.();
  await server?.stop();
});

async function signedInPage(size: { width: number; height: number }): Promise<Page> {
  // Signs in at phone size, then takes the asked size (the page it lands on first is not part of this test).
  const context = await browser.newContext({ viewport: PHONE, deviceScaleFactor: 1 });
  const page = await context.newPage();
  const problems: string[] = [];
  page.on('pageerror', (err) => problems.push(err.message));
  await page.goto(`${server.url}/sign-in`);
  await page.getByLabel('E-mail').fill('designer@brassmoth.test');
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
  await page.getByRole('button', { name: 'Sign out' }).first().waitFor().catch(async (err) => {
    await screenshot(page, `trial-sign-in-failed-${size.width}`);
    throw new Error(`${(err as Error).message}; page errors: ${problems.join(' | ')}`);
  });
  await page.setViewportSize(size);
  (page as Page & { problems?: string[] }).problems = problems;
  return page;
}

describe('running a trial and reading it', () => {
  it('runs a trial from the leg setup page on a phone and shows its metric cards and stumble timeline', async () => {
    const page = await signedInPage(PHONE);
    await page.goto(`${server.url}/characters/setup/${burrowId}`);
    await page.getByRole('heading', { name: 'Burrow: leg setup' }).waitFor();
    await page.getByTestId('live-preview').getByTestId('walk-view').waitFor();
    await page.waitForTimeout(800);
    await screenshot(page, 'leg-setup-phone');

    // A field message from the shared schema, then back to a valid value.
    const duty = page.getByLabel('Duty factor (share of the cycle in stance)');
    await duty.fill('1.5');
    const message = page.getByText(/0\.98/).first();
    await message.waitFor();
    await message.scrollIntoViewIfNeeded();
    await screenshot(page, 'leg-setup-error-phone');
    await duty.fill('0.6');

    const run = page.getByTestId('run-trial');
    await run.scrollIntoViewIfNeeded();
    await run.getByRole('radio', { name: 'Loading dock steps' }).click();
    await run.getByRole('button', { name: 'Run trial' }).click();
    const bar = run.getByTestId('job-progress');
    await bar.waitFor();
    await page.waitForFunction(() => document.querySelector('[data-testid="job-progress"]')?.getAttribute('aria-valuenow') === '100', null, { timeout: 120_000 });
    await run.getByText('Trial finished').waitFor();
    await screenshot(page, 'trial-run-done-phone');
    await run.getByRole('button', { name: 'Open the trial' }).click();

    await page.waitForURL('**/trials/*');
    await page.getByRole('heading', { name: 'Burrow on Loading dock steps' }).waitFor();
    await page.getByTestId('metric-cards').waitFor();
    await page.getByTestId('stumble-timeline').waitFor();
    await page.getByText('Stumbles per 100 steps').waitFor();
    await page.getByText(/footing score = 100 · exp\(−P\)/).waitFor();
    await page.waitForTimeout(500);
    await screenshot(page, 'trial-phone');
    await page.getByRole('button', { name: 'Play' }).click();
    await page.waitForTimeout(1200);
    await page.getByRole('button', { name: 'Pause' }).click();
    await page.getByTestId('metric-cards').scrollIntoViewIfNeeded();
    await screenshot(page, 'trial-metrics-phone');
    await page.getByTestId('stumble-timeline').scrollIntoViewIfNeeded();
    await screenshot(page, 'trial-timeline-phone');
    expect((page as Page & { problems?: string[] }).problems).toEqual([]);
    await page.context().close();
  });

  it('shows the trial, the leg setup and the dial-in side by side on a wide screen', async () => {
    const page = await signedInPage(WIDE);
    const trial = await server.db('trials').where({ character_id: burrowId }).orderBy('id', 'desc').first('id');
    await page.goto(`${server.url}/trials/${trial.id}`);
    await page.getByTestId('metric-cards').waitFor().catch(async (err) => {
      await screenshot(page, 'trial-wide-failed');
      throw new Error(`${(err as Error).message}; page errors: ${(page as Page & { problems?: string[] }).problems?.join(' | ')}`);
    });
    await page.waitForTimeout(800);
    await screenshot(page, 'trial-wide');
    await page.goto(`${server.url}/characters/setup/${burrowId}`);
    await page.getByRole('heading', { name: 'Burrow: leg setup' }).waitFor();
    await page.waitForTimeout(800);
    await screenshot(page, 'leg-setup-wide');
    await page.goto(`${server.url}/characters/dial-in/${burrowId}`);
    await page.getByRole('heading', { name: 'Burrow: dial-in' }).waitFor();
    await page.getByLabel('Budget (candidates; each is a trial per course)').fill('12');
    await page.getByRole('button', { name: 'Start the dial-in' }).click();
    await page.getByTestId('dial-in-result').waitFor({ timeout: 180_000 });
    await screenshot(page, 'dial-in-wide');
    expect((page as Page & { problems?: string[] }).problems).toEqual([]);
    await page.context().close();
  });
});
