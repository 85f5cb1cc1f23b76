import { onlineManager } from '@tanstack/react-query';
import { useSyncExternalStore } from 'react';

/**
 * TanStack Query starts out assuming a connection and only learns otherwise from an `offline`
 * event; a page reloaded without signal must know at once, or its stored Round would be tried,
 * fail and be dropped instead of waiting. `navigator.onLine === false` is reliable; `true` may
 * still be a dead connection, which the outbox's retries cover.
 */
export function syncOnlineStatus() {
  if (typeof navigator !== 'undefined' && typeof navigator.onLine === 'boolean') onlineManager.setOnline(navigator.onLine);
}

/** Whether the phone has a connection, as the query client sees it. */
export function useIsOnline(): boolean {
  return useSyncExternalStore(
    (notify) => onlineManager.subscribe(notify),
    () => onlineManager.isOnline(),
    () => true,
  );
}
