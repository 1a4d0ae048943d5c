import { useContractMutation, useContractQuery } from '../../../lib/contract';
import { deleteWaste, listWaste, recordWaste, wasteChoices } from '../../../shared/contract/books';
import { BOOKS_PATHS } from './books-data';

/** The month's waste (values and the total only for roles that read costs). */
export function useWaste(siteId: string | undefined, month: string) {
  return useContractQuery(listWaste, { query: { siteId, month } }, { enabled: Boolean(siteId) });
}

/** What waste can be recorded against (no costs: baristas read it too). */
export function useWasteChoices(enabled: boolean) {
  return useContractQuery(wasteChoices, {}, { enabled });
}

export function useRecordWaste() {
  return useContractMutation(recordWaste, { invalidates: BOOKS_PATHS });
}

export function useDeleteWaste() {
  return useContractMutation(deleteWaste, { invalidates: BOOKS_PATHS });
}
