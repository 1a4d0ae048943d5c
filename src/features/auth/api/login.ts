import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import type { Session } from '../../../lib/api-types';
import { paths } from '../../../lib/paths';
import type { SignInInput } from '../schemas';
import { storeSession } from './get-me';

export function login(input: SignInInput): Promise<Session> {
  return apiClient.post<Session>(paths.api.login(), input);
}

export function useLogin() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: login,
    onSuccess: (session) => {
      // Whatever was cached belonged to the previous visitor.
      queryClient.clear();
      storeSession(queryClient, session);
    },
  });
}
