import crypto from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import zlib from 'node:zlib';
import { cacheControlFor, precompressDir } from '../../../server/lib/static-assets';

describe('web export caching', () => {
  test('content-hashed bundler outputs are immutable; pages revalidate; other files get an hour', () => {
    const year = 'public, max-age=31536000, immutable';
    expect(cacheControlFor('/w/_expo/static/js/web/entry-dfc18d8b56f8d882d1243d682055f398.js')).toBe(year);
    expect(cacheControlFor('/w/_expo/static/js/web/entry-dfc18d8b56f8d882d1243d682055f398.js.br')).toBe(year);
    expect(cacheControlFor('/w/assets/node_modules/@fontsource/inter/files/inter-latin-400-normal.51b6ad87261f18b6433ec52871ddfabc.woff2')).toBe(year);
    expect(cacheControlFor('/w/assets/close-icon.808e1b1b9b53114ec2838071a7e6daa7@3x.png')).toBe(year);
    expect(cacheControlFor('/w/index.html')).toBe('no-cache');
    expect(cacheControlFor('/w/favicon.ico')).toBe('public, max-age=3600');
    expect(cacheControlFor('/w/metadata.json')).toBe('public, max-age=3600');
    // A short hex run is not a content hash.
    expect(cacheControlFor('/w/_expo/static/js/web/entry-dfc18d8b.js')).toBe('public, max-age=3600');
  });

  test('precompression writes brotli and gzip copies that decode to the original, and skips what would not shrink', () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'spinyard-precompress-'));
    const js = Buffer.from('const lane = "Quillmere Cross";\n'.repeat(400));
    fs.mkdirSync(path.join(dir, '_expo'));
    fs.writeFileSync(path.join(dir, '_expo', 'entry.js'), js);
    fs.writeFileSync(path.join(dir, 'noise.js'), crypto.randomBytes(4096)); // random bytes do not compress
    fs.writeFileSync(path.join(dir, 'tiny.js'), 'x=1');
    fs.writeFileSync(path.join(dir, 'font.woff2'), js);
    const written = precompressDir(dir);
    expect(zlib.brotliDecompressSync(fs.readFileSync(path.join(dir, '_expo', 'entry.js.br')))).toEqual(js);
    expect(zlib.gunzipSync(fs.readFileSync(path.join(dir, '_expo', 'entry.js.gz')))).toEqual(js);
    expect(fs.existsSync(path.join(dir, 'tiny.js.br'))).toBe(false); // under the size floor
    expect(fs.existsSync(path.join(dir, 'font.woff2.br'))).toBe(false); // a compressed format
    expect(written.find((w) => w.file === 'noise.js')).toEqual({ file: 'noise.js', bytes: 4096, br: null, gz: null });
    expect(fs.existsSync(path.join(dir, 'noise.js.br')) || fs.existsSync(path.join(dir, 'noise.js.gz'))).toBe(false);
    expect(written.map((w) => w.file).sort()).toEqual([path.join('_expo', 'entry.js'), 'noise.js']);
    fs.rmSync(dir, { recursive: true });
  });
});
