/** Scenario sets: personal (no desk) or owned by a desk. */
import { Router, type RequestHandler } from 'express';
import type { Knex } from 'knex';
import { setCreateBody as createBody, setPatchBody as patchBody } from '../../src/contracts';
import {
  canManage,
  canWrite,
  deskSpace,
  nextVersion,
  requireDeskRole,
  setStanding,
  spacesOf,
  userSpace,
} from '../access';
import { HttpError, notFound, parseOr400 } from '../errors';

export function setsRouter(db: Knex, auth: RequestHandler) {
  const r = Router();

  r.get('/sets', auth, async (req, res) => {
    const spaces = spacesOf(req.user!);
    const rows = await db('scenario_sets as t')
      .leftJoin('desks as d', 'd.id', 't.desk_id')
      .whereIn('t.space', [...spaces.keys()])
      .where('t.deleted', false)
      .select('t.id', 't.name', 't.desk_id', 'd.name as desk_name', 't.space', 't.updated_at')
      .orderBy('t.name');
    const counts = await db('scenarios')
      .whereIn(
        'set_id',
        rows.map((t) => t.id),
      )
      .where('deleted', false)
      .groupBy('set_id')
      .select('set_id', db.raw('count(*)::int as n'));
    const n = new Map(counts.map((c) => [c.set_id, c.n as number]));
    res.json({
      sets: rows.map((t) => {
        const standing = spaces.get(t.space)!;
        return {
          id: t.id,
          name: t.name,
          deskId: t.desk_id,
          deskName: t.desk_name,
          role: standing,
          canWrite: canWrite(standing),
          canManage: canManage(standing),
          scenarios: n.get(t.id) ?? 0,
          updatedAt: new Date(t.updated_at).toISOString(),
        };
      }),
    });
  });

  r.post('/sets', auth, async (req, res) => {
    const body = parseOr400(createBody, req.body, 'body');
    // sharing is the lead's: only a lead creates a desk's sets
    if (body.deskId) await requireDeskRole(db, req.user!.id, body.deskId, ['lead']);
    const space = body.deskId ? deskSpace(body.deskId) : userSpace(req.user!.id);
    const set = await db.transaction(async (trx) => {
      const version = await nextVersion(trx, space);
      const [row] = await trx('scenario_sets')
        .insert({
          name: body.name,
          desk_id: body.deskId ?? null,
          owner_id: body.deskId ? null : req.user!.id,
          space,
          change_version: version,
          created_by: req.user!.id,
        })
        .returning(['id', 'name', 'desk_id']);
      return row;
    });
    res.status(201).json({ set: { id: set.id, name: set.name, deskId: set.desk_id } });
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
    await db.transaction(async (trx) => {
      const version = await nextVersion(trx, set.space);
      await trx('scenario_sets')
        .where({ id: set.id })
        .update({ name: body.name, change_version: version, updated_at: trx.fn.now() });
    });
    res.json({ set: { id: set.id, name: body.name, deskId: set.desk_id } });
  });

  /** Deleting a set leaves a tombstone for the set and for each of its scenarios. */
  r.delete('/sets/:setId', auth, async (req, res) => {
    const set = await managed(req.user!.id, String(req.params.setId));
    await db.transaction(async (trx) => {
      const live = await trx('scenarios').where({ set_id: set.id, deleted: false }).forUpdate();
      for (const s of live) {
        const version = await nextVersion(trx, set.space);
        await trx('scenarios')
          .where({ id: s.id })
          .update({
            revision: s.revision + 1,
            document: null,
            deleted: true,
            change_version: version,
            updated_by: req.user!.id,
            updated_at: trx.fn.now(),
          });
        await trx('scenario_revisions').insert({
          scenario_id: s.id,
          revision: s.revision + 1,
          document: null,
          deleted: true,
          author_id: req.user!.id,
        });
      }
      const version = await nextVersion(trx, set.space);
      await trx('scenario_sets')
        .where({ id: set.id })
        .update({ deleted: true, change_version: version, updated_at: trx.fn.now() });
    });
    res.json({ ok: true });
  });
  return r;
}
