import { useQuery, useQueryClient } from '@tanstack/react-query';
import { useMemo, useRef, useState, type FormEvent } from 'react';
import { deskApi } from '../../../api/desks';
import { meQuery } from '../../../api/session';
import { Notice } from '../../../components/Notice';
import { ScenarioGroup, type RowActions } from './ScenarioGroup';
import { SetsPanel } from './SetsPanel';
import { newScenario } from '../../../engine/core';
import { appDb } from '../../../store/db';
import { localScenariosQuery, remoteSetsQuery, useSaveScenario } from '../../../store/hooks';
import {
  parseScenarioFile,
  scenarioFileName,
  scenarioFileText,
} from '../../../store/scenario-files';
import { deleteScenario, putInSet, saveCopy, saveScenario } from '../../../store/scenarios';
import { keepBoth, keepMine, takeTheirs } from '../../../sync/conflicts';
import { nudgeSync, syncNow } from '../../../sync/sync-loop';

const today = () => new Date().toISOString().slice(0, 10);
type Sort = 'edited' | 'name' | 'state';
const STATE_ORDER = { conflict: 0, pending: 1, local: 2, synced: 3 } as const;

function download(name: string, text: string) {
  const url = URL.createObjectURL(new Blob([text], { type: 'application/json' }));
  const a = document.createElement('a');
  a.href = url;
  a.download = name;
  a.click();
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}

