import type { Browser, BrowserContext, Page } from 'playwright-core';
import { launchBrowser, PHONE, WIDE, screenshot, watchPageErrors } from '../support/browser';
import { startTestServer } from '../support/server';
import { DEMO_PASSWORD, DEMO_USERS, ensureDemoOrganisation } from '../../server/services/seed-demo';
import { ensureDemoNetworks } from '../../server/services/demo-networks';

/**
 * Accessibility and CSP of the exported web app, on the main screens at 390×844 and 1440×900.
 * Rules (W3C, "Web Content Accessibility Guidelines (WCAG) 2.2", 2023):
 *  - SC 4.1.2 Name, Role, Value: every button, link and input has an accessible name — read from
 *    Chromium's own accessibility tree (CDP Accessibility.getFullAXTree), not guessed from the DOM.
 *  - Target size: ≥ 44×44 CSS px (SC 2.5.5 Target Size (Enhanced), our TOUCH constant), or else
 *    SC 2.5.8 Target Size (Minimum): ≥ 24×24, or a 24 px circle on the target's centre that meets
 *    no other target. Each undersized target is reported with the rule it passed or failed.
 *  - SC 2.1.1 Keyboard / 2.4.3 Focus Order / 2.4.7 Focus Visible: Tab reaches the controls in
 *    document order without a trap, and the focused control looks different from unfocused.
 * The Content-Security-Policy from server/app.ts must cause no `securitypolicyviolation`.
 */
let server: Awaited<ReturnType<typeof startTestServer>>;
let browser: Browser;

/** The demo organisation's first network, looked up when needed (other suites may reset the shared test database). */
async function demoNetworkPath(): Promise<string> {
  const demo = await ensureDemoOrganisation(server.deps);
  await ensureDemoNetworks(server.deps, demo.organisationId);
  const first = await server.deps.models.Network.findOne({ where: { organisationId: demo.organisationId }, order: [['id', 'ASC']] });
  return `/networks/${first!.get('id') as number}`;
}

