/**
 * Checks on what a page shows, shared by browser suites: money amounts kept on one line, seconds
 * read back from the app's own duration format, the words of an accessible name against the
 * visible text, and screenshots into .data/screens (git-ignored) for looking at by hand.
 */
import fs from 'node:fs';
import path from 'node:path';
import type { Page } from 'playwright-core';

export const SHOTS = path.resolve(__dirname, '..', '..', '.data', 'screens');

/** A viewport-sized screenshot in .data/screens/<name>.png (the full page with `full`). */
export async function shot(page: Page, name: string, full = false): Promise<string> {
  fs.mkdirSync(SHOTS, { recursive: true });
  const file = path.join(SHOTS, `${name}.png`);
  await page.screenshot({ path: file, fullPage: full });
  return file;
}

export const MONEY = /€\s?\d[\d,]*(?:\.\d+)?/;
export const PERCENT = /\d+(?:\.\d+)?\s%/;

/**
 * Every visible match of `figure` (default: money such as "€2.50", "€39,322.95") whose characters
 * are drawn on more than one line: the client rectangles of just the match, grouped by top edge.
 */
export async function splitAcrossLines(page: Page, figure: RegExp = MONEY): Promise<{ figure: string; text: string; lines: number }[]> {
  return page.evaluate((source) => {
    const out: { figure: string; text: string; lines: number }[] = [];
    const walker = document.createTreeWalker(document.body, NodeFilter.SHOW_TEXT);
    for (let n = walker.nextNode(); n; n = walker.nextNode()) {
      const text = n.nodeValue ?? '';
      for (const m of text.matchAll(new RegExp(source, 'g'))) {
        const range = document.createRange();
        range.setStart(n, m.index!);
        range.setEnd(n, m.index! + m[0].length);
        const rects = Array.from(range.getClientRects()).filter((r) => r.width > 0 && r.height > 0);
        const tops = new Set(rects.map((r) => Math.round(r.top / 4)));
        if (tops.size > 1) out.push({ figure: m[0], text, lines: tops.size });
      }
    }
    return out;
  }, figure.source);
}

/** How many visible money amounts the page shows (so a check of "none split" is not vacuous). */
export async function moneyShown(page: Page): Promise<number> {
  return page.evaluate(() => {
    let count = 0;
    const walker = document.createTreeWalker(document.body, NodeFilter.SHOW_TEXT);
    for (let n = walker.nextNode(); n; n = walker.nextNode()) {
      const el = n.parentElement;
      if (!el || el.getClientRects().length === 0) continue;
      count += ((n.nodeValue ?? '').match(/€\s?\d[\d,]*(?:\.\d+)?/g) ?? []).length;
    }
    return count;
  });
}

/** Seconds from the app's duration text: "0.45 s", "12.3 s", "2 min 05 s" (components/runs/format.ts). */
export function secondsOf(text: string): number {
  const m = /(?:(\d+) min )?(\d+(?:\.\d+)?) s/.exec(text);
  if (!m) throw new Error(`no duration in "${text}"`);
  return (m[1] ? Number(m[1]) * 60 : 0) + Number(m[2]);
}

/**
 * Words as axe-core's label-content-name-mismatch rule compares them (Deque, axe-core 4,
 * lib/checks/label/label-content-name-mismatch-evaluate.js): lower case, anything that is not a
 * letter or digit a separator.
 */
export const words = (s: string) => s.toLowerCase().normalize('NFKD').split(/[^\p{L}\p{N}]+/u).filter(Boolean);

/**
 * WCAG 2.1 SC 2.5.3 Label in Name, with the W3C Understanding document's best practice: the
 * accessible name starts with the visible text (so a spoken "click <what you see>" finds it).
 */
export function nameStartsWithVisible(name: string, visible: string): boolean {
  const n = words(name), v = words(visible);
  return v.length > 0 && v.every((w, i) => n[i] === w);
}

/**
 * Named checks inside one browser test, each run even when an earlier one failed, so a run at an
 * older commit says which faults each fix removed. `done` writes the outcome to
 * .data/fault-checks/<name>.json and fails the test when any check failed.
 */
export function faultChecks() {
  const results: { fault: string; ok: boolean; error?: string }[] = [];
  return {
    async check(fault: string, body: () => Promise<void>) {
      try {
        await body();
        results.push({ fault, ok: true });
      } catch (e) {
        results.push({ fault, ok: false, error: String((e as Error)?.message ?? e).split('\n').slice(0, 8).join('\n') });
      }
    },
    done(name: string) {
      const dir = path.resolve(__dirname, '..', '..', '.data', 'fault-checks');
      fs.mkdirSync(dir, { recursive: true });
      fs.writeFileSync(path.join(dir, `${name}.json`), JSON.stringify(results, null, 2));
      const failed = results.filter((r) => !r.ok);
      if (failed.length) throw new Error(failed.map((f) => `✕ ${f.fault}\n${f.error}`).join('\n\n'));
      if (results.length === 0) throw new Error('no checks ran');
    },
  };
}
