import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import type { Role } from '../../../lib/api-types';
import { paths } from '../../../lib/paths';

export interface InvitationPreview {
  email: string;
  role: Role;
  businessName: string;
}

export function getInvitation(token: string): Promise<InvitationPreview> {
  return apiClient.get<InvitationPreview>(paths.api.invitation(token));
}

export const invitationQueryOptions = (token: string) =>
  queryOptions({
    queryKey: ['auth', 'invitation', token] as const,
    queryFn: () => getInvitation(token),
    retry: false,
  });

export function useInvitation(token: string) {
  return useQuery({ ...invitationQueryOptions(token), enabled: token.length > 0 });
}
