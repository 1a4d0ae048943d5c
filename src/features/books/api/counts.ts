import { useContractMutation, useContractQuery } from '../../../lib/contract';
import { finishCount, getCountSheet, listCounts, saveCountLine, startCount } from '../../../shared/contract/books';
import { BOOKS_PATHS } from './books-data';

/** The site's counts (values only for roles that read costs). */
export function useCounts(siteId: string | undefined) {
  return useContractQuery(listCounts, { query: { siteId } }, { enabled: Boolean(siteId) });
}

export function useCountSheet(id: string) {
  return useContractQuery(getCountSheet, { params: { id } });
}

export function useStartCount() {
  return useContractMutation(startCount, { invalidates: BOOKS_PATHS });
}

/** Saves one pack's count as soon as it is typed (the sheet is refreshed quietly afterwards). */
export function useSaveCountLine() {
  return useContractMutation(saveCountLine, { invalidates: [getCountSheet] });
}

export function useFinishCount() {
  return useContractMutation(finishCount, { invalidates: BOOKS_PATHS });
}
