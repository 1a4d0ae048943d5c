import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import type { Role } from '../../../lib/api-types';
import { paths } from '../../../lib/paths';
import { teamQueryOptions, type Invitation } from './get-team';

export function inviteMember(input: { email: string; role: Role }): Promise<{ invitation: Invitation }> {
  return apiClient.post<{ invitation: Invitation }>(paths.api.teamInvitations(), input);
}

export function useInviteMember() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: inviteMember,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: teamQueryOptions().queryKey }),
  });
}
