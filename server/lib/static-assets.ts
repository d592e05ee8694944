import fs from 'node:fs';
import path from 'node:path';
import zlib from 'node:zlib';
import type { RequestHandler } from 'express';
// eslint-disable-next-line @typescript-eslint/no-require-imports
const expressStaticGzip = require('express-static-gzip') as (root: string, options: Record<string, unknown>) => RequestHandler;

/**
 * Serving the exported web app: precompressed copies written at build time (brotli and gzip next
 * to each file, `precompressDir`, run by finish-web-build.ts) and chosen per request by express-static-gzip, which sets
 * `Content-Encoding` and `Vary: Accept-Encoding`; caching by whether a file's name carries its
 * content hash.
 */

/** A bundler output whose name carries a 32-hex content hash (entry-<md5>.js, font.<md5>.woff2, icon.<md5>@2x.png). */
const HASHED = /[.-][0-9a-f]{32}(@\d+x)?\./;

/** Cache-Control for one served file: hashed names never change (a new build has new names); pages always revalidate. */
export function cacheControlFor(file: string): string {
  if (file.endsWith('.html') || file.endsWith('.html.br') || file.endsWith('.html.gz')) return 'no-cache';
  if (HASHED.test(path.basename(file))) return 'public, max-age=31536000, immutable';
  return 'public, max-age=3600';
}

/** Static files of the web export, compressed copy first when the browser accepts one. */
export function serveWebAssets(webDir: string): RequestHandler {
  return expressStaticGzip(webDir, {
    index: false,
    enableBrotli: true,
    orderPreference: ['br', 'gzip'],
    serveStatic: { index: false, setHeaders: (res: { setHeader: (k: string, v: string) => void }, file: string) => res.setHeader('Cache-Control', cacheControlFor(file)) },
  });
}

/** Types worth compressing (text and uncompressed fonts; PNG, WOFF2 and the like are compressed already). */
const COMPRESSIBLE = new Set(['.html', '.js', '.css', '.json', '.svg', '.ico', '.ttf', '.otf', '.txt', '.map', '.wasm']);

/**
 * Write `<file>.br` (brotli, quality 11) and `<file>.gz` (gzip, level 9) beside every compressible
 * file of `dir` of at least `minBytes`, keeping a copy only when it is smaller. Maximum settings
 * cost seconds once at build and save bytes on every visit. Returns what was written.
 */
export function precompressDir(dir: string, minBytes = 1024): Array<{ file: string; bytes: number; br: number | null; gz: number | null }> {
  const out: Array<{ file: string; bytes: number; br: number | null; gz: number | null }> = [];
  const walk = (d: string) => {
    for (const entry of fs.readdirSync(d, { withFileTypes: true })) {
      const full = path.join(d, entry.name);
      if (entry.isDirectory()) walk(full);
      else if (COMPRESSIBLE.has(path.extname(entry.name)) && fs.statSync(full).size >= minBytes) {
        const body = fs.readFileSync(full);
        const br = zlib.brotliCompressSync(body, { params: { [zlib.constants.BROTLI_PARAM_QUALITY]: 11, [zlib.constants.BROTLI_PARAM_SIZE_HINT]: body.length } });
        const gz = zlib.gzipSync(body, { level: 9 });
        const keep = (data: Buffer, ext: string) => {
          if (data.length >= body.length) return null;
          fs.writeFileSync(full + ext, data);
          return data.length;
        };
        out.push({ file: path.relative(dir, full), bytes: body.length, br: keep(br, '.br'), gz: keep(gz, '.gz') });
      }
    }
  };
  walk(dir);
  return out;
}
