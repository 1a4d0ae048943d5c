import { useQueryClient } from '@tanstack/react-query';
import { setCsrfToken } from '../../../lib/api-client';
import { useContractMutation } from '../../../lib/contract';
import { logout } from '../../../shared/contract/auth';
import { meQueryOptions } from './get-me';

export function useLogout() {
  const queryClient = useQueryClient();
  return useContractMutation(logout, {
    onSettled: () => {
      setCsrfToken(null);
      queryClient.clear();
      queryClient.setQueryData(meQueryOptions().queryKey, null);
    },
  });
}
