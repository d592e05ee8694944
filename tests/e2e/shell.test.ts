import type { Browser } from 'playwright-core';
import { launchBrowser, PHONE, WIDE, screenshot, watchPageErrors } from '../support/browser';
import { startTestServer } from '../support/server';

let server: Awaited<ReturnType<typeof startTestServer>>;
let browser: Browser;

beforeAll(async () => {
  server = await startTestServer(3151);
  browser = await launchBrowser();
});
afterAll(async () => {
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
