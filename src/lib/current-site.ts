import { useCallback, useSyncExternalStore } from 'react';

/**
 * The site the user is working at, kept per browser in localStorage so it
 * survives reloads, and shared by every page through this hook.
 */

const key = (businessId: string) => `tamp-tally.site.${businessId}`;
const listeners = new Set<() => void>();

function subscribe(listener: () => void) {
  listeners.add(listener);
  const onStorage = (e: StorageEvent) => {
    if (e.key?.startsWith('tamp-tally.site.')) listener();
  };
  window.addEventListener('storage', onStorage);
  return () => {
    listeners.delete(listener);
    window.removeEventListener('storage', onStorage);
  };
}

function read(businessId: string): string | null {
  try {
    return localStorage.getItem(key(businessId));
  } catch {
    return null;
  }
}

/** The stored site id for this business (may name a site since removed; check against the list). */
export function useStoredSiteId(businessId: string | undefined): [string | null, (siteId: string) => void] {
  const siteId = useSyncExternalStore(subscribe, () => (businessId ? read(businessId) : null), () => null);
  const setSiteId = useCallback(
    (id: string) => {
      if (!businessId) return;
      try {
        localStorage.setItem(key(businessId), id);
      } catch {
        // Private browsing may refuse storage; the choice then lasts for this page only.
      }
      listeners.forEach((l) => l());
    },
    [businessId],
  );
  return [siteId, setSiteId];
}
