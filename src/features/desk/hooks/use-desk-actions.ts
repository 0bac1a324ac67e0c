/**
 * What a desk's members do on the service: create a desk, invite, change a role, remove a
 * member, withdraw an invite. Each says how it went and refreshes the service's queries.
 */
import { useQueryClient } from '@tanstack/react-query';
import { useCallback, useState } from 'react';
import type { ApiError } from '../../../api/client';
import { deskApi } from '../../../api/desks';
import type { Role } from '../../../contracts';

export function useDeskActions() {
  const qc = useQueryClient();
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  const act = useCallback(
    async <T>(what: () => Promise<T>, ok: string): Promise<T | null> => {
      try {
        const out = await what();
        setMessage({ ok: true, text: ok });
        await qc.invalidateQueries({ queryKey: ['service'] });
        return out;
      } catch (err) {
        setMessage({ ok: false, text: (err as ApiError).message });
        return null;
      }
    },
    [qc],
  );
  return {
    message,
    create: (name: string) => act(() => deskApi.create(name), 'Desk created; you are its lead.'),
    invite: (deskId: string, email: string, role: Role) =>
      act(() => deskApi.invite(deskId, email, role), `Invite sent to ${email}.`),
    setRole: (deskId: string, userId: string, role: Role) =>
      act(() => deskApi.setRole(deskId, userId, role), 'Role changed.'),
    remove: (deskId: string, userId: string, ok: string) =>
      act(() => deskApi.remove(deskId, userId), ok),
    revoke: (deskId: string, inviteId: string) =>
      act(() => deskApi.revoke(deskId, inviteId), 'Invite withdrawn.'),
  };
}
