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
    // The studio's only suite is already chosen.
    await page.getByRole('radio', { name: 'Scrapyard crossing', checked: true }).waitFor();
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
    // The plot lines walks up by where they are on the course, not by when.
    const plot = page.getByRole('img', { name: /against distance along Loading dock steps/ });
    await plot.scrollIntoViewIfNeeded();
    expect(await plot.locator('text').filter({ hasText: / m$/ }).count()).toBe(3);
    expect(await plot.locator('text').filter({ hasText: / s$/ }).count()).toBe(0);
    await screenshot(page, 'compare-phone-plot');
    await page.context().close();
  });

  it('versions of one character replace the pick, the cap says why chips are greyed, and notes are not cut (phone)', async () => {
    const { wicket, skitter, suite } = await ids();
    const page = await signedInPage(PHONE, 'artlead@brassmoth.test');
    const burrow = (await studio.server.db('characters').where({ name: 'Burrow' }).first('id')).id;
    await page.goto(`${studio.server.url}/compare?suite=${suite}&pick=c${wicket},c${skitter},c${burrow}`);
    await page.getByRole('checkbox', { name: 'Wicket', checked: true }).waitFor();
    const versions = await studio.server.db('leg_setups').where({ character_id: wicket }).orderBy('version', 'desc').select('id', 'version', 'note');
    expect(versions.length).toBe(2);
    await page.getByRole('radiogroup', { name: /versions of one character/ }).getByRole('radio', { name: 'Wicket' }).click();
    // Replaced, not added to: exactly Wicket's versions, newest first.
    await page.waitForURL((u) => u.searchParams.get('pick') === versions.map((v) => `s${v.id}`).join(','));
    expect(await page.getByRole('checkbox', { name: 'Skitter', checked: true }).count()).toBe(0);
    // Each version's whole note shows, wrapped, on its chip.
    for (const v of versions) {
      const chip = page.getByRole('checkbox', { name: `leg setup v${v.version}` });
      await chip.getByText(v.note, { exact: true }).waitFor();
    }
    await page.getByRole('table', { name: 'Metrics side by side' }).waitFor({ timeout: 60_000 });
    await page.getByRole('columnheader').filter({ hasText: `leg setup v${versions[0].version}` }).waitFor();
    await screenshot(page, 'compare-versions-phone');

    // At the cap of four the greyed chips are explained.
    await page.getByRole('checkbox', { name: 'Skitter' }).click();
    await page.getByRole('checkbox', { name: 'Burrow' }).click();
    await page.getByRole('status').filter({ hasText: '4 picked, the most one comparison shows' }).waitFor();
    const wicketChip = page.getByRole('group', { name: /^Characters/ }).getByRole('checkbox', { name: /^Wicket/ });
    expect(await wicketChip.getAttribute('aria-disabled')).toBe('true');
    await page.getByRole('status').scrollIntoViewIfNeeded();
    await screenshot(page, 'compare-cap-phone');
    await page.context().close();
  });

  it('opens a shared comparison link at desk width with the whole table', async () => {
    const { wicket, skitter, suite } = await ids();
    const page = await signedInPage(WIDE, 'artlead@brassmoth.test');
    await page.goto(`${studio.server.url}/compare?suite=${suite}&pick=c${wicket},c${skitter}`);
    await page.getByRole('table', { name: 'Metrics side by side' }).waitFor({ timeout: 60_000 });
    // Every group is shown at once on a wide screen.
    await page.getByRole('rowheader').filter({ hasText: 'Touchdown overshoot' }).waitFor();
    await page.getByRole('rowheader').filter({ hasText: /^Footing score/ }).waitFor();
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
    // Every version says what its score is of.
    await page.getByLabel('Version 2').getByText('on suite Scrapyard crossing (4 courses)', { exact: false }).waitFor();
    // The suggested commands run in a game's own repository: the one-file command is linked and served.
    const cli = page.getByRole('link', { name: 'Download the treadle command (treadle.mjs)' });
    await cli.scrollIntoViewIfNeeded();
    const href = await cli.getAttribute('href');
    expect(href).toBe('/api/cli/treadle.mjs');
    const served = await fetch(`${studio.server.url}${href}`);
    expect(served.status).toBe(200);
    expect(await served.text()).toMatch(/^#!\/usr\/bin\/env node/);
    expect(await page.getByLabel('Get the command (once, or in CI)', { exact: true }).textContent()).toBe(`curl -fsSo treadle.mjs ${studio.server.url}/api/cli/treadle.mjs`);
    expect(await page.getByLabel('Fail the build on a stumble regression', { exact: true }).textContent()).toMatch(/ node treadle\.mjs check --profile \d+ /);
    expect(await page.getByText('npm run treadle').count()).toBe(0);
    // The published setup carries no float noise (6 decimals, as the schema says).
    expect(JSON.stringify(file.legSetup).match(/\d+\.\d{7,}/g)).toBeNull();
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
