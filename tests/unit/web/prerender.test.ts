import { composePrerenderedPage, prerenderedFileFor, PRERENDERED_ID, PRERENDERED_PAGES } from '../../../server/lib/prerender';
import { PRERENDERED_ID as CLIENT_ID } from '../../../components/auth/prerendered';

const shell = [
  '<!DOCTYPE html><html><head><title>t</title></head><body>',
  '<div id="root"></div>',
  '<script src="/_expo/a.js" defer></script><script src="/_expo/entry.js" defer></script>',
  '</body></html>',
].join('\n');

test('the prerendered page carries the styles, the copy above an empty #root, and preloads only the chunks the shell does not name', () => {
  const html = composePrerenderedPage(shell, {
    styles: [{ id: 'react-native-stylesheet', css: '.css-1{display:flex}' }, { id: null, css: '@font-face{font-family:x}' }],
    html: '<div class="css-1"><input data-testid="sign-in-email"></div>',
    chunks: ['/_expo/a.js', '/_expo/sign-in.js', '/_expo/entry.js', '/_expo/_layout.js'],
  });
  const head = html.slice(0, html.indexOf('</head>'));
  expect([...head.matchAll(/rel="preload" as="script" href="([^"]+)"/g)].map((m) => m[1])).toEqual(['/_expo/sign-in.js', '/_expo/_layout.js']);
  expect(head).toContain('<style id="react-native-stylesheet">.css-1{display:flex}</style>');
  expect(head).toContain('<style>@font-face{font-family:x}</style>');
  expect(html).toContain(`<div id="${PRERENDERED_ID}"><div class="css-1"><input data-testid="sign-in-email"></div></div>`);
  // The app still starts into an empty #root, after the copy, with the same scripts.
  expect(html.indexOf(`id="${PRERENDERED_ID}"`)).toBeLessThan(html.indexOf('<div id="root"></div>'));
  expect(html).toContain('<script src="/_expo/entry.js" defer></script>');
});

test('a style cannot end its own element early', () => {
  const html = composePrerenderedPage(shell, { styles: [{ id: null, css: 'a{}</style><script>x</script>' }], html: '', chunks: [] });
  expect(html).not.toContain('</style><script>');
});

test('an unexpected shell is refused rather than written wrongly', () => {
  expect(() => composePrerenderedPage('<html><body><div id="root">x</div></body></html>', { styles: [], html: '', chunks: [] })).toThrow(/shell/);
});

test('which request paths get a prerendered file', () => {
  expect(prerenderedFileFor('/sign-in')).toBe('sign-in.html');
  expect(prerenderedFileFor('/sign-in/')).toBe('sign-in.html');
  expect(prerenderedFileFor('/sign-up')).toBeNull();
  expect(prerenderedFileFor('/')).toBeNull();
  expect(prerenderedFileFor('/constructor')).toBeNull();
  expect(Object.keys(PRERENDERED_PAGES)).toContain('/sign-in');
});

test('the client removes the copy by the id the server writes', () => {
  expect(CLIENT_ID).toBe(PRERENDERED_ID);
});
