/** New, rename and delete of scenario sets on the service, each followed by a sync round. */
import { useQueryClient } from '@tanstack/react-query';
import { useCallback, useState } from 'react';
import type { ApiError } from '../../../api/client';
import { deskApi } from '../../../api/desks';
import { syncNow } from '../../../sync/sync-loop';
import { libraryKeys } from '../api/queries';

export function useSetActions() {
  const qc = useQueryClient();
  const [message, setMessage] = useState<string | null>(null);
  const act = useCallback(
    async (what: () => Promise<unknown>) => {
      try {
        setMessage(null);
        await what();
        await syncNow();
        await qc.invalidateQueries({ queryKey: libraryKeys.sets });
        await qc.invalidateQueries({ queryKey: ['local'] });
        return true;
      } catch (err) {
        setMessage((err as ApiError).message);
        return false;
      }
    },
    [qc],
  );
  return {
    message,
    create: (name: string, deskId?: string) => act(() => deskApi.createSet(name, deskId)),
    rename: (setId: string, name: string) => act(() => deskApi.renameSet(setId, name)),
    remove: (setId: string) => act(() => deskApi.deleteSet(setId)),
  };
}
