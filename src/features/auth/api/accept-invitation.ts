import { useQueryClient } from '@tanstack/react-query';
import { contractKey, useContractMutation } from '../../../lib/contract';
import { acceptInvitation, invitation } from '../../../shared/contract/auth';
import { startSession } from './get-me';

export function useAcceptInvitation() {
  const queryClient = useQueryClient();
  return useContractMutation(acceptInvitation, {
    onSuccess: (session, { params }) => {
      startSession(queryClient, session);
      queryClient.removeQueries({ queryKey: contractKey(invitation, { params }) });
    },
  });
}
