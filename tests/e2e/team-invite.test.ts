import type { Page } from 'playwright-core';
import { PHONE, WIDE, screenshot } from '../support/browser';
import { e2eStudio } from '../support/e2e';

jest.setTimeout(120_000);

const studio = e2eStudio();

const { newPage, signIn } = studio;

describe('a new member through the local inbox', () => {
  it('owner invites a programmer on a phone; the programmer opens the mail in the local inbox and joins', async () => {
    const owner = await newPage(PHONE);
    await signIn(owner, 'owner@brassmoth.test');
    await owner.getByRole('link', { name: 'Team' }).click();
    await owner.getByRole('heading', { name: 'Invite someone' }).waitFor();
    await owner.getByLabel('E-mail to invite').fill('tamsin@brassmoth.test');
    await owner.getByRole('radio', { name: 'Programmer' }).last().click();
    await owner.getByRole('button', { name: 'Send invite' }).click();
    await owner.getByText('Invite sent to tamsin@brassmoth.test', { exact: false }).waitFor();
    await owner.getByText('tamsin@brassmoth.test', { exact: true }).waitFor();
    await screenshot(owner, 'team-invite-phone');

    const inbox = await newPage(PHONE);
    await inbox.goto(studio.server.mail.inboxUrl!);
    await inbox.getByText('invited you to Brassmoth Interactive on Treadle').click();
    await screenshot(inbox, 'local-inbox-mail-phone');
    await inbox.getByRole('link', { name: /\/invite\// }).click();

    await inbox.getByRole('heading', { name: 'Join Brassmoth Interactive' }).waitFor();
    await inbox.getByLabel('Your name').fill('Tamsin Rook');
    await inbox.getByLabel('Choose a password').fill('pistons in the rain');
    await screenshot(inbox, 'accept-invite-phone');
    await inbox.getByRole('button', { name: 'Join Brassmoth Interactive' }).click();
    await inbox.getByText('Tamsin Rook · Programmer').waitFor();

    // The link worked once.
    const mail = studio.server.mail.messages().find((m) => m.to === 'tamsin@brassmoth.test')!;
    const url = mail.text.match(/http:\/\/\S+\/invite\/\S+/)![0];
    const again = await newPage(PHONE);
    await again.goto(url);
    await again.getByText('This invite link has been used, revoked or replaced.', { exact: false }).waitFor();
    await again.context().close();
    await inbox.context().close();
    await owner.context().close();
  });

  it('shows the owner the whole team page on a wide screen, and a programmer the read-only one', async () => {
    const owner = await newPage(WIDE);
    await signIn(owner, 'owner@brassmoth.test');
    await owner.goto(`${studio.server.url}/team`);
    await owner.getByRole('heading', { name: 'Who may do what' }).waitFor();
    await owner.getByRole('heading', { name: 'Team log' }).waitFor();
    await screenshot(owner, 'team-owner-wide');
    await owner.context().close();

    const programmer = await newPage(PHONE);
    await signIn(programmer, 'programmer@brassmoth.test');
    await programmer.goto(`${studio.server.url}/team`);
    await programmer.getByRole('heading', { name: 'Who may do what' }).waitFor();
    expect(await programmer.getByRole('heading', { name: 'Invite someone' }).count()).toBe(0);
    expect(await programmer.getByRole('button', { name: /Remove/ }).count()).toBe(0);
    await screenshot(programmer, 'team-programmer-phone');
    await programmer.context().close();
  });

  it('resets a forgotten password through the local inbox', async () => {
    const page = await newPage(PHONE);
    await page.goto(`${studio.server.url}/sign-in`);
    await page.getByText('Forgot your password?').click();
    await page.getByLabel('E-mail').fill('artlead@brassmoth.test');
    await page.getByRole('button', { name: 'Send reset link' }).click();
    await page.getByText('If that address has a Treadle account', { exact: false }).waitFor();
    await screenshot(page, 'reset-request-phone');
    const mail = await studio.server.mail.waitFor((m) => m.to === 'artlead@brassmoth.test');
    await page.goto(mail.text.match(/http:\/\/\S+\/reset-password\/\S+/)![0]);
    await page.getByLabel('New password').fill('scrapyard sunrise');
    await page.getByRole('button', { name: 'Set new password' }).click();
    await page.getByText('Password changed').waitFor();
    await page.context().close();
  });
});
