/**
 * Signed out is a state, not an error: loading the app without a session asks GET /api/me/session, which answers
 * 200 { signedIn: false }, so the browser console stays free of failed requests (a 401 is logged by chromium as
 * "Failed to load resource"). Signing in then flips the same probe.
 */
import type { ConsoleMessage, Page, Response } from 'playwright-core';
import { PHONE, WIDE, screenshot } from '../support/browser';
import { e2eStudio } from '../support/e2e';

jest.setTimeout(120_000);

const studio = e2eStudio();

function watch(page: Page) {
  const errors: string[] = [];
  const unauthorized: string[] = [];
  page.on('console', (m: ConsoleMessage) => {
    if (m.type() === 'error') errors.push(m.text());
  });
  page.on('response', (r: Response) => {
    if (r.status() === 401) unauthorized.push(r.url());
  });
  return { errors, unauthorized };
}

describe('a signed-out load', () => {
  it.each([
    ['phone', PHONE],
    ['wide', WIDE],
  ] as const)('logs no console error and asks no question answered 401 (%s)', async (name, size) => {
    const page = await studio.newPage(size);
    const seen = watch(page);
    const probe = page.waitForResponse((r) => r.url().endsWith('/api/me/session'));
    await page.goto(`${studio.server.url}/characters`);
    const answer = await probe;
    expect(answer.status()).toBe(200);
    expect(await answer.json()).toEqual({ signedIn: false });
    await page.waitForURL('**/sign-in');
    await page.getByText('Sign in to your studio').waitFor();
    await screenshot(page, `signed-out-${name}`);
    expect(seen.unauthorized).toEqual([]);
    expect(seen.errors).toEqual([]);

    // The same probe after signing in names the viewer.
    await studio.signIn(page, 'designer@brassmoth.test');
    const state = await (await page.request.get(`${studio.server.url}/api/me/session`)).json();
    expect(state).toMatchObject({ signedIn: true, me: { user: { email: 'designer@brassmoth.test' }, role: 'designer' } });
    expect(seen.errors).toEqual([]);
    await page.context().close();
  });
});
