import type { Browser } from 'playwright-core';
import { launchBrowser, PHONE } from '../support/browser';
import { startTestServer } from '../support/server';
import { holdTestDatabase } from '../api/setup/db-lock';
import { DEMO_PASSWORD, DEMO_USERS, ensureDemoOrganisation } from '../../server/services/seed-demo';
import { ensureDemoNetworks } from '../../server/services/demo-networks';

let server: Awaited<ReturnType<typeof startTestServer>>;
let browser: Browser;
let releaseDatabase: (() => Promise<void>) | undefined;
let networkId: number;

beforeAll(async () => {
  releaseDatabase = await holdTestDatabase();
  server = await startTestServer(3152);
  const { organisationId } = await ensureDemoOrganisation(server.deps);
  await ensureDemoNetworks(server.deps, organisationId);
  const row = await server.deps.models.Network.findOne({ where: { organisationId }, order: [['id', 'ASC']] });
  networkId = Number(row!.get('id'));
  browser = await launchBrowser();
});
afterAll(async () => {
  await releaseDatabase?.();
  await browser?.close();
  await server?.stop();
});

test('a signed-out visitor who opens a shared link lands on that page after signing in', async () => {
  const context = await browser.newContext({ viewport: PHONE });
  const page = await context.newPage();
  await page.goto(`${server.url}/networks/${networkId}`);
  await page.getByTestId('sign-in-form').waitFor();
  const dispatcher = DEMO_USERS.find((u) => u.role === 'dispatcher')!;
  await page.getByTestId('sign-in-email').fill(dispatcher.email);
  await page.getByTestId('sign-in-password').fill(DEMO_PASSWORD);
  await page.getByTestId('sign-in-submit').click();
  await page.waitForURL(`**/networks/${networkId}`);
  expect(new URL(page.url()).pathname).toBe(`/networks/${networkId}`);
  await context.close();
});
