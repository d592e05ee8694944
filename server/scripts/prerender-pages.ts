/**
 * `npx tsx server/scripts/prerender-pages.ts dist/web dist/web-maps`, run by finish-web-build.ts: opens each page of
 * PRERENDERED_PAGES (server/lib/prerender.ts) in Debian's Chromium against the export (API answering
 * 401, i.e. signed out), waits for its form, and writes the shell with that first look into the
 * export (e.g. dist/web/sign-in.html). Without Chromium (or playwright-core) it writes nothing and
 * says so: the app then starts from the plain shell as before.
 */
import fs from 'node:fs';
import path from 'node:path';
import type { AddressInfo } from 'node:net';
import express from 'express';
import { composePrerenderedPage, PRERENDERED_PAGES, type Snapshot } from '../lib/prerender';

/** What the page must show before it is copied (testID of the form). */
const READY: Readonly<Record<string, string>> = { '/sign-in': 'sign-in-form' };
/** Source files of the page usually opened next, whose chunks are prefetched (found in the source maps). */
const NEXT: Readonly<Record<string, string[]>> = { '/sign-in': ['app/(app)/_layout.tsx', 'app/(app)/networks/index.tsx'] };
/** The layout the copy is taken at: phone first (components keep one column up to this width). */
const VIEWPORT = { width: 390, height: 844 };

/** Served paths of the chunks whose source maps (in `mapsDir`, as finish-web-build.ts moves them) hold one of `sources`. */
export function chunksHolding(mapsDir: string, sources: string[]): string[] {
  const found: string[] = [];
  const walk = (d: string) => {
    if (!fs.existsSync(d)) return;
    for (const e of fs.readdirSync(d, { withFileTypes: true })) {
      const full = path.join(d, e.name);
      if (e.isDirectory()) walk(full);
      else if (e.name.endsWith('.js.map')) {
        const listed = (JSON.parse(fs.readFileSync(full, 'utf8')) as { sources?: string[] }).sources ?? [];
        if (listed.some((s) => sources.some((want) => s.endsWith(`/${want}`)))) found.push(`/${path.relative(mapsDir, full).slice(0, -'.map'.length).split(path.sep).join('/')}`);
      }
    }
  };
  walk(mapsDir);
  return found;
}

export async function prerenderPages(dir: string, mapsDir?: string): Promise<string[]> {
  const shellFile = path.join(dir, 'index.html');
  const shell = fs.readFileSync(shellFile, 'utf8');
  let chromium: typeof import('playwright-core').chromium;
  try {
    // require, not import(): project code loads one way on Node (tests/unit/server/module-loading.test.ts).
    ({ chromium } = require('playwright-core') as typeof import('playwright-core'));
  } catch {
    console.log('prerender: playwright-core not installed; pages start from the plain shell');
    return [];
  }
  const executablePath = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
  if (!fs.existsSync(executablePath)) {
    console.log(`prerender: no Chromium at ${executablePath}; pages start from the plain shell`);
    return [];
  }
  // The export as the server sends it, signed out: every API call answers 401.
  const app = express();
  app.use('/api', (_req, res) => void res.status(401).json({ error: 'Not signed in.' }));
  app.use(express.static(dir, { index: false }));
  app.use((_req, res) => res.sendFile(shellFile));
  const server = await new Promise<import('node:http').Server>((resolve) => {
    const s = app.listen(0, '127.0.0.1', () => resolve(s));
  });
  const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  const browser = await chromium.launch({ executablePath, headless: true, args: ['--no-sandbox', '--disable-gpu', '--disable-dev-shm-usage', '--host-resolver-rules=MAP * ~NOTFOUND, EXCLUDE 127.0.0.1'] });
  const written: string[] = [];
  try {
    for (const [route, file] of Object.entries(PRERENDERED_PAGES)) {
      const page = await browser.newPage({ viewport: VIEWPORT });
      const scripts: string[] = [];
      page.on('request', (r) => {
        const u = new URL(r.url());
        if (u.origin === base && u.pathname.endsWith('.js')) scripts.push(u.pathname);
      });
      await page.goto(`${base}${route}`);
      await page.getByTestId(READY[route]).waitFor({ state: 'visible', timeout: 120_000 });
      await page.evaluate(() => document.fonts.ready);
      const snap = await page.evaluate((): Omit<Snapshot, 'chunks'> => {
        // react-native-web writes its rules through the CSSOM, so a <style>'s text can be empty: read its rules.
        const styles = Array.from(document.head.querySelectorAll('style'))
          .filter((s) => s.id !== 'expo-reset') // already in the shell
          .map((s) => ({ id: s.id || null, css: s.sheet ? Array.from(s.sheet.cssRules).map((r) => r.cssText).join('\n') : (s.textContent ?? '') }));
        const copy = document.getElementById('root')!.cloneNode(true) as HTMLElement;
        copy.querySelectorAll('[role="button"], button').forEach((b) => b.setAttribute('aria-disabled', 'true'));
        return { styles, html: copy.innerHTML };
      });
      await page.close();
      const next = mapsDir && NEXT[route] ? chunksHolding(mapsDir, NEXT[route]) : [];
      fs.writeFileSync(path.join(dir, file), composePrerenderedPage(shell, { ...snap, chunks: [...new Set(scripts)], next }));
      written.push(file);
    }
  } finally {
    await browser.close();
    server.close();
  }
  return written;
}

if (require.main === module) {
  prerenderPages(path.resolve(process.argv[2] ?? 'dist/web'), process.argv[3] && path.resolve(process.argv[3])).then(
    (files) => console.log(`prerendered ${files.join(', ') || 'nothing'}`),
    (err) => {
      console.error(err);
      process.exit(1);
    },
  );
}
