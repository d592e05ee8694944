/**
 * Helpers shared by the screens-* browser suites: signing a test member in, and reading boxes of
 * what a screen drew (names, depot marks, controls) in page pixels so overlaps can be checked.
 */
import type { BrowserContext, Locator, Page } from 'playwright-core';

export interface Rect {
  x: number;
  y: number;
  w: number;
  h: number;
}

/** True when two boxes share more than `slack` px in both directions (touching edges is fine). */
export const overlaps = (a: Rect, b: Rect, slack = 0.5) => a.x + slack < b.x + b.w && b.x + slack < a.x + a.w && a.y + slack < b.y + b.h && b.y + slack < a.y + a.h;

/** `a` lies inside `b`, with `slack` px of tolerance. */
export const inside = (a: Rect, b: Rect, slack = 0.5) => a.x >= b.x - slack && a.y >= b.y - slack && a.x + a.w <= b.x + b.w + slack && a.y + a.h <= b.y + b.h + slack;

/** Sign a member in through the form; resolves once the networks page is reached. */
export async function signInAs(context: BrowserContext, baseUrl: string, user: { email: string; password: string }): Promise<Page> {
  const page = await context.newPage();
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByTestId('sign-in-email').fill(user.email);
  await page.getByTestId('sign-in-password').fill(user.password);
  await page.getByTestId('sign-in-submit').click();
  await page.waitForURL((u) => u.pathname === '/networks', { timeout: 30_000 });
  return page;
}

export interface DrawingParts {
  /** The drawing's own box. */
  svg: Rect;
  /** Each name drawn (SVG text), with its box. */
  names: { text: string; box: Rect }[];
  /** Depot marks in depot order (circles with an outline): centre and radius. */
  marks: { x: number; y: number; r: number; fill: string }[];
  /** Lanes in lane order: stroke width in page px and effective opacity (own × group). */
  lanes: { w: number; opacity: number; stroke: string }[];
  /** Buttons floating over the drawing (zoom, names, undo/redo). */
  controls: { name: string; box: Rect }[];
}

/** Read the drawing inside `scope` (the element holding one drawing and its canvas). */
export async function drawingParts(scope: Locator): Promise<DrawingParts> {
  return scope.evaluate((root) => {
    const box = (r: DOMRect) => ({ x: r.x, y: r.y, w: r.width, h: r.height });
    const svg = root.querySelector('svg[aria-label^="Drawing of"]') as SVGSVGElement;
    const canvas = root.querySelector('[data-testid="drawing-canvas"]') as HTMLElement;
    const names = Array.from(svg.querySelectorAll('text')).map((t) => ({ text: t.textContent ?? '', box: box(t.getBoundingClientRect()) }));
    const marks = Array.from(svg.querySelectorAll('circle[stroke-width]')).map((c) => {
      const r = c.getBoundingClientRect();
      return { x: r.x + r.width / 2, y: r.y + r.height / 2, r: r.width / 2, fill: c.getAttribute('fill') ?? '' };
    });
    const scale = (el: Element) => {
      const m = (el as SVGGraphicsElement).getScreenCTM();
      return m ? Math.hypot(m.a, m.b) : 1;
    };
    const opacityOf = (el: Element) => {
      let o = 1;
      for (let e: Element | null = el; e && e !== svg; e = e.parentElement) o *= Number(e.getAttribute('opacity') ?? '1') * Number(getComputedStyle(e).opacity || '1');
      return o;
    };
    const lanes = Array.from(svg.querySelectorAll('line')).map((l) => ({ w: Number(l.getAttribute('stroke-width') ?? '1') * scale(l), opacity: opacityOf(l), stroke: l.getAttribute('stroke') ?? '' }));
    const holder = canvas.parentElement as HTMLElement;
    const controls = Array.from(holder.querySelectorAll('[role="button"], button'))
      .filter((b) => b !== canvas && (b as HTMLElement).offsetParent !== null)
      .map((b) => ({ name: (b.getAttribute('aria-label') ?? b.textContent ?? '').trim(), box: box(b.getBoundingClientRect()) }));
    return { svg: box(svg.getBoundingClientRect()), names, marks, lanes, controls };
  });
}

/**
 * Problems of a drawing's names: overlaps with each other, a mark, a control, or the edge.
 * `chosen`: names of tapped or hovered depots, which may sit over other marks (never over names).
 */
export function nameProblems(p: DrawingParts, chosen: readonly string[] = []): string[] {
  const out: string[] = [];
  const shown = p.names.filter((n) => n.box.w > 0 && n.text.trim() !== '');
  for (let i = 0; i < shown.length; i++) {
    const a = shown[i];
    if (!inside(a.box, p.svg)) out.push(`"${a.text}" leaves the drawing`);
    for (const c of p.controls) if (overlaps(a.box, c.box)) out.push(`"${a.text}" under the ${c.name} control`);
    for (let j = i + 1; j < shown.length; j++) if (overlaps(a.box, shown[j].box, 1)) out.push(`"${a.text}" overlaps "${shown[j].text}"`);
    if (!chosen.includes(a.text)) for (const m of p.marks) if (overlaps(a.box, { x: m.x - m.r, y: m.y - m.r, w: 2 * m.r, h: 2 * m.r }, 1.5)) out.push(`"${a.text}" covers a depot mark`);
  }
  return [...new Set(out)];
}

/**
 * Several independent checks in one browser session: each failure is recorded under its name and
 * the rest still run, so one report shows every fault present (`expect(c.failed).toEqual({})`).
 */
export function softChecks() {
  const failed: Record<string, string> = {};
  return {
    failed,
    async check(name: string, fn: () => unknown | Promise<unknown>): Promise<void> {
      try {
        await fn();
      } catch (e) {
        failed[name] = String((e as Error).message ?? e).replace(/\u001b\[[0-9;]*m/g, '').split('\n').filter((l) => l.trim()).slice(0, 8).join(' | ').slice(0, 600);
      }
    },
  };
}
