/**
 * `npx tsx server/scripts/finish-web-build.ts dist/web dist/web-maps`, run by build_web_if_stale
 * after `expo export --source-maps`:
 *  1. moves the source maps out of the served folder (they name every module of every chunk:
 *     tests/e2e/web-delivery.test.ts reads them to check what each page loads; not published);
 *  2. writes the prerendered pages (the sign-in form in the HTML itself: prerender-pages.ts);
 *  3. writes brotli and gzip copies beside the served files (server/lib/static-assets.ts).
 */
import fs from 'node:fs';
import path from 'node:path';
import { precompressDir } from '../lib/static-assets';
import { prerenderPages } from './prerender-pages';

const dir = path.resolve(process.argv[2] ?? 'dist/web');
const mapsDir = path.resolve(process.argv[3] ?? 'dist/web-maps');

fs.rmSync(mapsDir, { recursive: true, force: true });
let maps = 0;
const walk = (d: string) => {
  for (const entry of fs.readdirSync(d, { withFileTypes: true })) {
    const full = path.join(d, entry.name);
    if (entry.isDirectory()) walk(full);
    else if (entry.name.endsWith('.map')) {
      const target = path.join(mapsDir, path.relative(dir, full));
      fs.mkdirSync(path.dirname(target), { recursive: true });
      fs.renameSync(full, target);
      maps++;
    }
  }
};
walk(dir);
void (async () => {
  // A page that cannot be prerendered still works from the plain shell: say so, do not fail the build.
  const pages = await prerenderPages(dir, mapsDir).catch((err: unknown) => {
    console.error(`prerender failed, pages start from the plain shell: ${String(err)}`);
    return [] as string[];
  });
  const written = precompressDir(dir);
  const total = (k: 'bytes' | 'br' | 'gz') => written.reduce((s, w) => s + (w[k] ?? w.bytes), 0);
  console.log(`moved ${maps} source maps to ${path.relative(process.cwd(), mapsDir)}; prerendered ${pages.join(', ') || 'no page'}; precompressed ${written.length} files: ${total('bytes')} bytes → brotli ${total('br')}, gzip ${total('gz')}`);
})().catch((err) => {
  console.error(err);
  process.exit(1);
});
