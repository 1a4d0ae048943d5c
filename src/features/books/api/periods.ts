import { useContractMutation, useContractQuery } from '../../../lib/contract';
import { closePeriod, listPeriods, reopenPeriod } from '../../../shared/contract/books';
import { BOOKS_PATHS } from './books-data';

export function usePeriods() {
  return useContractQuery(listPeriods);
}

/** Closing or reopening changes every figure of the month: all books queries are refreshed. */
export function usePeriodAction(action: 'close' | 'reopen') {
  return useContractMutation(action === 'close' ? closePeriod : reopenPeriod, { invalidates: BOOKS_PATHS });
}
