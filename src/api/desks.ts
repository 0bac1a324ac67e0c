/** Desks, members, invites and sets on the sync service: their shapes and typed calls. */
import { apiFetch } from './client';

export type Role = 'lead' | 'trader' | 'analyst';
export interface Member {
  id: string;
  name: string;
  email: string;
  role: Role;
  joinedAt: string;
}
export interface Invite {
  id: string;
  email: string;
  role: Role;
  expiresAt: string;
}
export interface ServiceSet {
  id: string;
  name: string;
  deskId: string | null;
  deskName: string | null;
  role: 'owner' | Role;
  canWrite: boolean;
  canManage: boolean;
  scenarios: number;
}
export interface Revision {
  revision: number;
  document: unknown;
  deleted: boolean;
  author: string | null;
  createdAt: string;
}

const send = <T>(method: string, path: string, body?: unknown) =>
  apiFetch<T>(path, { method, body: body === undefined ? undefined : JSON.stringify(body) });

export const deskApi = {
  create: (name: string) => send<{ desk: { id: string } }>('POST', '/desks', { name }),
  setRole: (deskId: string, userId: string, role: Role) =>
    send('PATCH', `/desks/${deskId}/members/${userId}`, { role }),
  remove: (deskId: string, userId: string) => send('DELETE', `/desks/${deskId}/members/${userId}`),
  invite: (deskId: string, email: string, role: Role) =>
    send('POST', `/desks/${deskId}/invites`, { email, role }),
  revoke: (deskId: string, inviteId: string) =>
    send('DELETE', `/desks/${deskId}/invites/${inviteId}`),
  createSet: (name: string, deskId?: string) =>
    send<{ set: { id: string } }>('POST', '/sets', { name, ...(deskId ? { deskId } : {}) }),
  renameSet: (setId: string, name: string) => send('PATCH', `/sets/${setId}`, { name }),
  deleteSet: (setId: string) => send('DELETE', `/sets/${setId}`),
};
