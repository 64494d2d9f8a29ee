import { useEffect, useState } from 'react';

/**
 * False during server rendering and until the island has hydrated. Forms disable their controls
 * until then, so nothing typed or clicked before the handlers exist is lost to a plain reload.
 */
export function useHydrated(): boolean {
  const [hydrated, setHydrated] = useState(false);
  useEffect(() => setHydrated(true), []);
  return hydrated;
}
