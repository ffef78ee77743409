/**
 * The art lead compares two demo characters on a phone; the programmer opens a leg profile, sees what changed
 * between versions and downloads the JSON, which must validate against the served JSON Schema (ajv, draft
 * 2020-12). Screenshots at 390×844 and 1440×900.
 */
import fs from 'node:fs';
import Ajv2020 from 'ajv/dist/2020';
import type { Page } from 'playwright-core';
import { PHONE, WIDE, screenshot } from '../support/browser';
import { e2eStudio } from '../support/e2e';

jest.setTimeout(240_000);

const studio = e2eStudio();

async function signedInPage(size: { width: number; height: number }, email: string): Promise<Page> {
  const page = await studio.newPage(size, { acceptDownloads: true });
  await studio.signIn(page, email);
  return page;
}

async function ids() {
  const chars = await studio.server.db('characters').select('id', 'name');
  const id = (name: string) => chars.find((c: { name: string }) => c.name === name).id as number;
  const suite = await studio.server.db('suites').where({ name: 'Scrapyard crossing' }).first('id');
  const profile = await studio.server.db('profiles').where({ character_id: id('Wicket') }).first('id');
  return { wicket: id('Wicket'), skitter: id('Skitter'), suite: suite.id as number, wicketProfile: profile.id as number };
}

describe('compare', () => {
  it('the art lead picks a suite and two characters on a phone; the choice lands in the URL and the table marks the best', async () => {
    const page = await signedInPage(PHONE, 'artlead@brassmoth.test');
    await page.goto(`${studio.server.url}/compare`);
    await page.getByRole('heading', { name: 'Compare', level: 1 }).waitFor();
    await page.getByRole('radio', { name: 'Scrapyard crossing' }).click();
    await page.getByRole('checkbox', { name: 'Wicket' }).click();
    await page.getByRole('checkbox', { name: 'Skitter' }).click();
    await page.getByRole('table', { name: 'Metrics side by side' }).waitFor({ timeout: 60_000 });
    const { wicket, skitter, suite } = await ids();
    const url = new URL(page.url());
    expect(url.searchParams.get('suite')).toBe(String(suite));
    expect(url.searchParams.get('pick')).toBe(`c${wicket},c${skitter}`);
    expect(await page.getByText('★', { exact: false }).count()).toBeGreaterThan(0);
    await screenshot(page, 'compare-phone-score');
    await page.getByRole('radio', { name: 'Stumbles per 100 steps' }).click();
    await page.getByRole('rowheader').filter({ hasText: 'reach-miss' }).waitFor();
    await screenshot(page, 'compare-phone-stumbles');
    await page.getByRole('img', { name: /over time on/ }).scrollIntoViewIfNeeded();
    await screenshot(page, 'compare-phone-plot');
    await page.context().close();
  });

  it('opens a shared comparison link at desk width with the whole table', async () => {
    const { wicket, skitter, suite } = await ids();
    const page = await signedInPage(WIDE, 'artlead@brassmoth.test');
    await page.goto(`${studio.server.url}/compare?suite=${suite}&pick=c${wicket},c${skitter}`);
    await page.getByRole('table', { name: 'Metrics side by side' }).waitFor({ timeout: 60_000 });
    // Every group is shown at once on a wide screen.
    await page.getByRole('rowheader').filter({ hasText: 'Touchdown overshoot' }).waitFor();
    await page.getByRole('rowheader').filter({ hasText: 'Footing score' }).waitFor();
    await screenshot(page, 'compare-wide');
    await page.context().close();
  });
});

describe('profiles', () => {
  it('the programmer sees the versions, what changed, and downloads a profile JSON that validates against the schema (phone)', async () => {
    const { wicketProfile } = await ids();
    const page = await signedInPage(PHONE, 'programmer@brassmoth.test');
    await page.goto(`${studio.server.url}/profiles`);
    await page.getByRole('link', { name: 'Open the leg profile of Wicket' }).click();
    await page.getByRole('heading', { name: 'Wicket leg profile', level: 1 }).waitFor();
    await page.getByText('solver.lambda').waitFor();
    await screenshot(page, 'profile-phone');
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: 'Download Wicket version 2 as JSON' }).click()]);
    expect(download.suggestedFilename()).toBe('wicket-v2.leg-profile.json');
    const file = JSON.parse(fs.readFileSync((await download.path())!, 'utf8'));
    expect(file.version).toBe(2);
    expect(file.profileId).toBe(wicketProfile);
    const schema = await (await fetch(`${studio.server.url}/api/schema/leg-profile.json`)).json();
    const ajv = new Ajv2020({ strict: true });
    // RFC 3339 §5.6 date-time.
    ajv.addFormat('date-time', /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}(\.\d+)?(Z|[+-]\d{2}:\d{2})$/);
    expect(ajv.validate(schema, file)).toBe(true);
    await page.getByText('Use it in a build').scrollIntoViewIfNeeded();
    await screenshot(page, 'profile-phone-build');
    await page.context().close();
  });

  it('at desk width: the list, the profile page, and a token made once and revoked', async () => {
    const page = await signedInPage(WIDE, 'programmer@brassmoth.test');
    await page.goto(`${studio.server.url}/profiles`);
    await page.getByRole('link', { name: 'Open the leg profile of Skitter' }).waitFor();
    await screenshot(page, 'profiles-wide');
    await page.getByRole('link', { name: 'Open the leg profile of Wicket' }).click();
    await page.getByText('solver.lambda').waitFor();
    await screenshot(page, 'profile-wide');
    await page.getByRole('link', { name: 'Manage API tokens' }).click();
    await page.getByRole('heading', { name: 'API tokens', level: 1 }).waitFor();
    await page.getByLabel('Name', { exact: true }).fill('CI build');
    await page.getByRole('button', { name: 'Create token' }).click();
    await page.getByText('it is shown only this once').waitFor();
    const secret = (await page.getByLabel('API token', { exact: true }).textContent())!.trim();
    expect(secret).toMatch(/^tdl_/);
    await screenshot(page, 'tokens-wide-created');
    const res = await fetch(`${studio.server.url}/api/v1/characters`, { headers: { Authorization: `Bearer ${secret}` } });
    expect(res.status).toBe(200);
    await page.getByRole('button', { name: 'I have stored it' }).click();
    await page.getByRole('button', { name: 'Revoke CI build', exact: true }).click();
    await page.getByRole('button', { name: 'Revoke CI build now' }).click();
    await page.getByText(/Revoked/).waitFor();
    expect((await fetch(`${studio.server.url}/api/v1/characters`, { headers: { Authorization: `Bearer ${secret}` } })).status).toBe(401);
    await screenshot(page, 'tokens-wide-revoked');
    await page.context().close();
  });

  it('tokens on a phone', async () => {
    const page = await signedInPage(PHONE, 'owner@brassmoth.test');
    await page.goto(`${studio.server.url}/tokens`);
    await page.getByRole('heading', { name: 'API tokens', level: 1 }).waitFor();
    await page.getByText('No tokens yet.').or(page.getByRole('list', { name: 'API tokens' })).first().waitFor();
    await screenshot(page, 'tokens-phone');
    await page.context().close();
  });
});
