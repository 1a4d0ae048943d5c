import { useQueryClient } from '@tanstack/react-query';
import { useContractMutation } from '../../../lib/contract';
import { login } from '../../../shared/contract/auth';
import { startSession } from './get-me';

export function useLogin() {
  const queryClient = useQueryClient();
  return useContractMutation(login, { onSuccess: (session) => startSession(queryClient, session) });
}
