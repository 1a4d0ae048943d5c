import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import type { Site } from '../../../lib/api-types';
import { paths } from '../../../lib/paths';
import { sitesQueryOptions } from './get-sites';

export function renameSite({ id, name }: { id: string; name: string }): Promise<{ site: Site }> {
  return apiClient.patch<{ site: Site }>(paths.api.site(id), { name });
}

export function useRenameSite() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: renameSite,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: sitesQueryOptions().queryKey }),
  });
}
