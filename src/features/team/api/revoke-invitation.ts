import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { teamQueryOptions } from './get-team';

export function revokeInvitation(id: string): Promise<void> {
  return apiClient.delete(paths.api.teamInvitation(id));
}

export function useRevokeInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: revokeInvitation,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: teamQueryOptions().queryKey }),
  });
}
