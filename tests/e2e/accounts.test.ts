import type { Browser } from 'playwright-core';
import { launchBrowser, PHONE, WIDE, screenshot, watchPageErrors } from '../support/browser';
import { startTestServer } from '../support/server';
import { holdTestDatabase } from '../api/setup/db-lock';
import { startMailCatcher, type MailCatcher } from '../../server/fakes/mail/mail-catcher';

let server: Awaited<ReturnType<typeof startTestServer>>;
let browser: Browser;
let releaseDatabase: (() => Promise<void>) | undefined;
let mail: MailCatcher;

beforeAll(async () => {
  releaseDatabase = await holdTestDatabase();
  mail = await startMailCatcher({ smtpPort: 1026 });
  server = await startTestServer(3162);
  browser = await launchBrowser();
});
afterAll(async () => {
  await releaseDatabase?.();
  await browser?.close();
  await server?.stop();
  await mail?.close();
});

const tag = `${Date.now().toString(36)}`;
const founder = { name: 'Wren Alder', email: `wren.${tag}@brackwater-e2e.example`, password: 'moorland-signal-77', org: `Brackwater Parcels ${tag}` };
const colleague = { name: 'Juno Pell', email: `juno.${tag}@brackwater-e2e.example`, password: 'estuary-lamp-post-5' };

test('phone: sign up, invite a colleague, the colleague accepts from the e-mail in a second browser, and appears in the team list', async () => {
  const first = await browser.newContext({ viewport: PHONE });
  const page = await first.newPage();
  const errors = watchPageErrors(page);

  // Sign up.
  await page.goto(`${server.url}/sign-up`);
  await page.getByTestId('sign-up-name').fill(founder.name);
  await page.getByTestId('sign-up-organisation').fill(founder.org);
  await page.getByTestId('sign-up-email').fill(founder.email);
  await page.getByTestId('sign-up-password').fill('short');
  await page.getByTestId('sign-up-submit').click();
  await page.getByText('Use at least 10 characters').waitFor(); // the field error beside the field
  await page.getByTestId('sign-up-password').fill(founder.password);
  await screenshot(page, 'accounts-sign-up-phone');
  await page.getByTestId('sign-up-submit').click();
  await page.waitForURL((u) => u.pathname === '/networks');
  await expect(page.getByTestId('shell-org-name').textContent()).resolves.toBe(founder.org);

  // Invite.
  await page.getByTestId('nav-team').click();
  await page.getByTestId('invite-form').waitFor();
  await page.getByTestId('invite-email').fill(colleague.email);
  await page.getByTestId('invite-role-analyst').click();
  await page.getByTestId('invite-submit').click();
  await page.getByTestId('invite-sent').waitFor();
  await page.getByTestId(`invitation-${colleague.email}`).waitFor();
  await screenshot(page, 'accounts-team-invited-phone');

  // The e-mail, from the SMTP fake.
  const m = await mail.waitFor((x) => x.to.includes(colleague.email));
  const link = m.text.match(/https?:\/\/\S+\/invite\?token=\S+/)![0];
  expect(link.startsWith(server.url)).toBe(true);

  // A second browser context: the colleague opens the link and creates an account.
  const second = await browser.newContext({ viewport: PHONE });
  const other = await second.newPage();
  const otherErrors = watchPageErrors(other);
  await other.goto(link);
  await other.getByTestId('invite-accept').waitFor();
  await expect(other.getByText(founder.org).first().isVisible()).resolves.toBe(true);
  await other.getByTestId('invite-name').fill(colleague.name);
  await other.getByTestId('invite-password').fill(colleague.password);
  await screenshot(other, 'accounts-invite-accept-phone');
  await other.getByTestId('invite-submit').click();
  await other.waitForURL((u) => u.pathname === '/networks');
  await expect(other.getByTestId('shell-org-name').textContent()).resolves.toBe(founder.org);
  // An analyst sees the team but not the invite form or the Billing destination.
  await other.getByTestId('nav-team').click();
  await other.getByTestId('members-list').waitFor();
  await expect(other.getByTestId('invite-form').count()).resolves.toBe(0);
  await expect(other.getByTestId('nav-billing').count()).resolves.toBe(0);

  // Back to the founder: the colleague is a member now, with the invited role.
  await page.reload();
  const row = page.getByTestId(`member-${colleague.email}`);
  await row.waitFor();
  await expect(row.getByText('Analyst').isVisible()).resolves.toBe(true);
  await expect(page.getByTestId(`invitation-${colleague.email}`).count()).resolves.toBe(0);
  await screenshot(page, 'accounts-team-joined-phone');

  await page.getByTestId('nav-account').click();
  await page.getByTestId('tokens-panel').waitFor();
  await screenshot(page, 'accounts-account-phone');
  await page.getByTestId('nav-team').click();
  await page.getByTestId('open-audit').click();
  await page.getByTestId('audit-row').first().waitFor();
  await screenshot(page, 'accounts-audit-phone');
  await page.getByTestId('nav-team').click();
  await page.getByTestId(`member-${colleague.email}`).waitFor();

  // Remove asks first (inline), and Cancel leaves everything as it was.
  await page.getByTestId(`member-remove-${colleague.email}`).click();
  await page.getByTestId('confirm-remove-member').waitFor();
  await screenshot(page, 'accounts-team-remove-confirm-phone');
  await page.getByTestId('confirm-remove-member-cancel').click();
  await expect(page.getByTestId(`member-${colleague.email}`).isVisible()).resolves.toBe(true);

  expect(errors).toEqual([]);
  expect(otherErrors).toEqual([]);
  await first.close();
  await second.close();
});

