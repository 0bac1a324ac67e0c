import { useQuery } from '@tanstack/react-query';
import { useRef, useState, type FormEvent } from 'react';
import { meQuery } from '../../../api/session';
import { Notice } from '../../../components/Notice';
import { newScenario } from '../../../engine/core';
import { localScenariosQuery, remoteSetsQuery } from '../../../store/hooks';
import { scenarioFileName, scenarioFileText } from '../../../store/scenario-files';
import { useLibraryActions } from '../hooks/use-library-actions';
import { useScenarioList, type ScenarioSort as Sort } from '../hooks/use-scenario-list';
import { ScenarioGroup, type RowActions } from './ScenarioGroup';
import { SetsPanel } from './SetsPanel';

const today = () => new Date().toISOString().slice(0, 10);

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
  const [name, setName] = useState('');
  const [filter, setFilter] = useState('');
  const [sort, setSort] = useState<Sort>('edited');
  const fileInput = useRef<HTMLInputElement>(null);
  const signedIn = Boolean(me.data);
  const groups = useScenarioList(scenarios.data, remoteSets.data, filter, sort);
  const library = useLibraryActions({
    remoteSets: remoteSets.data ?? [],
    scenarios: scenarios.data ?? [],
    signedIn,
  });
  const { message, setMessage, writableSets } = library;
  const actions: RowActions = {
    remove: library.remove,
    putInSet: library.putInSet,
    fork: library.fork,
    moveVariants: library.moveVariants,
    resolve: library.resolve,
    exportFile: (s) => download(scenarioFileName(s.name), scenarioFileText([s.document])),
    restore: library.restore,
  };

  const create = async (e: FormEvent) => {
    e.preventDefault();
    const trimmed = name.trim();
    if (!trimmed) return setMessage({ ok: false, text: 'Give the scenario a name.' });
    if (await library.create(newScenario(crypto.randomUUID(), trimmed, today()))) setName('');
  };
  const importFile = library.importFile;

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
            disabled={library.creating}
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