export function LibraryPage() {
  const scenarios = useQuery(localScenariosQuery);
  const remoteSets = useQuery(remoteSetsQuery);
  const me = useQuery(meQuery);
  const qc = useQueryClient();
  const save = useSaveScenario();
  const [name, setName] = useState('');
  const [filter, setFilter] = useState('');
  const [sort, setSort] = useState<Sort>('edited');
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  const fileInput = useRef<HTMLInputElement>(null);
  const signedIn = Boolean(me.data);

  const groups = useMemo(() => {
    const needle = filter.trim().toLowerCase();
    const list = (scenarios.data ?? [])
      .filter(
        (s) =>
          !needle ||
          `${s.name} ${s.document.notes ?? ''} ${s.document.model.kind}`
            .toLowerCase()
            .includes(needle),
      )
      .sort((a, b) =>
        sort === 'name'
          ? a.name.localeCompare(b.name)
          : sort === 'state'
            ? STATE_ORDER[a.syncState] - STATE_ORDER[b.syncState] || b.updatedAt - a.updatedAt
            : b.updatedAt - a.updatedAt,
      );
    const sets = [...(remoteSets.data ?? [])].sort((a, b) => a.name.localeCompare(b.name));
    return {
      device: list.filter((s) => s.setId === null || !sets.some((t) => t.id === s.setId)),
      sets: sets.map((set) => ({ set, scenarios: list.filter((s) => s.setId === set.id) })),
    };
  }, [scenarios.data, remoteSets.data, filter, sort]);
  const writableSets = (remoteSets.data ?? []).filter((s) => s.canWrite);

  const run = async (what: () => Promise<unknown>, ok?: string) => {
    try {
      await what();
      if (ok) setMessage({ ok: true, text: ok });
      await qc.invalidateQueries({ queryKey: ['local'] });
      nudgeSync();
    } catch (err) {
      setMessage({ ok: false, text: (err as Error).message });
    }
  };
  const personalSet = async () => {
    const own = (remoteSets.data ?? []).find((s) => s.deskId === null && s.canWrite);
    if (own) return own.id;
    if (!signedIn) return null;
    const created = await deskApi.createSet('My scenarios');
    await syncNow();
    return created.set.id;
  };
  const actions: RowActions = {
    remove: (s) => void run(() => deleteScenario(appDb(), s.id)),
    putInSet: (s, setId) =>
      void run(
        () => putInSet(appDb(), s.id, setId),
        `"${s.name}" will be shared when this device syncs.`,
      ),
    fork: (s) =>
      void run(async () => {
        const target = await personalSet().catch(() => null);
        await saveCopy(appDb(), s.document, target, `${s.name} (fork)`);
      }, `Forked "${s.name}" into your own set.`),
    resolve: (s, how) =>
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
    exportFile: (s) => download(scenarioFileName(s.name), scenarioFileText([s.document])),
    restore: (s, doc) =>
      void run(
        () => saveScenario(appDb(), { ...doc, id: s.id }),
        `Restored as a new revision of "${s.name}".`,
      ),
  };

  const create = async (e: FormEvent) => {
    e.preventDefault();
    const trimmed = name.trim();
    if (!trimmed) return setMessage({ ok: false, text: 'Give the scenario a name.' });
    await run(async () => {
      await save.mutateAsync(newScenario(crypto.randomUUID(), trimmed, today()));
      setName('');
    });
  };
  const importFile = async (file: File) => {
    const parsed = parseScenarioFile(await file.text());
    if (!parsed.ok)
      return setMessage({ ok: false, text: `${file.name} was not imported: ${parsed.error}` });
    const ids = new Set((scenarios.data ?? []).map((s) => s.id));
    await run(async () => {
      // an imported scenario that is already here comes in as a copy, never over it
      for (const d of parsed.documents)
        if (ids.has(d.id)) await saveCopy(appDb(), d, null, `${d.name} (imported)`);
        else await saveScenario(appDb(), d, null);
    }, `Imported ${parsed.documents.length} scenario(s) from ${file.name}.`);
  };

  return (
    <section aria-labelledby="library-title" className="space-y-6">
      <h1 id="library-title" className="text-2xl font-semibold">
        Library
      </h1>
      <div className="flex flex-wrap items-end gap-3">
        <form onSubmit={create} className="flex items-end gap-2">
          <label className="flex flex-col gap-1 text-sm">
            <span className="text-muted">New scenario</span>
            <input
              value={name}
              onChange={(e) => setName(e.target.value)}
              placeholder="e.g. Weekly crash ladder"
              className="w-64 rounded-md border border-rule bg-panel px-3 py-1.5 text-[15px]"
            />
          </label>
          <button
            type="submit"
            disabled={save.isPending}
            className="rounded-md bg-teal px-4 py-1.5 font-semibold text-paper disabled:opacity-60"
          >
            Create
          </button>
        </form>
        <label className="flex flex-col gap-1 text-sm">
          <span className="text-muted">Filter</span>
          <input
            value={filter}
            onChange={(e) => setFilter(e.target.value)}
            placeholder="name, notes or model"
            aria-label="Filter scenarios"
            className="w-56 rounded-md border border-rule bg-panel px-3 py-1.5"
          />
        </label>
        <label className="flex flex-col gap-1 text-sm">
          <span className="text-muted">Sort</span>
          <select
            value={sort}
            onChange={(e) => setSort(e.target.value as Sort)}
            aria-label="Sort scenarios"
            className="rounded-md border border-rule bg-panel px-2 py-1.5"
          >
            <option value="edited">last edited</option>
            <option value="name">name</option>
            <option value="state">sync state</option>
          </select>
        </label>
        <button
          type="button"
          className="rounded-md border border-rule px-3 py-1.5 text-sm"
          onClick={() => fileInput.current?.click()}
        >
          Import file…
        </button>
        <input
          ref={fileInput}
          type="file"
          accept=".json,application/json"
          className="hidden"
          aria-label="Scenario file"
          onChange={(e) => {
            const f = e.target.files?.[0];
            if (f) void importFile(f);
            e.target.value = '';
          }}
        />
      </div>
      <Notice message={message} />
      {scenarios.isPending ? (
        <p className="text-muted">Loading scenarios…</p>
      ) : scenarios.isError ? (
        <p role="alert" className="text-stressed">
          The local database could not be read: {scenarios.error.message}
        </p>
      ) : (
        <>
          {groups.sets.map(({ set, scenarios: list }) => (
            <ScenarioGroup
              key={set.id}
              title={set.name}
              set={set}
              scenarios={list}
              writableSets={writableSets}
              signedIn={signedIn}
              actions={actions}
            />
          ))}
          <ScenarioGroup
            title="On this device only"
            set={null}
            scenarios={groups.device}
            writableSets={writableSets}
            signedIn={signedIn}
            actions={actions}
          />
        </>
      )}
      {signedIn && !me.data?.offline && <SetsPanel desks={me.data?.desks ?? []} />}
    </section>
  );
}
