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

describe('roles, with a second step and never an ownerless studio', () => {
  const roleOf = async (email: string) =>
    (await studio.server.db('memberships as m').join('users as u', 'u.id', 'm.user_id').where('u.email', email).first('m.role')).role as string;

  it('asks before changing a role, keeps the only owner, and the server refuses demoting them too (phone, then wide)', async () => {
    const owner = await newPage(PHONE);
    await signIn(owner, 'owner@brassmoth.test');
    await owner.goto(`${studio.server.url}/team`);
    const dario = owner.getByLabel('Member Dario Moth');
    await dario.getByRole('radio', { name: 'Programmer' }).click();
    const confirm = owner.getByRole('group', { name: 'Confirm the role change of Dario Moth' });
    await confirm.getByText('from Designer to Programmer?', { exact: false }).waitFor();
    await screenshot(owner, 'team-role-confirm-phone');
    // One tap changed nothing yet.
    expect(await roleOf('designer@brassmoth.test')).toBe('designer');
    await confirm.getByRole('button', { name: 'Keep the role' }).click();
    expect(await confirm.count()).toBe(0);
    expect(await dario.getByRole('radio', { name: 'Designer' }).getAttribute('aria-checked')).toBe('true');
    expect(await roleOf('designer@brassmoth.test')).toBe('designer');

    await dario.getByRole('radio', { name: 'Art lead' }).click();
    await confirm.getByRole('button', { name: 'Make Dario Art lead' }).click();
    await confirm.waitFor({ state: 'detached' });
    await dario.getByRole('radio', { name: 'Art lead', checked: true }).waitFor();
    expect(await roleOf('designer@brassmoth.test')).toBe('art_lead');
    // Back as it was, for the other tests.
    await dario.getByRole('radio', { name: 'Designer' }).click();
    await confirm.getByRole('button', { name: 'Make Dario Designer' }).click();
    await dario.getByRole('radio', { name: 'Designer', checked: true }).waitFor();
    expect(await roleOf('designer@brassmoth.test')).toBe('designer');

    // The only owner's own row offers neither a role change nor leaving, and says why.
    const self = owner.getByLabel('Member Ottilie Brass');
    await self.getByText("You are the studio's only owner", { exact: false }).waitFor();
    expect(await self.getByRole('radio').count()).toBe(0);
    expect(await self.getByRole('button').count()).toBe(0);
    await self.scrollIntoViewIfNeeded();
    await screenshot(owner, 'team-only-owner-phone');

    // And the server: the same browser session asking directly is refused with the reason, and nothing changes.
    const ownerId = (await studio.server.db('users').where({ email: 'owner@brassmoth.test' }).first('id')).id;
    // The page's own request context: its session cookie, and its origin as a browser would send it.
    const headers = { Origin: studio.server.url };
    const demote = await owner.request.patch(`${studio.server.url}/api/team/members/${ownerId}`, { data: { role: 'designer' }, headers });
    expect(demote.status()).toBe(409);
    expect((await demote.json()).error.message).toMatch(/at least one owner/);
    const leave = await owner.request.delete(`${studio.server.url}/api/team/members/${ownerId}`, { headers });
    expect(leave.status()).toBe(409);
    expect(await roleOf('owner@brassmoth.test')).toBe('owner');
    await owner.context().close();

    const wide = await newPage(WIDE);
    await signIn(wide, 'owner@brassmoth.test');
    await wide.goto(`${studio.server.url}/team`);
    await wide.getByLabel('Member Priya Kettle').getByRole('radio', { name: 'Owner' }).click();
    await wide.getByRole('group', { name: 'Confirm the role change of Priya Kettle' }).getByText('manage members, the plan and billing', { exact: false }).waitFor();
    await screenshot(wide, 'team-role-confirm-wide');
    await wide.getByRole('button', { name: 'Keep the role' }).click();
    expect(await roleOf('programmer@brassmoth.test')).toBe('programmer');
    await wide.context().close();
  });
});
