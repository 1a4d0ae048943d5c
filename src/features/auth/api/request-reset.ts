import { useMutation } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { paths } from '../../../lib/paths';

/** Always answers 202, whether or not the address has an account. */
export function requestReset(input: { email: string }): Promise<void> {
  return apiClient.post<void>(paths.api.resetRequest(), input);
}

export function useRequestReset() {
  return useMutation({ mutationFn: requestReset });
}
