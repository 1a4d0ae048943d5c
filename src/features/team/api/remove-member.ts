import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { teamQueryOptions } from './get-team';

export function removeMember(id: string): Promise<void> {
  return apiClient.delete(paths.api.teamMember(id));
}

export function useRemoveMember() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: removeMember,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: teamQueryOptions().queryKey }),
  });
}
