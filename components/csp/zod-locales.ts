/**
 * Bundler stand-in for zod's table of some sixty message locales (metro.config.js points zod's
 * own `../locales/index.js` here): the app speaks English only, and the full table was over a
 * quarter of a megabyte of the script every page loads. `z.locales.en` stays available.
 */
export { default as en } from 'zod/v4/locales/en.js';
