// Metro (Expo's default configuration) plus WOFF2 as an asset type: the web fonts are WOFF2
// subsets from @fontsource/inter (components/fonts), which Metro does not list by default.
const { getDefaultConfig } = require('expo/metro-config');

const config = getDefaultConfig(__dirname);
config.resolver.assetExts.push('woff2');
module.exports = config;
