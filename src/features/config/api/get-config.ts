import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';

/** The server's explicit list of what the client may know about its setup. */
export interface PublicConfig {
  paymentsTestMode: boolean;
  devMailboxUrl: string | null;
}

export function getConfig(): Promise<PublicConfig> {
  return apiClient.get<PublicConfig>(paths.api.config());
}

export const configQueryOptions = () =>
  queryOptions({ queryKey: ['config'] as const, queryFn: getConfig, staleTime: Infinity });

export function useConfig() {
  return useQuery(configQueryOptions());
}
