/** Sync: push mutations, pull changes since a cursor, a scenario's revision history. */
import { Router, type RequestHandler } from 'express';
import type { Knex } from 'knex';
import { isUuid, setStanding } from '../access';
import { HttpError, notFound, parseOr400 } from '../errors';
import type { ChangeEvents } from '../sync/events';
import { pullQuery, pushBody, type MutationResult } from '../../src/contracts';
import { applyPush } from '../sync/push-batch';
import { pull } from '../sync/pull';
import { listRevisions, setOfScenario } from '../services/revisions';

export function syncRouter(db: Knex, auth: RequestHandler, events?: ChangeEvents): Router {
  const r = Router();
  r.get('/sync/events', auth, async (req, res) => {
    if (!events) throw new HttpError(503, 'no-live-updates', 'live updates are off; poll instead');
    await events.subscribe(req, res, req.sessionIssuedAtMs ?? 0);
  });
  r.post('/sync/push', auth, async (req, res) => {
    const body = parseOr400(pushBody, req.body, 'body');
    // one transaction; in order: a later mutation of the same scenario builds on the earlier one
    const results: MutationResult[] = await applyPush(db, req.user!.id, body.mutations);
    res.json({ results });
  });

  r.get('/sync/pull', auth, async (req, res) => {
    const q = parseOr400(pullQuery, req.query, 'query');
    res.json(await pull(db, req.user!, q.since, undefined, q.books === '1'));
  });

  r.get('/scenarios/:id/revisions', auth, async (req, res) => {
    const id = String(req.params.id);
    if (!isUuid(id)) throw notFound('no such scenario');
    const setId = await setOfScenario(db, id);
    // a scenario in a set the caller cannot see answers as if it did not exist
    if (!setId || !(await setStanding(db, req.user!.id, setId))) throw notFound('no such scenario');
    res.json({ revisions: await listRevisions(db, id) });
  });
  return r;
}
