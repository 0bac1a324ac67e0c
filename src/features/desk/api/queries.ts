/** The Desk feature's query keys and options over the service. */
import { queryOptions } from '@tanstack/react-query';
import { apiFetch } from '../../../api/client';
import type { Desk, Invite, Member } from '../../../contracts';

export const deskKeys = {
  all: ['service', 'desks'] as const,
  members: (deskId: string) => ['service', 'desks', deskId, 'members'] as const,
  invites: (deskId: string) => ['service', 'desks', deskId, 'invites'] as const,
};

export const desksQuery = queryOptions({
  queryKey: deskKeys.all,
  queryFn: () => apiFetch<{ desks: Desk[] }>('/desks'),
});

export const membersQuery = (deskId: string) =>
  queryOptions({
    queryKey: deskKeys.members(deskId),
    queryFn: () => apiFetch<{ members: Member[] }>(`/desks/${deskId}/members`),
  });

export const invitesQuery = (deskId: string) =>
  queryOptions({
    queryKey: deskKeys.invites(deskId),
    queryFn: () => apiFetch<{ invites: Invite[] }>(`/desks/${deskId}/invites`),
  });
