import { Asset } from 'expo-asset';
import { fontFaceCss, type Subset } from './faces';

/** Bundled WOFF2 files, weight → subset → module (Metro turns each into a hashed asset URL). */
const FILES: Record<number, Record<Subset, number>> = {
  400: { latin: require('@fontsource/inter/files/inter-latin-400-normal.woff2'), 'latin-ext': require('@fontsource/inter/files/inter-latin-ext-400-normal.woff2') },
  500: { latin: require('@fontsource/inter/files/inter-latin-500-normal.woff2'), 'latin-ext': require('@fontsource/inter/files/inter-latin-ext-500-normal.woff2') },
  600: { latin: require('@fontsource/inter/files/inter-latin-600-normal.woff2'), 'latin-ext': require('@fontsource/inter/files/inter-latin-ext-600-normal.woff2') },
  700: { latin: require('@fontsource/inter/files/inter-latin-700-normal.woff2'), 'latin-ext': require('@fontsource/inter/files/inter-latin-ext-700-normal.woff2') },
};

const STYLE_ID = 'spinyard-fonts';

/**
 * Declares the app's fonts once (web): a <style> of @font-face rules (faces.ts). The browser
 * fetches a face when text first uses it and swaps it in, so nothing waits for fonts; call it
 * from the root layout. No-op outside a browser.
 */
export function installAppFonts(): void {
  if (typeof document === 'undefined' || document.getElementById(STYLE_ID)) return;
  const style = document.createElement('style');
  style.id = STYLE_ID;
  style.textContent = fontFaceCss((weight, subset) => Asset.fromModule(FILES[weight][subset]).uri);
  document.head.appendChild(style);
}
