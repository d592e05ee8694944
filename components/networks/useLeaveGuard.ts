import { useEffect } from 'react';
import { Platform } from 'react-native';

/**
 * Asks the browser to confirm closing or reloading the tab while there are unsaved changes
 * (web only; in-app navigation asks through the screen's own confirm dialog).
 */
export function useLeaveGuard(dirty: boolean) {
  useEffect(() => {
    if (Platform.OS !== 'web' || !dirty) return;
    const w = globalThis as unknown as { addEventListener?: (t: string, f: (e: { preventDefault: () => void; returnValue?: string }) => void) => void; removeEventListener?: (t: string, f: unknown) => void };
    if (typeof w.addEventListener !== 'function') return;
    const onBeforeUnload = (e: { preventDefault: () => void; returnValue?: string }) => {
      e.preventDefault();
      e.returnValue = '';
    };
    w.addEventListener('beforeunload', onBeforeUnload);
    return () => w.removeEventListener?.('beforeunload', onBeforeUnload);
  }, [dirty]);
}
