import type { Browser, BrowserContextOptions, Page } from 'playwright-core';
import { launchBrowser, screenshot } from './browser';
import { startTestServer } from './test-server';

type TestServer = Awaited<ReturnType<typeof startTestServer>>;

/**
 * One browser test file's world: the real server over a fresh demo studio, and headless chromium.
 * Registers its own beforeAll/afterAll; read `server` and `browser` inside tests, not at load time.
 */
export function e2eStudio() {
  let server: TestServer | undefined;
  let browser: Browser | undefined;
  let closeBrowser: (() => Promise<void>) | undefined;

  beforeAll(async () => {
    server = await startTestServer();
    ({ browser, close: closeBrowser } = await launchBrowser());
  });
  afterAll(async () => {
    await closeBrowser?.();
    await server?.stop();
  });

  const studio = {
    get server(): TestServer {
      if (!server) throw new Error('the test server is not up yet (use it inside a test)');
      return server;
    },
    get browser(): Browser {
      if (!browser) throw new Error('the browser is not up yet (use it inside a test)');
      return browser;
    },
    /** A page in a context of its own, failing the test on any uncaught page error. */
    async newPage(size: { width: number; height: number }, options: BrowserContextOptions = {}): Promise<Page> {
      const context = await studio.browser.newContext({ viewport: size, deviceScaleFactor: 1, ...options });
      const page = await context.newPage();
      page.on('pageerror', (err) => {
        throw err;
      });
      return page;
    },
    /** After "Create studio": the page says to check the inbox; opens the mailed link and takes its one step. */
    async finishSignUp(page: Page, email: string, shot?: string): Promise<void> {
      await page.getByRole('heading', { name: 'Check your inbox' }).waitFor();
      await page.getByText(`We sent a mail to ${email}.`, { exact: false }).waitFor();
      const mail = await studio.server.mail.waitFor((m) => m.to === email && /sign-up-confirm\//.test(m.text));
      const link = /(https?:\/\/\S+\/sign-up-confirm\/[A-Za-z0-9_-]+)/.exec(mail.text)![1];
      await page.goto(link);
      await page.getByRole('heading', { name: 'Your studio is nearly ready' }).waitFor();
      if (shot) await screenshot(page, shot);
      await page.getByRole('button', { name: 'Open my studio' }).click();
    },
    /** Signs a demo member in and waits for the studio shell. */
    async signIn(page: Page, email: string, password = 'treadle-demo'): Promise<void> {
      await page.goto(`${studio.server.url}/sign-in`);
      await page.getByLabel('E-mail').fill(email);
      await page.getByLabel('Password').fill(password);
      await page.getByRole('button', { name: 'Sign in' }).click();
      await page.getByText('Brassmoth Interactive', { exact: true }).first().waitFor();
    },
  };
  return studio;
}
