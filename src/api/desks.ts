/** Desks, members, invites and sets on the sync service: their shapes and typed calls. */
import type { Role } from '../contracts';
import { apiFetch } from './client';

export type { Invite, Member, Revision, Role, ScenarioSet } from '../contracts';

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
