import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import type { Site } from '../../../lib/api-types';
import { paths } from '../../../lib/paths';
import { sitesQueryOptions } from './get-sites';

export function createSite(input: { name: string }): Promise<{ site: Site }> {
  return apiClient.post<{ site: Site }>(paths.api.sites(), input);
}

export function useCreateSite() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createSite,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: sitesQueryOptions().queryKey }),
  });
}
