/**
 * The service refuses a scenario whose valuation date is not a real calendar date (ISO 8601,
 * common practice): the push answers the mutation `invalid` with the field path, and stores
 * nothing.
 */
import { randomUUID } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { apiFixture } from '../support/api';
import { scenarioDoc } from '../support/scenario-doc';

const api = apiFixture();

describe('calendar dates on the service', () => {
  it('refuses 2026-02-30, 2026-13-45 and 2026-2-3 as valuation dates, and keeps a real one', async () => {
    const u = await api.user('dates');
    const set = await api.as(u).post('/api/sets', { name: 'Dated' });
    const setId = set.body.set.id as string;
    for (const date of ['2026-02-30', '2026-13-45', '2026-2-3']) {
      const id = randomUUID();
      const res = await api.as(u).post('/api/sync/push', {
        mutations: [
          {
            mutationId: randomUUID(),
            scenarioId: id,
            setId,
            baseRevision: 0,
            document: { ...scenarioDoc(id), valuationDate: date },
          },
        ],
      });
      expect(res.status).toBe(200);
      expect(res.body.results[0].status).toBe('invalid');
      expect(res.body.results[0].error).toMatch(/valuationDate: must be a real date YYYY-MM-DD/);
    }
    const pulled = await api.as(u).get('/api/sync/pull?since=0');
    expect(pulled.body.changes).toEqual([]);
    const id = randomUUID();
    const ok = await api.as(u).post('/api/sync/push', {
      mutations: [
        {
          mutationId: randomUUID(),
          scenarioId: id,
          setId,
          baseRevision: 0,
          document: scenarioDoc(id),
        },
      ],
    });
    expect(ok.body.results[0].status).toBe('applied');
  });

  it('answers 400 with the field path to a malformed push body', async () => {
    const u = await api.user('dates-400');
    const res = await api.as(u).post('/api/sync/push', { mutations: [{ scenarioId: 'x' }] });
    expect(res.status).toBe(400);
    expect(res.body.error.path).toMatch(/^body\.mutations\.0\./);
  });
});
