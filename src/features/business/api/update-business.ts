import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import type { Business } from '../../../lib/api-types';
import { paths } from '../../../lib/paths';
import { businessQueryOptions } from './get-business';

export function updateBusiness(input: Partial<Omit<Business, 'id'>>): Promise<{ business: Business }> {
  return apiClient.patch<{ business: Business }>(paths.api.business(), input);
}

export function useUpdateBusiness() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateBusiness,
    onSuccess: (data) => {
      queryClient.setQueryData(businessQueryOptions().queryKey, data);
      return queryClient.invalidateQueries({ queryKey: businessQueryOptions().queryKey });
    },
  });
}
