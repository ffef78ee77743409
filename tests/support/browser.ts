import fs from 'node:fs';
import path from 'node:path';
import { chromium, type Browser, type Page } from 'playwright-core';

export const PHONE = { width: 390, height: 844 } as const;
export const WIDE = { width: 1440, height: 900 } as const;
export const SCREENSHOT_DIR = path.resolve(__dirname, '..', '..', 'test-results', 'screenshots');

const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';

/**
 * Debian's chromium, headless, with the flags that work as root on this kind of machine.
 * Playwright gives every launch a fresh, empty profile directory of its own.
 */
export async function launchBrowser(): Promise<{ browser: Browser; close(): Promise<void> }> {
  if (!fs.existsSync(CHROMIUM)) throw new Error(`No chromium at ${CHROMIUM}: install it with apt-get install -y chromium (see .ci/run).`);
  const browser = await chromium.launch({
    executablePath: CHROMIUM,
    headless: true,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
  return {
    browser,
    close: () => browser.close(),
  };
}

export async function screenshot(page: Page, name: string): Promise<string> {
  fs.mkdirSync(SCREENSHOT_DIR, { recursive: true });
  const file = path.join(SCREENSHOT_DIR, `${name}.png`);
  await page.screenshot({ path: file, fullPage: false });
  return file;
}