test('wide: the team is a table; the account screen creates an API token shown once; audit log lists events', async () => {
  const context = await browser.newContext({ viewport: WIDE });
  const page = await context.newPage();
  const errors = watchPageErrors(page);
  await page.goto(`${server.url}/sign-in`);
  await page.getByTestId('sign-in-email').fill(founder.email);
  await page.getByTestId('sign-in-password').fill(founder.password);
  await page.getByTestId('sign-in-submit').click();
  await page.waitForURL((u) => u.pathname === '/networks');
  await page.getByTestId('nav-team').click();
  await page.getByTestId('members-table').waitFor();
  await page.getByTestId(`member-${colleague.email}`).waitFor();
  await screenshot(page, 'accounts-team-wide');

  await page.getByTestId('open-audit').click();
  await page.getByTestId('audit-screen').waitFor();
  await page.getByTestId('audit-row').first().waitFor();
  await expect(page.getByText(`invited ${colleague.email} as Analyst`).isVisible()).resolves.toBe(true);
  await screenshot(page, 'accounts-audit-wide');

  await page.getByTestId('nav-account').click();
  await page.getByTestId('tokens-panel').waitFor();
  await page.getByTestId('token-name').fill('Yard scanner bridge');
  await page.getByTestId('token-create').click();
  const secret = await page.getByTestId('token-secret').textContent();
  expect(secret).toMatch(/^spy_/);
  await page.getByTestId('token-Yard scanner bridge').waitFor();
  await screenshot(page, 'accounts-account-token-wide');
  // The secret works as a Bearer token for the same organisation.
  const me = await fetch(`${server.url}/api/auth/me`, { headers: { authorization: `Bearer ${secret}` } });
  expect(me.status).toBe(200);
  expect(((await me.json()) as { current: { name: string } }).current.name).toBe(founder.org);
  // After a reload the secret is gone from the page; only its prefix is listed.
  await page.reload();
  await page.getByTestId('token-Yard scanner bridge').waitFor();
  await expect(page.getByTestId('token-secret').count()).resolves.toBe(0);

  // A second organisation: the header offers a switcher, and switching changes the header.
  const user = await server.deps.models.User.findOne({ where: { email: founder.email } });
  const second = await server.deps.models.Organisation.create({ name: `Saltmarsh Couriers ${tag}`, plan: 'free' });
  await server.deps.models.Membership.create({ organisationId: second.id, userId: user!.id, role: 'viewer' });
  await page.reload();
  await page.getByTestId('org-switcher').click();
  await page.getByTestId('org-switcher-menu').waitFor();
  await screenshot(page, 'accounts-org-switcher-wide');
  await page.getByRole('menuitem', { name: /Saltmarsh Couriers/ }).click();
  await page.waitForURL((u) => u.pathname === '/networks');
  await page.waitForFunction((name) => document.querySelector('[data-testid="shell-org-name"]')?.textContent === name, second.name);
  await expect(page.getByTestId('nav-billing').count()).resolves.toBe(0); // viewer there

  await page.getByTestId('nav-account').click();
  await page.getByTestId('sign-out').click();
  await page.waitForURL((u) => u.pathname === '/sign-in');
  expect(errors).toEqual([]);
  await context.close();
});

test('phone: a used or expired reset link shows a clear page with a way to ask again', async () => {
  const context = await browser.newContext({ viewport: PHONE });
  const page = await context.newPage();
  await page.goto(`${server.url}/reset?token=this-token-was-never-issued-000000`);
  await page.getByTestId('reset-password').fill('a-brand-new-lantern-4');
  await page.getByTestId('reset-repeat').fill('a-brand-new-lantern-4');
  await page.getByTestId('reset-confirm-submit').click();
  await page.getByTestId('reset-request-form').waitFor();
  await expect(page.getByText('expired or was already used').isVisible()).resolves.toBe(true);
  await screenshot(page, 'accounts-reset-expired-phone');
  await page.goto(`${server.url}/invite?token=this-token-was-never-issued-000000`);
  await page.getByTestId('invite-gone').waitFor();
  await screenshot(page, 'accounts-invite-gone-phone');
  await context.close();
});
