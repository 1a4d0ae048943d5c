import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import type { Role } from '../../../lib/api-types';
import { paths } from '../../../lib/paths';

export interface Member {
  id: string;
  email: string;
  name: string;
  role: Role;
}

export interface Invitation {
  id: string;
  email: string;
  role: Role;
  expiresAt: string;
}

export interface Team {
  members: Member[];
  invitations: Invitation[];
}

export function getTeam(): Promise<Team> {
  return apiClient.get<Team>(paths.api.team());
}

export const teamQueryOptions = () => queryOptions({ queryKey: ['team'] as const, queryFn: getTeam });

export function useTeam() {
  return useQuery(teamQueryOptions());
}
