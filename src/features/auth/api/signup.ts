import { useQueryClient } from '@tanstack/react-query';
import { useContractMutation } from '../../../lib/contract';
import { signup } from '../../../shared/contract/auth';
import { startSession } from './get-me';

export function useSignup() {
  const queryClient = useQueryClient();
  return useContractMutation(signup, { onSuccess: (session) => startSession(queryClient, session) });
}
