import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient, setCsrfToken } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';
import { meQueryOptions } from './get-me';

export function logout(): Promise<void> {
  return apiClient.post<void>(paths.api.logout());
}

export function useLogout() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: logout,
    onSettled: () => {
      setCsrfToken(null);
      queryClient.clear();
      queryClient.setQueryData(meQueryOptions().queryKey, null);
    },
  });
}
