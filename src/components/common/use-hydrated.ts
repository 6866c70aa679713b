import { useSyncExternalStore } from 'react';

const subscribe = () => () => undefined;

/**
 * False while the static HTML is being rendered or hydrated, true afterwards. Screens that depend on
 * what only the browser knows (the address's query string) render a neutral first frame until then,
 * so hydration matches the exported HTML.
 */
export function useHydrated(): boolean {
  return useSyncExternalStore(
    subscribe,
    () => true,
    () => false,
  );
}
