import { useContractMutation, useContractQuery } from '../../../lib/contract';
import { saveSalesDay, salesDay, salesDays } from '../../../shared/contract/books';
import { BOOKS_PATHS } from './books-data';

export function useSalesDays(siteId: string | undefined, month: string) {
  return useContractQuery(salesDays, { query: { siteId: siteId ?? '', month } }, { enabled: Boolean(siteId) });
}

/** A day at a site as the hand-entry form loads it. */
export function useSalesDay(siteId: string, soldOn: string | null) {
  return useContractQuery(salesDay, { params: { soldOn: soldOn ?? '' }, query: { siteId } }, { enabled: Boolean(soldOn) });
}

/** Replaces the day's hand-entered lines (imported lines stay as they are). */
export function useSaveSalesDay() {
  return useContractMutation(saveSalesDay, { invalidates: BOOKS_PATHS });
}
