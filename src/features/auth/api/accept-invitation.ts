import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import type { Session } from '../../../lib/api-types';
import { paths } from '../../../lib/paths';
import { storeSession } from './get-me';
import { invitationQueryOptions } from './get-invitation';

export function acceptInvitation({ token, ...body }: { token: string; name: string; password: string }): Promise<Session> {
  return apiClient.post<Session>(paths.api.acceptInvitation(token), body);
}

export function useAcceptInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: acceptInvitation,
    onSuccess: (session, { token }) => {
      queryClient.clear();
      storeSession(queryClient, session);
      queryClient.removeQueries({ queryKey: invitationQueryOptions(token).queryKey });
    },
  });
}