beforeAll(async () => {
  server = await startTestServer(3130);
  await demoNetworkPath();
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

const INTERACTIVE = new Set(['button', 'link', 'textbox', 'searchbox', 'checkbox', 'radio', 'switch', 'combobox', 'tab', 'menuitem', 'slider', 'spinbutton', 'listbox']);

interface Target { role: string; name: string; x: number; y: number; w: number; h: number; html: string }

/** Interactive nodes of Chromium's accessibility tree with their border boxes. */
async function targets(page: Page): Promise<Target[]> {
  const cdp = await page.context().newCDPSession(page);
  await cdp.send('DOM.getDocument', { depth: -1 });
  const { nodes } = await cdp.send('Accessibility.getFullAXTree');
  const out: Target[] = [];
  for (const n of nodes) {
    const role = String(n.role?.value ?? '');
    if (n.ignored || !INTERACTIVE.has(role) || n.backendDOMNodeId === undefined) continue;
    const disabled = n.properties?.some((p) => p.name === 'disabled' && p.value.value === true);
    if (disabled) continue;
    try {
      const { model } = await cdp.send('DOM.getBoxModel', { backendNodeId: n.backendDOMNodeId });
      const [x, y] = model.border;
      const { outerHTML } = await cdp.send('DOM.getOuterHTML', { backendNodeId: n.backendDOMNodeId });
      out.push({ role, name: String(n.name?.value ?? '').trim(), x, y, w: model.width, h: model.height, html: outerHTML.slice(0, 140) });
    } catch {
      // not rendered (display: none): not a target
    }
  }
  await cdp.detach();
  return out.filter((t) => t.w > 0 && t.h > 0);
}

/** SC 2.5.8: a 24 px circle centred on an undersized target must not meet any other target. */
function sizeVerdict(t: Target, all: Target[]): string | null {
  if (t.w >= 44 && t.h >= 44) return null;
  if (t.w >= 24 && t.h >= 24) return null; // passes 2.5.8 by size
  const cx = t.x + t.w / 2;
  const cy = t.y + t.h / 2;
  const clear = all.every((o) => {
    if (o === t) return true;
    const nx = Math.max(o.x, Math.min(cx, o.x + o.w));
    const ny = Math.max(o.y, Math.min(cy, o.y + o.h));
    return Math.hypot(nx - cx, ny - cy) >= 12;
  });
  return clear ? null : `${t.role} "${t.name}" ${Math.round(t.w)}×${Math.round(t.h)} px: below 24×24 and within 12 px of another target (SC 2.5.8) — ${t.html}`;
}

/**
 * Sign the demo owner in. Other suites share the test database and may reset it while this one
 * runs, so the demo organisation is ensured first and a failed attempt is retried.
 */
async function signIn(context: BrowserContext) {
  const owner = DEMO_USERS.find((u) => u.role === 'owner')!;
  let last: unknown;
  for (let attempt = 0; attempt < 3; attempt++) {
    const page = await context.newPage();
    try {
      await ensureDemoOrganisation(server.deps);
      await page.goto(`${server.url}/sign-in`);
      await page.getByTestId('sign-in-email').fill(owner.email);
      await page.getByTestId('sign-in-password').fill(DEMO_PASSWORD);
      await page.getByTestId('sign-in-submit').click();
      await page.waitForURL((u) => u.pathname === '/networks', { timeout: 15_000, waitUntil: 'commit' });
      return;
    } catch (err) {
      last = err;
      await screenshot(page, 'a11y-sign-in-failed');
    } finally {
      await page.close();
    }
  }
  throw new Error(`sign-in did not reach /networks: ${String(last)}`);
}

/** Collects CSP violations from the first script on (before the app's own scripts run). */
async function watchCsp(page: Page): Promise<() => Promise<string[]>> {
  await page.addInitScript(() => {
    const w = window as unknown as { __csp: string[] };
    w.__csp = [];
    document.addEventListener('securitypolicyviolation', (e) => w.__csp.push(`${e.violatedDirective} blocked ${e.blockedURI || '(inline)'} at ${e.sourceFile}:${e.lineNumber}`));
  });
  return () => page.evaluate(() => (window as unknown as { __csp: string[] }).__csp ?? []);
}

const SCREENS: [string, () => string | Promise<string>, boolean][] = [
  ['sign-in', () => '/sign-in', false],
  ['networks', () => '/networks', true],
  ['network', demoNetworkPath, true],
  ['runs', () => '/runs', true],
  ['team', () => '/team', true],
  ['account', () => '/account', true],
  ['api-docs', () => '/api-docs', true],
];

/**
 * Open a screen; when a signed-in screen lands on /sign-in, sign in once more and retry. Other
 * suites share the test database and may reset it (dropping sessions) while this one runs.
 */
async function open(page: Page, url: string, needsSignIn: boolean) {
  await page.goto(`${server.url}${url}`);
  await settle(page);
  if (needsSignIn && new URL(page.url()).pathname === '/sign-in') {
    await signIn(page.context());
    await page.goto(`${server.url}${url}`);
    await settle(page);
  }
}

async function settle(page: Page) {
  await page.waitForLoadState('networkidle');
  // Loaded means controls on screen (not the loading spinner of the signed-in layout).
  await page.waitForFunction(() => document.querySelectorAll('a[href], button, input, [role="button"], [tabindex="0"]').length >= 3, undefined, { timeout: 15_000 }).catch(() => undefined);
  await page.evaluate(() => document.fonts.ready);
  await page.waitForTimeout(300);
}

describe.each([
  ['phone', PHONE],
  ['wide', WIDE],
])('%s', (label, viewport) => {
  let context: BrowserContext;
  let signedInContext: BrowserContext;
  beforeAll(async () => {
    context = await browser.newContext({ viewport });
    signedInContext = await browser.newContext({ viewport });
    await signIn(signedInContext);
  });
  afterAll(async () => {
    await context?.close();
    await signedInContext?.close();
  });

  test.each(SCREENS)('%s: no CSP violation or page error; named controls; target sizes', async (name, url, needsSignIn) => {
    const page = await (needsSignIn ? signedInContext : context).newPage();
    const errors = watchPageErrors(page);
    const csp = await watchCsp(page);
    const target = await url();
    await open(page, target, needsSignIn);
    expect(new URL(page.url()).pathname).toBe(target);
    await screenshot(page, `a11y-${name}-${label}`);
    const found = await targets(page);
    expect(found.length).toBeGreaterThan(2);
    expect(found.filter((t) => t.name === '').map((t) => `${t.role} without a name: ${t.html}`)).toEqual([]);
    expect(found.map((t) => sizeVerdict(t, found)).filter(Boolean)).toEqual([]);
    expect(await csp()).toEqual([]);
    expect(errors.filter((e) => /Content Security Policy|Refused to/i.test(e))).toEqual([]);
    expect(errors).toEqual([]);
    await page.close();
  });

  test.each(SCREENS)('%s: Tab walks the controls in document order, each focus visible', async (_name, url, needsSignIn) => {
    const page = await (needsSignIn ? signedInContext : context).newPage();
    await open(page, await url(), needsSignIn);
    const steps: { order: number; visible: boolean; tag: string }[] = [];
    await page.evaluate(() => {
      // Number elements in document order once, so focus order can be compared with it.
      document.querySelectorAll('*').forEach((el, i) => el.setAttribute('data-a11y-order', String(i)));
    });
    for (let i = 0; i < 25; i++) {
      await page.keyboard.press('Tab');
      const step = await page.evaluate(() => {
        const el = document.activeElement as HTMLElement | null;
        if (!el || el === document.body) return null;
        const look = (e: HTMLElement) => {
          const s = getComputedStyle(e);
          return [s.outlineStyle, s.outlineWidth, s.outlineColor, s.boxShadow, s.borderColor, s.backgroundColor, s.textDecorationLine].join('|');
        };
        const focused = look(el);
        el.blur();
        const blurred = look(el);
        el.focus({ preventScroll: true });
        return { order: Number(el.getAttribute('data-a11y-order') ?? -1), visible: focused !== blurred || el.matches(':focus-visible') && getComputedStyle(el).outlineStyle !== 'none', tag: `${el.tagName.toLowerCase()} ${el.getAttribute('aria-label') ?? el.textContent?.trim().slice(0, 30) ?? ''}` };
      });
      if (!step) break;
      if (steps.length > 0 && step.order <= steps[0].order && steps.length > 2) break; // wrapped around
      steps.push(step);
    }
    expect(steps.length).toBeGreaterThan(2);
    const backwards = steps.slice(1).filter((s, i) => s.order < steps[i].order).map((s) => s.tag);
    expect(backwards).toEqual([]);
    expect(steps.filter((s) => !s.visible).map((s) => s.tag)).toEqual([]);
    await page.close();
  });
});
