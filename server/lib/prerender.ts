/**
 * Prerendered pages: the web export's HTML shell with one screen's first look written into it,
 * so a phone paints the form before any script has arrived or run. The app then starts as usual
 * (a fresh render into #root, no hydration) and removes the copy once its own form is on screen
 * (components/auth/prerendered.ts), carrying over anything typed into it.
 *
 * The snapshot is taken at build time in Chromium (server/scripts/prerender-pages.ts); this module
 * only composes the page and names the files, so the server and the build ask the same rules.
 */

/** Pages written at build time: URL path → file name in the export (served in place of index.html). */
export const PRERENDERED_PAGES: Readonly<Record<string, string>> = { '/sign-in': 'sign-in.html' };

/** Element id of the prerendered copy; the app removes it (components/auth/prerendered.ts asks the same id). */
export const PRERENDERED_ID = 'prerendered';

export interface Snapshot {
  /** <style> elements the app had written into <head> (react-native-web's sheet, the @font-face rules), in order. */
  styles: Array<{ id: string | null; css: string }>;
  /** innerHTML of #root once the screen was shown, buttons marked aria-disabled. */
  html: string;
  /** Scripts the page loaded beyond those the shell names (route chunks), as absolute paths. */
  chunks: string[];
  /** Scripts of the page usually opened next, fetched when the network is idle (`rel="prefetch"`). */
  next?: string[];
}

const escapeAttr = (s: string) => s.replace(/&/g, '&amp;').replace(/"/g, '&quot;').replace(/</g, '&lt;');
/** A style's text may not close its own element. */
const safeCss = (css: string) => css.replace(/<\/style/gi, '<\\/style');

/**
 * The shell with the snapshot written in:
 *  - the app's styles in <head> (same ids, so the app reuses them rather than adding copies);
 *  - `<link rel="preload">` for the route chunks the page will ask for only after the entry has run
 *    (they download alongside the entry instead of one round trip after it), and `rel="prefetch"`
 *    for the chunks of the page usually opened next (after signing in: the networks list);
 *  - the copy in a fixed layer above #root, so the app can build its screen underneath and the
 *    copy disappears only when the real form is there. (The snapshot marks its buttons aria-disabled:
 *    they do nothing until the app has started; links are plain <a href> and work at once.)
 */
export function composePrerenderedPage(shell: string, snap: Snapshot): string {
  if (!shell.includes('<div id="root"></div>') || !shell.includes('</head>')) throw new Error('unexpected HTML shell: no empty <div id="root"> or no </head>');
  const named = new Set([...shell.matchAll(/<script src="([^"]+)"/g)].map((m) => m[1]));
  const preloads = snap.chunks.filter((c) => !named.has(c)).map((c) => `<link rel="preload" as="script" href="${escapeAttr(c)}" />`);
  const prefetches = (snap.next ?? []).filter((c) => !named.has(c) && !snap.chunks.includes(c)).map((c) => `<link rel="prefetch" as="script" href="${escapeAttr(c)}" />`);
  const styles = snap.styles.map((s) => `<style${s.id ? ` id="${escapeAttr(s.id)}"` : ''}>${safeCss(s.css)}</style>`);
  const layer = `<style id="${PRERENDERED_ID}-layer">#${PRERENDERED_ID}{position:fixed;inset:0;z-index:1;display:flex;overflow:auto}</style>`;
  return shell
    .replace('</head>', `${[...preloads, ...prefetches, ...styles, layer].join('\n')}\n</head>`)
    .replace('<div id="root"></div>', `<div id="${PRERENDERED_ID}">${snap.html}</div>\n    <div id="root"></div>`);
}

/** The prerendered file for a request path, if there is one (query strings do not matter). */
export function prerenderedFileFor(pathname: string): string | null {
  const clean = pathname.length > 1 ? pathname.replace(/\/+$/, '') : pathname;
  return Object.prototype.hasOwnProperty.call(PRERENDERED_PAGES, clean) ? PRERENDERED_PAGES[clean] : null;
}
