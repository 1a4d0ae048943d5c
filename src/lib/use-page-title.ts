import { useEffect } from 'react';

/** Sets document.title to "<Page> · Tamp & Tally". */
export function usePageTitle(page: string | undefined): void {
  useEffect(() => {
    document.title = page ? `${page} · Tamp & Tally` : 'Tamp & Tally';
  }, [page]);
}
