import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { meQueryOptions } from './get-me';

export function completeReset(input: { token: string; password: string }): Promise<void> {
  return apiClient.post<void>(paths.api.resetComplete(), input);
}

export function useCompleteReset() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: completeReset,
    // A reset may end other sessions; ask again who is signed in.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: meQueryOptions().queryKey }),
  });
}
