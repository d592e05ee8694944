import { useEffect, useRef } from 'react';
import { Platform } from 'react-native';

type Listener = (e: Event) => void;
interface WebTarget {
  addEventListener?: (type: string, f: Listener, capture?: boolean) => void;
  removeEventListener?: (type: string, f: Listener, capture?: boolean) => void;
}

/**
 * While there are unsaved changes, on the web:
 *  - closing or reloading the tab asks the browser's own question (beforeunload);
 *  - a click on any in-app link (the navigation bar's too) is held back and `onLeave(path)` is
 *    called instead, so the screen can ask in its own dialog and then navigate.
 * The click is caught on the document in the capture phase, before the router's handler sees it.
 * Native apps have no such links; their screens ask from their own buttons.
 */
export function useLeaveGuard(dirty: boolean, onLeave?: (path: string) => void) {
  const leave = useRef(onLeave);
  leave.current = onLeave;
  useEffect(() => {
    if (Platform.OS !== 'web' || !dirty) return;
    const g = globalThis as unknown as WebTarget & { document?: WebTarget; location?: { pathname: string; origin: string } };
    if (typeof g.addEventListener !== 'function' || !g.document?.addEventListener) return;
    const onBeforeUnload: Listener = (e) => {
      e.preventDefault();
      (e as unknown as { returnValue: string }).returnValue = '';
    };
    const onClick: Listener = (e) => {
      if (!leave.current) return;
      const target = e.target as unknown as { closest?: (s: string) => { getAttribute: (n: string) => string | null } | null } | null;
      const link = target?.closest?.('a[href]');
      const href = link?.getAttribute('href');
      if (!href || /^[a-z]+:/i.test(href) || href.startsWith('#')) return;
      if (href === g.location?.pathname) return;
      e.preventDefault();
      e.stopPropagation();
      leave.current(href);
    };
    g.addEventListener('beforeunload', onBeforeUnload);
    g.document.addEventListener('click', onClick, true);
    return () => {
      g.removeEventListener?.('beforeunload', onBeforeUnload);
      g.document?.removeEventListener?.('click', onClick, true);
    };
  }, [dirty]);
}
