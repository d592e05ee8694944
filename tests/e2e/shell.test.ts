import type { Browser, Page } from 'playwright-core';
import { launchBrowser, PHONE, WIDE, screenshot, watchPageErrors } from '../support/browser';
import { startTestServer } from '../support/server';
import { holdTestDatabase } from '../api/setup/db-lock';
import { DEMO_ORGANISATION_NAME, DEMO_PASSWORD, DEMO_USERS, ensureDemoOrganisation } from '../../server/services/seed-demo';

let server: Awaited<ReturnType<typeof startTestServer>>;
let browser: Browser;
let releaseDatabase: (() => Promise<void>) | undefined;

beforeAll(async () => {
  releaseDatabase = await holdTestDatabase();
  server = await startTestServer(3161);
  await ensureDemoOrganisation(server.deps);
  browser = await launchBrowser();
});
afterAll(async () => {
  await releaseDatabase?.();
  await browser?.close();
  await server?.stop();
});

describe.each([
  ['phone', PHONE],
  ['wide', WIDE],
])('signed-out visitor, %s', (label, viewport) => {
  test('a signed-in page sends the visitor to the sign-in form, which renders with our fonts and no errors', async () => {
    const context = await browser.newContext({ viewport });
    const page = await context.newPage();
    const errors = watchPageErrors(page);
    await page.goto(`${server.url}/networks`);
    await page.getByTestId('sign-in-form').waitFor();
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    await expect(page.getByRole('button', { name: 'Sign in' }).isVisible()).resolves.toBe(true);
    const fontsReady = await page.evaluate(async () => {
      await document.fonts.ready;
      return document.fonts.check('16px Inter_400Regular');
    });
    expect(fontsReady).toBe(true);
    await screenshot(page, `shell-signed-out-${label}`);
    expect(errors).toEqual([]);
    await context.close();
  });
});

async function signInAsDemoOwner(page: Page) {
  const owner = DEMO_USERS.find((u) => u.role === 'owner')!;
  await page.goto(`${server.url}/sign-in`);
  await page.getByTestId('sign-in-email').fill(owner.email);
  await page.getByTestId('sign-in-password').fill(DEMO_PASSWORD);
  await page.getByTestId('sign-in-submit').click();
  await page.getByTestId('shell-header').waitFor();
  await page.waitForURL((u) => u.pathname === '/networks');
}

const DESTINATIONS = [
  ['nav-network', '/networks'],
  ['nav-runs', '/runs'],
  ['nav-team', '/team'],
  ['nav-billing', '/billing'],
  ['nav-account', '/account'],
] as const;

describe('signed-in demo owner', () => {
  test('phone 390×844: bottom bar with all five destinations, each navigable; organisation name in the header', async () => {
    const context = await browser.newContext({ viewport: PHONE });
    const page = await context.newPage();
    const errors = watchPageErrors(page);
    await signInAsDemoOwner(page);
    await expect(page.getByTestId('shell-org-name').textContent()).resolves.toBe(DEMO_ORGANISATION_NAME);
    const bar = page.getByTestId('shell-tabbar');
    await expect(bar.isVisible()).resolves.toBe(true);
    await expect(page.getByTestId('shell-rail').count()).resolves.toBe(0);
    const box = (await bar.boundingBox())!;
    expect(box.y + box.height).toBeGreaterThan(PHONE.height - 4); // at the bottom of the screen
    for (const [testId, path] of DESTINATIONS) {
      const item = bar.getByTestId(testId);
      const itemBox = (await item.boundingBox())!;
      expect(itemBox.height).toBeGreaterThanOrEqual(44); // touch target (WCAG 2.5.5, common practice)
      await item.click();
      await page.waitForURL((u) => u.pathname === path);
      await expect(item.getAttribute('aria-current')).resolves.toBe('page');
    }
    await screenshot(page, 'shell-signed-in-phone');
    expect(errors).toEqual([]);
    await context.close();
  });

  test('wide 1440×900: side rail instead of the bottom bar, same five destinations', async () => {
    const context = await browser.newContext({ viewport: WIDE });
    const page = await context.newPage();
    const errors = watchPageErrors(page);
    await signInAsDemoOwner(page);
    const rail = page.getByTestId('shell-rail');
    await expect(rail.isVisible()).resolves.toBe(true);
    await expect(page.getByTestId('shell-tabbar').count()).resolves.toBe(0);
    const box = (await rail.boundingBox())!;
    expect(box.x).toBe(0);
    expect(box.height).toBeGreaterThan(WIDE.height - 4);
    for (const [testId, path] of DESTINATIONS) {
      await rail.getByTestId(testId).click();
      await page.waitForURL((u) => u.pathname === path);
    }
    await expect(page.getByTestId('shell-org-name').textContent()).resolves.toBe(DEMO_ORGANISATION_NAME);
    await screenshot(page, 'shell-signed-in-wide');
    expect(errors).toEqual([]);
    await context.close();
  });

  test('a viewer sees no Billing destination (the UI hides what the role cannot use)', async () => {
    const context = await browser.newContext({ viewport: PHONE });
    const page = await context.newPage();
    const viewer = DEMO_USERS.find((u) => u.role === 'viewer')!;
    await page.goto(`${server.url}/sign-in`);
    await page.getByTestId('sign-in-email').fill(viewer.email);
    await page.getByTestId('sign-in-password').fill(DEMO_PASSWORD);
    await page.getByTestId('sign-in-submit').click();
    await page.getByTestId('shell-tabbar').waitFor();
    await expect(page.getByTestId('nav-billing').count()).resolves.toBe(0);
    await expect(page.getByTestId('nav-team').count()).resolves.toBe(1);
    await context.close();
  });
});
