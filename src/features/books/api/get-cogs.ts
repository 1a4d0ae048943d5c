import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { booksKey } from './keys';
import type { CogsReport, TrendMonth } from './types';

export const cogsQueryOptions = (month: string, siteId: string | null) =>
  queryOptions({
    queryKey: [...booksKey, 'cogs', month, siteId] as const,
    queryFn: () => apiClient.get<CogsReport>(paths.api.cogs(month, siteId)),
    placeholderData: keepPreviousData,
  });

export function useCogs(month: string, siteId: string | null) {
  return useQuery(cogsQueryOptions(month, siteId));
}

export const cogsTrendQueryOptions = (month: string, siteId: string | null) =>
  queryOptions({
    queryKey: [...booksKey, 'trend', month, siteId] as const,
    queryFn: () => apiClient.get<{ currency: string; months: TrendMonth[] }>(paths.api.cogsTrend(month, siteId)),
  });

export function useCogsTrend(month: string, siteId: string | null) {
  return useQuery(cogsTrendQueryOptions(month, siteId));
}

export const supplierPurchasesQueryOptions = (month: string, siteId: string | null) =>
  queryOptions({
    queryKey: [...booksKey, 'suppliers', month, siteId] as const,
    queryFn: () => apiClient.get<{ currency: string; suppliers: { supplier: string; net: string }[] }>(paths.api.purchasesBySupplier(month, siteId)),
  });

export function useSupplierPurchases(month: string, siteId: string | null) {
  return useQuery(supplierPurchasesQueryOptions(month, siteId));
}
