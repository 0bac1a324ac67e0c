/** Scenario sets, personal (no desk) or owned by a desk: parse, check access, call the service. */
import { Router, type RequestHandler } from 'express';
import type { Knex } from 'knex';
import { setCreateBody as createBody, setPatchBody as patchBody } from '../../src/contracts';
import { canManage, deskSpace, requireDeskRole, setStanding, spacesOf, userSpace } from '../access';
import { HttpError, notFound, parseOr400 } from '../errors';
import * as sets from '../services/sets';

export function setsRouter(db: Knex, auth: RequestHandler) {
  const r = Router();

  r.get('/sets', auth, async (req, res) => {
    res.json({ sets: await sets.listSets(db, spacesOf(req.user!)) });
  });

  r.post('/sets', auth, async (req, res) => {
    const body = parseOr400(createBody, req.body, 'body');
    // sharing is the lead's: only a lead creates a desk's sets
    if (body.deskId) await requireDeskRole(db, req.user!.id, body.deskId, ['lead']);
    const space = body.deskId ? deskSpace(body.deskId) : userSpace(req.user!.id);
    const set = await sets.createSet(db, {
      name: body.name,
      deskId: body.deskId,
      space,
      createdBy: req.user!.id,
    });
    res.status(201).json({ set });
  });

  const managed = async (userId: string, setId: string) => {
    const access = await setStanding(db, userId, setId);
    if (!access) throw notFound('no such scenario set');
    if (!canManage(access.standing))
      throw new HttpError(403, 'forbidden', `a ${access.standing} may not manage this set`);
    return access.set;
  };

  r.patch('/sets/:setId', auth, async (req, res) => {
    const body = parseOr400(patchBody, req.body, 'body');
    const set = await managed(req.user!.id, String(req.params.setId));
    await sets.renameSet(db, set, body.name);
    res.json({ set: { id: set.id, name: body.name, deskId: set.desk_id } });
  });

  /** Deleting a set leaves a tombstone for the set and for each of its scenarios. */
  r.delete('/sets/:setId', auth, async (req, res) => {
    const set = await managed(req.user!.id, String(req.params.setId));
    await sets.deleteSet(db, set, req.user!.id);
    res.json({ ok: true });
  });
  return r;
}
