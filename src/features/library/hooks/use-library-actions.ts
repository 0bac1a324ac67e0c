/**
 * What the Library does to local scenarios: create, import, delete, share into a set, fork,
 * resolve a conflict, restore a revision; each ends with the local queries refreshed and a
 * sync nudged, and says how it went.
 */
import { useQueryClient } from '@tanstack/react-query';
import { useCallback, useState } from 'react';
import { deskApi } from '../../../api/desks';
import { MOVE_VARIANT_SCALES, withScaledMoves, type ScenarioDocument } from '../../../engine/core';
import { appDb, type RemoteSet, type StoredScenario } from '../../../store/db';
import { useSaveScenario } from '../../../store/hooks';
import { parseScenarioFile } from '../../../store/scenario-files';
import { deleteScenario, putInSet, saveCopy, saveScenario } from '../../../store/scenarios';
import { keepBoth, keepMine, takeTheirs } from '../../../sync/conflicts';
import { nudgeSync, syncNow } from '../../../sync/sync-loop';

export type LibraryMessage = { ok: boolean; text: string } | null;

export function useLibraryActions(opts: {
  remoteSets: RemoteSet[];
  scenarios: StoredScenario[];
  signedIn: boolean;
}) {
  const qc = useQueryClient();
  const save = useSaveScenario();
  const [message, setMessage] = useState<LibraryMessage>(null);
  const { remoteSets, scenarios, signedIn } = opts;
  const writableSets = remoteSets.filter((s) => s.canWrite);

  const run = useCallback(
    async (what: () => Promise<unknown>, ok?: string) => {
      try {
        await what();
        if (ok) setMessage({ ok: true, text: ok });
        await qc.invalidateQueries({ queryKey: ['local'] });
        nudgeSync();
        return true;
      } catch (err) {
        setMessage({ ok: false, text: (err as Error).message });
        return false;
      }
    },
    [qc],
  );

  const personalSet = async () => {
    const own = remoteSets.find((s) => s.deskId === null && s.canWrite);
    if (own) return own.id;
    if (!signedIn) return null;
    const created = await deskApi.createSet('My scenarios');
    await syncNow();
    return created.set.id;
  };

  return {
    message,
    setMessage,
    writableSets,
    creating: save.isPending,
    create: (doc: ScenarioDocument) => run(() => save.mutateAsync(doc)),
    importFile: async (file: File) => {
      const parsed = parseScenarioFile(await file.text());
      if (!parsed.ok)
        return setMessage({ ok: false, text: `${file.name} was not imported: ${parsed.error}` });
      const ids = new Set(scenarios.map((s) => s.id));
      await run(async () => {
        // an imported scenario that is already here comes in as a copy, never over it
        for (const d of parsed.documents)
          if (ids.has(d.id)) await saveCopy(appDb(), d, null, `${d.name} (imported)`);
          else await saveScenario(appDb(), d, null);
      }, `Imported ${parsed.documents.length} scenario(s) from ${file.name}.`);
    },
    remove: (s: StoredScenario) => void run(() => deleteScenario(appDb(), s.id)),
    putInSet: (s: StoredScenario, setId: string) =>
      void run(
        () => putInSet(appDb(), s.id, setId),
        `"${s.name}" will be shared when this device syncs.`,
      ),
    /** "moves bigger" and "moves smaller" copies beside a scenario with scheduled moves */
    moveVariants: (s: StoredScenario) =>
      void run(
        async () => {
          const target = s.setId && writableSets.some((w) => w.id === s.setId) ? s.setId : null;
          for (const f of MOVE_VARIANT_SCALES) {
            const doc = { ...s.document, model: withScaledMoves(s.document.model, f) };
            await saveCopy(appDb(), doc, target, `${s.name} (moves ×${f})`);
          }
        },
        `Added "moves ×${MOVE_VARIANT_SCALES.join('" and "moves ×')}" beside "${s.name}".`,
      ),
    fork: (s: StoredScenario) =>
      void run(async () => {
        const target = await personalSet().catch(() => null);
        await saveCopy(appDb(), s.document, target, `${s.name} (fork)`);
      }, `Forked "${s.name}" into your own set.`),
    resolve: (s: StoredScenario, how: 'mine' | 'theirs' | 'both') =>
      void run(async () => {
        const db = appDb();
        if (how === 'mine') await keepMine(db, s.id);
        else if (how === 'theirs') await takeTheirs(db, s.id);
        else
          await keepBoth(
            db,
            s.id,
            writableSets.some((w) => w.id === s.setId),
          );
      }),
    restore: (s: StoredScenario, doc: ScenarioDocument) =>
      void run(
        () => saveScenario(appDb(), { ...doc, id: s.id }),
        `Restored as a new revision of "${s.name}".`,
      ),
  };
}
