import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import type { Role } from '../../../lib/api-types';
import { paths } from '../../../lib/paths';
import { teamQueryOptions, type Member } from './get-team';

export function changeRole({ id, role }: { id: string; role: Role }): Promise<{ member: Member }> {
  return apiClient.patch<{ member: Member }>(paths.api.teamMember(id), { role });
}

export function useChangeRole() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: changeRole,
    // Refetch on failure too, so the select shows the role the server kept.
    onSettled: () => queryClient.invalidateQueries({ queryKey: teamQueryOptions().queryKey }),
  });
}
