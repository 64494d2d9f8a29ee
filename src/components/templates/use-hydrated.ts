import { useSyncExternalStore } from 'react';

const subscribe = () => () => {};

/**
 * False in the server render and while React hydrates, true after. Controls stay disabled until
 * then, so nothing typed or chosen before the page is live goes nowhere (or into a plain form post).
 */
export function useHydrated(): boolean {
  return useSyncExternalStore(
    subscribe,
    () => true,
    () => false,
  );
}
