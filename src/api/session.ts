/**
 * The signed-in user: read from `/api/me` (the session is an httpOnly cookie, so it survives
 * reloads); remembered on the device so the app still knows whose work it holds while offline.
 */
import { queryOptions, useMutation, useQueryClient } from '@tanstack/react-query';
import { ApiError, apiFetch } from './client';

export interface SessionUser {
  id: string;
  email: string;
  name: string;
}
export interface DeskMembership {
  id: string;
  name: string;
  role: 'lead' | 'trader' | 'analyst';
}
export interface Me {
  user: SessionUser;
  desks: DeskMembership[];
}

const REMEMBERED = 'saltation.session.user';

export function rememberedUser(): SessionUser | null {
  try {
    return JSON.parse(localStorage.getItem(REMEMBERED) ?? 'null') as SessionUser | null;
  } catch {
    return null;
  }
}

/**
 * null: signed out. While the service cannot be reached, the remembered user. A device that
 * remembers no user has no session (signing in remembers one), so it does not ask.
 */
export const meQuery = queryOptions({
  queryKey: ['service', 'me'],
  queryFn: async (): Promise<(Me & { offline?: boolean }) | null> => {
    if (!rememberedUser()) return null;
    try {
      const me = await apiFetch<Me>('/me');
      localStorage.setItem(REMEMBERED, JSON.stringify(me.user));
      return me;
    } catch (e) {
      if (e instanceof ApiError && e.status === 401) {
        localStorage.removeItem(REMEMBERED);
        return null;
      }
      const user = rememberedUser();
      return user ? { user, desks: [], offline: true } : null;
    }
  },
  retry: false,
  staleTime: 30_000,
});

const post = <T>(path: string, body: unknown) =>
  apiFetch<T>(path, { method: 'POST', body: JSON.stringify(body) });

export function useSignIn() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (b: { email: string; password: string }) =>
      post<{ user: SessionUser; token: string }>('/auth/signin', b),
    onSuccess: ({ user }) => {
      localStorage.setItem(REMEMBERED, JSON.stringify(user));
      return qc.invalidateQueries({ queryKey: ['service'] });
    },
  });
}

export function useRegister() {
  return useMutation({
    mutationFn: (b: { email: string; password: string; name: string }) =>
      post<{ user: SessionUser }>('/auth/register', b),
  });
}

export function useSignOut() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => post<{ ok: true }>('/auth/signout', {}),
    onSettled: () => {
      localStorage.removeItem(REMEMBERED);
      qc.setQueryData(meQuery.queryKey, null);
      void qc.invalidateQueries({ queryKey: ['service'] });
    },
  });
}

export const changePassword = (b: { currentPassword: string; newPassword: string }) =>
  post<{ ok: true }>('/auth/password', b);
export const requestReset = (email: string) =>
  post<{ message: string }>('/auth/reset-request', { email });
export const resetPassword = (b: { token: string; newPassword: string }) =>
  post<{ ok: true }>('/auth/reset', b);

export function useChangePassword() {
  return useMutation({ mutationFn: changePassword });
}

export function useRequestReset() {
  return useMutation({ mutationFn: requestReset });
}

export function useResetPassword() {
  return useMutation({ mutationFn: resetPassword });
}

/** Joins the desk of an invite link; the service's queries are refreshed after. */
export function useAcceptInvite() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (token: string) =>
      post<{ desk: { name: string; role: string } }>('/invites/accept', { token }),
    onSuccess: () => void qc.invalidateQueries({ queryKey: ['service'] }),
  });
}
