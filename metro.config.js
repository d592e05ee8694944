// Metro: Expo's default configuration plus two web-size changes (both checked by
// tests/e2e/web-delivery.test.ts and measured by tests/bench/web.ts):
//  - WOFF2 as an asset type: the web fonts are WOFF2 subsets from @fontsource/inter (components/fonts);
//  - zod's table of all message locales resolves to an English-only module (components/csp/zod-locales.ts):
//    zod re-exports every locale from its main entry, and Metro keeps whatever is exported.
const path = require('path');
const { getDefaultConfig } = require('expo/metro-config');

const config = getDefaultConfig(__dirname);
config.resolver.assetExts.push('woff2');

const ZOD_ENTRY = /[\\/]node_modules[\\/]zod[\\/]v4[\\/](classic|core)[\\/]/;
const ENGLISH_ONLY = path.join(__dirname, 'components', 'csp', 'zod-locales.ts');
config.resolver.resolveRequest = (context, moduleName, platform) => {
  if (moduleName === '../locales/index.js' && ZOD_ENTRY.test(context.originModulePath)) return { type: 'sourceFile', filePath: ENGLISH_ONLY };
  return context.resolveRequest(context, moduleName, platform);
};
module.exports = config;
