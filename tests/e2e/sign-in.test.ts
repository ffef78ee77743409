import type { Page } from 'playwright-core';
import { PHONE, WIDE, screenshot } from '../support/browser';
import { e2eStudio } from '../support/e2e';

jest.setTimeout(120_000);

const studio = e2eStudio();

const newPage = studio.newPage;

async function signIn(page: Page, email: string, password: string) {
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

describe('signing up, out and in', () => {
  it('takes a new studio from sign-up into the shell, out, and back in as the seeded designer (phone)', async () => {
    const page = await newPage(PHONE);
    await page.goto(`${studio.server.url}/`);
    await page.waitForURL('**/sign-in');
    await page.getByText('Sign in to your studio').waitFor();
    await screenshot(page, 'sign-in-phone');

    // Bad input first: the schema's field messages appear beside the fields.
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByText('Enter your e-mail address.').waitFor();

    await page.getByText('Set up a studio').click();
    await page.waitForURL('**/sign-up');
    await page.getByLabel('Your name').fill('Nell Sprocket');
    await page.getByLabel('Studio name').fill('Sprocket Yard');
    await page.getByLabel('E-mail').fill('nell@sprocket.test');
    await page.getByLabel('Password').fill('short');
    await page.getByRole('button', { name: 'Create studio' }).click();
    await page.getByText('Use at least 8 characters.').waitFor();
    await screenshot(page, 'sign-up-errors-phone');
    await page.getByLabel('Password').fill('a walk over scrap rubble');
    await page.getByRole('button', { name: 'Create studio' }).click();
    // The answer is the same for every address; the way on is the link in the mail.
    await page.getByRole('heading', { name: 'Check your inbox' }).waitFor();
    await screenshot(page, 'sign-up-check-inbox-phone');
    await studio.finishSignUp(page, 'nell@sprocket.test', 'sign-up-confirm-phone');

    await page.getByText('Sprocket Yard', { exact: true }).waitFor();
    await page.getByRole('heading', { name: 'Home' }).waitFor();
    await screenshot(page, 'home-phone');

    await page.getByRole('link', { name: 'Courses' }).click();
    await page.waitForURL('**/courses');
    await page.getByRole('heading', { name: 'Courses' }).waitFor();

    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL('**/sign-in');

    await signIn(page, 'designer@brassmoth.test', 'wrong password');
    await page.getByText('Wrong e-mail or password.').waitFor();
    await signIn(page, 'designer@brassmoth.test', 'treadle-demo');
    await page.getByText('Brassmoth Interactive', { exact: true }).waitFor();
    await page.getByText('Dario Moth · Designer').waitFor();
    await page.context().close();
  });

  it('says the same for an address that already has an account, and mails that address a notice (wide)', async () => {
    const page = await newPage(WIDE);
    await page.goto(`${studio.server.url}/sign-up`);
    await page.getByLabel('Your name').fill('Dario Moth');
    await page.getByLabel('Studio name').fill('Second Yard');
    await page.getByLabel('E-mail').fill('designer@brassmoth.test');
    await page.getByLabel('Password').fill('a walk over scrap rubble');
    await page.getByRole('button', { name: 'Create studio' }).click();
    await page.getByRole('heading', { name: 'Check your inbox' }).waitFor();
    await page.getByText('We sent a mail to designer@brassmoth.test.', { exact: false }).waitFor();
    expect(await page.getByText(/already/i).count()).toBe(0);
    await screenshot(page, 'sign-up-check-inbox-wide');
    const notice = await studio.server.mail.waitFor((m) => m.to === 'designer@brassmoth.test' && /already has an account/.test(m.text));
    expect(notice.text).not.toMatch(/sign-up-confirm/);
    await page.context().close();
  });

  it.each([
    ['owner@brassmoth.test', 'Owner'],
    ['programmer@brassmoth.test', 'Programmer'],
    ['artlead@brassmoth.test', 'Art lead'],
  ])('lets %s in on a wide screen, through every section by the side rail', async (email, roleLabel) => {
    const page = await newPage(WIDE);
    await page.goto(`${studio.server.url}/characters`);
    await page.waitForURL('**/sign-in');
    await signIn(page, email, 'treadle-demo');
    await page.getByText(new RegExp(`· ${roleLabel}$`)).waitFor();
    for (const section of ['Characters', 'Courses', 'Compare', 'Profiles', 'Team', 'Home']) {
      await page.getByRole('navigation').getByRole('link', { name: section }).click();
      await page.getByRole('heading', { name: section, level: 1 }).waitFor();
    }
    if (roleLabel === 'Owner') await screenshot(page, 'home-wide');
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL('**/sign-in');
    if (roleLabel === 'Owner') await screenshot(page, 'sign-in-wide');
    await page.context().close();
  });

  it('opens a deep link typed into the address bar once signed in', async () => {
    const page = await newPage(PHONE);
    await page.goto(`${studio.server.url}/sign-in`);
    await signIn(page, 'designer@brassmoth.test', 'treadle-demo');
    await page.getByText('Brassmoth Interactive', { exact: true }).waitFor();
    await page.goto(`${studio.server.url}/profiles`);
    await page.getByRole('heading', { name: 'Profiles', level: 1 }).waitFor();
    await screenshot(page, 'profiles-phone');
    await page.context().close();
  });
});
