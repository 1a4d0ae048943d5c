import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import type { Session } from '../../../lib/api-types';
import { paths } from '../../../lib/paths';
import type { SignUpInput } from '../schemas';
import { storeSession } from './get-me';

export function signup(input: SignUpInput): Promise<Session> {
  return apiClient.post<Session>(paths.api.signup(), input);
}

export function useSignup() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signup,
    onSuccess: (session) => {
      queryClient.clear();
      storeSession(queryClient, session);
    },
  });
}
