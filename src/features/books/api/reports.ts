import { keepPreviousData } from '@tanstack/react-query';
import { useContractQuery } from '../../../lib/contract';
import { cogsReport, cogsTrend, purchasesBySupplier } from '../../../shared/contract/books';

const scope = (month: string, siteId: string | null) => ({ query: { month, siteId: siteId ?? undefined } });

/** The month's cost of goods at a site or (siteId null) every site. */
export function useCogs(month: string, siteId: string | null, enabled = true) {
  return useContractQuery(cogsReport, scope(month, siteId), { placeholderData: keepPreviousData, enabled });
}

export function useCogsTrend(month: string, siteId: string | null) {
  return useContractQuery(cogsTrend, scope(month, siteId));
}

export function useSupplierPurchases(month: string, siteId: string | null) {
  return useContractQuery(purchasesBySupplier, scope(month, siteId));
}
