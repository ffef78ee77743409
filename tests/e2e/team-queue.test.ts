/**
 * The owner's queue section on the Team screen: on the embedded pool it says the work runs inside the server
 * and shows the thread count and task figures as numbers; other roles do not get the section. The figures
 * come from GET /api/queue (tests/server/jobs-queue-status.test.ts checks them against the jobs started).
 */
import { PHONE, WIDE, screenshot } from '../support/browser';
import { e2eStudio } from '../support/e2e';

jest.setTimeout(120_000);

const studio = e2eStudio();
const { newPage, signIn } = studio;

describe('where trials and dial-ins run', () => {
  it('shows the owner the threads and tasks, on a phone and a wide screen', async () => {
    for (const [size, name] of [[PHONE, 'team-queue-phone'], [WIDE, 'team-queue-wide']] as const) {
      const owner = await newPage(size);
      await signIn(owner, 'owner@brassmoth.test');
      await owner.goto(`${studio.server.url}/team`);
      await owner.getByRole('heading', { name: 'Where trials and dial-ins run' }).waitFor();
      const card = owner.getByTestId('queue-status');
      await card.getByText('Inside the server, on its own threads.', { exact: false }).waitFor();
      const threads = await card.getByLabel(/^threads: /).getAttribute('aria-label');
      expect(threads).toMatch(/^threads: [1-9]\d*$/);
      for (const label of ['tasks waiting', 'tasks running', 'your jobs queued', 'your jobs running']) {
        expect(await card.getByLabel(new RegExp(`^${label}: `)).getAttribute('aria-label')).toMatch(new RegExp(`^${label}: \\d+$`));
      }
      await card.scrollIntoViewIfNeeded();
      await screenshot(owner, name);
      await owner.context().close();
    }
  });

  it('is not shown to a programmer', async () => {
    const programmer = await newPage(PHONE);
    await signIn(programmer, 'programmer@brassmoth.test');
    await programmer.goto(`${studio.server.url}/team`);
    await programmer.getByRole('heading', { name: 'Who may do what' }).waitFor();
    expect(await programmer.getByRole('heading', { name: 'Where trials and dial-ins run' }).count()).toBe(0);
    await programmer.context().close();
  });
});
