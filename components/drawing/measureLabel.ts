import { Platform } from 'react-native';
import { textWidth } from './labels';

/**
 * Width of a depot name as the browser will draw it (canvas text metrics in the drawing's own
 * font), so a name placed at the edge is not clipped: the character-count estimate ran short for
 * some names ("Marrowdene" left the drawing by a few pixels). Never below the estimate, which also
 * stands in before the font has loaded and off the web.
 */
export function labelMeasurer(fontSize: number, fontFamily: string): (text: string) => number {
  const estimate = (t: string) => textWidth(t, fontSize);
  // jsdom (component tests) has no canvas text metrics and reports each attempt as an error.
  if (Platform.OS !== 'web' || typeof document === 'undefined' || /jsdom/i.test(globalThis.navigator?.userAgent ?? '')) return estimate;
  const ctx = document.createElement('canvas').getContext('2d');
  if (!ctx) return estimate;
  ctx.font = `${fontSize}px ${fontFamily}, sans-serif`;
  const cache = new Map<string, number>();
  return (t) => {
    let w = cache.get(t);
    if (w === undefined) {
      w = Math.max(Math.ceil(ctx.measureText(t).width) + 1, estimate(t));
      cache.set(t, w);
    }
    return w;
  };
}
