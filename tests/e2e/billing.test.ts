import type { Locator, Page } from 'playwright-core';
import { PHONE, WIDE, screenshot } from '../support/browser';
import { e2eStudio } from '../support/e2e';

jest.setTimeout(180_000);

const studio = e2eStudio();

async function signedInPage(size: { width: number; height: number }, email: string): Promise<Page> {
  const page = await studio.newPage(size);
  await studio.signIn(page, email);
  await page.goto(`${studio.server.url}/team/billing`);
  await page.getByRole('heading', { name: 'Billing', level: 1 }).waitFor();
  return page;
}

/** The whole box inside the viewport, as the user would see it without scrolling. */
async function expectInView(page: Page, target: Locator) {
  await target.waitFor();
  const box = (await target.boundingBox())!;
  const viewport = page.viewportSize()!;
  expect(box.y).toBeGreaterThanOrEqual(0);
  expect(box.y + box.height).toBeLessThanOrEqual(viewport.height);
}

async function fillCard(page: Page, number: string) {
  await page.getByLabel('Card number').fill(number);
  await page.getByLabel('Expiry (MM / YY)').fill('12 / 34');
  await page.getByLabel('Security code').fill('123');
  await page.getByLabel('Name on card').fill('Ottilie Brass');
}

/** The fake's page at desk width, with its refusal; it lives on the fake's origin, outside Treadle's shell. */
async function checkoutPageAtDeskWidth(url: string) {
  const context = await studio.browser.newContext({ viewport: WIDE, deviceScaleFactor: 1 });
  const page = await context.newPage();
  await page.goto(url);
  await page.getByRole('heading', { name: 'Treadle test checkout — no real money moves' }).waitFor();
  await screenshot(page, 'checkout-page-wide');
  await fillCard(page, '4000 0000 0000 0002');
  await page.getByRole('button', { name: /^Pay / }).click();
  await page.getByRole('alert').filter({ hasText: 'Your card was declined' }).waitFor();
  await screenshot(page, 'checkout-declined-wide');
  await context.close();
}

describe('the owner’s billing screen and the local checkout page', () => {
  it('upgrades the demo studio from Solo to Crew with the success card after the declined one is refused (phone)', async () => {
    const page = await signedInPage(PHONE, 'owner@brassmoth.test');
    await page.getByText('Current plan').waitFor();
    await page.getByText('no real money moves', { exact: false }).first().waitFor();
    await screenshot(page, 'billing-solo-phone');

    await page.getByRole('button', { name: 'Upgrade to Crew' }).click();
    await page.waitForURL(`${studio.server.paymentsUrl}/pay/**`);
    await page.getByRole('heading', { name: 'Treadle test checkout — no real money moves' }).waitFor();
    await screenshot(page, 'checkout-page-phone');
    await checkoutPageAtDeskWidth(page.url());

    // 4000 0000 0000 0002: the provider's published test card for a generic decline (Stripe docs, "Testing").
    await fillCard(page, '4000 0000 0000 0002');
    await page.getByRole('button', { name: /^Pay / }).click();
    await page.getByRole('alert').filter({ hasText: 'Your card was declined' }).waitFor();
    expect(await page.getByLabel('Card number').inputValue()).toBe('');
    await screenshot(page, 'checkout-declined-phone');

    // 4242 4242 4242 4242: the provider's published test card that always succeeds (Stripe docs, "Testing").
    await fillCard(page, '4242 4242 4242 4242');
    await page.getByRole('button', { name: /^Pay / }).click();
    await page.waitForURL(`${studio.server.url}/team/billing?checkout=done**`);
    await page.getByText('Payment received: the studio is on Crew.').waitFor();
    await page.getByText('Crew (monthly)').waitFor();
    await screenshot(page, 'billing-crew-phone');
    await page.getByText('Invoices', { exact: true }).scrollIntoViewIfNeeded();
    await screenshot(page, 'billing-invoices-phone');

    // A plan change asks first, and the question opens where it can be read: on a phone the plan cards run
    // below the fold, so the confirmation must come into view with both its buttons.
    await page.getByRole('button', { name: 'Upgrade to Studio' }).click();
    await expectInView(page, page.getByLabel('Studio plan').getByRole('group', { name: 'Confirm' }));
    await screenshot(page, 'billing-confirm-upgrade-phone');
    await page.getByRole('button', { name: 'Keep Crew' }).click();

    // Cancelling asks first and says what happens and when; keeping the plan changes nothing.
    await page.getByRole('button', { name: 'Cancel subscription' }).click();
    await page.getByRole('group', { name: 'Confirm' }).getByText(/stays until .*then the studio moves to the free Solo plan/).waitFor();
    await screenshot(page, 'billing-confirm-cancel-phone');
    await page.getByRole('button', { name: 'Keep Crew' }).click();
    await page.getByRole('button', { name: 'Cancel subscription' }).waitFor();
    await page.context().close();
  });

  it('upgrades to Studio, then cancels at the period end, on a wide screen', async () => {
    const page = await signedInPage(WIDE, 'owner@brassmoth.test');
    await page.getByText('Active · renews on', { exact: false }).waitFor();
    await screenshot(page, 'billing-crew-wide');
    await page.getByRole('button', { name: 'Upgrade to Studio' }).click();
    await page.getByText('charged straight away', { exact: false }).waitFor();
    await expectInView(page, page.getByLabel('Studio plan').getByRole('group', { name: 'Confirm' }));
    await screenshot(page, 'billing-confirm-upgrade-wide');
    await page.getByRole('button', { name: 'Move to Studio' }).click();
    await page.getByLabel('Studio plan').getByText('Current').waitFor();

    await page.getByRole('button', { name: 'Cancel subscription' }).click();
    await page.getByRole('group', { name: 'Confirm' }).getByText(/stays until .*then the studio moves to the free Solo plan/).waitFor();
    await screenshot(page, 'billing-confirm-cancel-wide');
    await page.getByRole('button', { name: 'Cancel at period end' }).click();
    await page.getByText(/Ends on .*, then Solo/).waitFor();
    await screenshot(page, 'billing-cancelling-wide');
    await page.context().close();
  });

  it('shows other roles the plan name only', async () => {
    const page = await signedInPage(PHONE, 'designer@brassmoth.test');
    const answer = await (await page.request.get(`${studio.server.url}/api/billing`)).json();
    expect(answer).toEqual({ view: 'member', plan: { id: expect.any(String), name: expect.any(String) } });
    await page.getByText('The studio is on the').waitFor();
    await page.getByText(answer.plan.name, { exact: true }).first().waitFor();
    expect(await page.getByText('Invoices', { exact: true }).count()).toBe(0);
    expect(await page.getByRole('button', { name: /Upgrade|Cancel/ }).count()).toBe(0);
    await screenshot(page, 'billing-member-phone');
    await page.context().close();
  });
});
