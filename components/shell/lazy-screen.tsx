import { lazy, Suspense, type ComponentProps, type ComponentType } from 'react';
import { FullScreenStatus } from './FullScreenStatus';
import type * as Screens from './workspace-screens';

type Name = keyof typeof Screens;

/** One import() for every drawing screen: one chunk, fetched once, never by the sign-in page. */
const loadScreens = () => import('./workspace-screens');

/**
 * A route's drawing screen, loaded on first use (workspace-screens.ts says why) with a loading
 * state meanwhile. Props are the screen's own.
 */
export function lazyScreen<N extends Name>(name: N): ComponentType<ComponentProps<(typeof Screens)[N]>> {
  const Lazy = lazy(() => loadScreens().then((m) => ({ default: m[name] as ComponentType<object> })));
  function LazyScreen(props: ComponentProps<(typeof Screens)[N]>) {
    return (
      <Suspense fallback={<FullScreenStatus label="Loading…" />}>
        <Lazy {...(props as object)} />
      </Suspense>
    );
  }
  LazyScreen.displayName = `Lazy(${name})`;
  return LazyScreen;
}
