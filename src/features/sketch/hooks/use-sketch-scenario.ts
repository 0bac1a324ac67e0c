/**
 * The scenario being sketched: loaded from the device (by `?scenario=`, else the most recently
 * edited, else the demo desk's), edited in memory, and saved back to IndexedDB shortly after
 * each valid change, so a reload or a crash loses at most the last fraction of a second. When a
 * sync brings a colleague's revision of the open scenario and nothing here is waiting to be
 * saved, the page follows it.
 */
import { useQuery, useQueryClient } from '@tanstack/react-query';
import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { useSearchParams } from 'react-router';
import {
  canonicalJson,
  type FieldIssue,
  type ScenarioDocument,
  parseScenario,
  newScenario,
} from '../../../engine/core';
import { localScenarioQuery } from '../../../store/hooks';
import { appDb } from '../../../store/db';
import { seedDemoScenariosOnce } from '../../../store/demo-seed';
import { getScenario, listScenarios, saveScenario } from '../../../store/scenarios';
import { nudgeSync } from '../../../sync/sync-loop';

/** One array for "no issues", so what depends on it holds still while the document is valid. */
const NO_ISSUES: FieldIssue[] = [];

/** Each document is checked once: the edit and the page's issues list ask about the same one. */
const checked = new WeakMap<ScenarioDocument, ReturnType<typeof parseScenario>>();
function checkScenario(doc: ScenarioDocument): ReturnType<typeof parseScenario> {
  let result = checked.get(doc);
  if (!result) {
    result = parseScenario(doc);
    checked.set(doc, result);
  }
  return result;
}

export type SaveState = 'loading' | 'saved' | 'saving' | 'unsaved' | 'invalid' | 'error';

async function initialScenario(requested: string | null): Promise<ScenarioDocument> {
  const db = appDb();
  if (requested) {
    const found = await getScenario(db, requested);
    if (found) return found.document;
  }
  await seedDemoScenariosOnce();
  const all = await listScenarios(db);
  if (all.length > 0) return all[0].document;
  // every scenario was deleted: start a fresh one
  const fresh = newScenario(
    crypto.randomUUID(),
    'New scenario',
    new Date().toISOString().slice(0, 10),
  );
  await saveScenario(db, fresh);
  return fresh;
}

export function useSketchScenario() {
  const [params, setParams] = useSearchParams();
  const requested = params.get('scenario');
  const [doc, setDoc] = useState<ScenarioDocument | null>(null);
  const [saveState, setSaveState] = useState<SaveState>('loading');
  const [loadError, setLoadError] = useState<string | null>(null);
  const qc = useQueryClient();
  const timer = useRef<ReturnType<typeof setTimeout> | undefined>(undefined);
  const pending = useRef<ScenarioDocument | null>(null);

  useEffect(() => {
    let live = true;
    initialScenario(requested)
      .then((d) => {
        if (!live) return;
        setDoc(d);
        setSaveState('saved');
        if (requested !== d.id) setParams({ scenario: d.id }, { replace: true });
      })
      .catch((e: Error) => live && setLoadError(e.message));
    return () => {
      live = false;
    };
    // load once per requested id
    // eslint-disable-next-line react-hooks/exhaustive-deps -- setParams is stable in practice; reloading on it would loop
  }, [requested]);

  // the stored copy, refreshed after each sync: a newer server revision (a colleague's, pulled)
  // replaces the page's copy when the page has nothing unsaved. Only the revision counts as
  // news: a local save keeps it, so a late read of an older copy is never taken for one.
  const stored = useQuery({ ...localScenarioQuery(doc?.id ?? ''), enabled: doc !== null });
  const seen = useRef<{ id: string; revision: number } | null>(null);
  useEffect(() => {
    const there = stored.data;
    if (!there || !doc || there.document.id !== doc.id) return;
    const last = seen.current?.id === doc.id ? seen.current.revision : null;
    if (last === null || there.revision > last)
      seen.current = { id: doc.id, revision: there.revision };
    if (last === null || there.revision <= last || there.syncState !== 'synced') return;
    if (pending.current || saveState !== 'saved') return;
    if (canonicalJson(there.document) !== canonicalJson(doc)) setDoc(there.document);
    // only a new stored copy is news
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [stored.data]);

  const flush = useCallback(async () => {
    const d = pending.current;
    if (!d) return;
    pending.current = null;
    setSaveState('saving');
    try {
      const saved = await saveScenario(appDb(), d);
      // the stored copy is this page's own: no reason to adopt it back
      qc.setQueryData(localScenarioQuery(saved.id).queryKey, saved);
      nudgeSync();
      setSaveState(pending.current ? 'unsaved' : 'saved');
      void qc.invalidateQueries({ queryKey: ['local', 'scenarios'] });
    } catch (e) {
      setSaveState('error');
      setLoadError(`Could not save on this device: ${(e as Error).message}`);
    }
  }, [qc]);

  useEffect(() => {
    const onHide = () => void flush();
    window.addEventListener('pagehide', onHide);
    return () => {
      window.removeEventListener('pagehide', onHide);
      void flush();
    };
  }, [flush]);

  const issues = useMemo(() => {
    if (!doc) return NO_ISSUES;
    const r = checkScenario(doc);
    return r.ok ? NO_ISSUES : r.issues;
  }, [doc]);

  const update = useCallback(
    (next: ScenarioDocument) => {
      setDoc(next);
      if (!checkScenario(next).ok) {
        setSaveState('invalid');
        return;
      }
      pending.current = next;
      setSaveState('unsaved');
      clearTimeout(timer.current);
      timer.current = setTimeout(() => void flush(), 300);
    },
    [flush],
  );

  return { doc, update, saveState, issues, loadError };
}
