/**
 * A book shared in a desk set, through the real client sync engine (one IndexedDB per person,
 * fake-indexeddb) and the real service: a trader's offline edit reaches the lead, an analyst's
 * edit is refused and kept on the analyst's device only, and two offline edits of one book
 * surface as a conflict that the user resolves. Promises 1, 2, 6 and 7 of
 * src/contracts/sync.ts, for books as for scenarios.
 */
import 'fake-indexeddb/auto';
import { randomUUID } from 'node:crypto';
import { beforeAll, describe, expect, it } from 'vitest';
import { apiFixture, type TestUser } from '../support/api';
import { scenarioDoc } from '../support/scenario-doc';
import type { Role } from '../../src/contracts';
import { BOOK_FORMAT, type BookDocument, type Position } from '../../src/engine/book';
import { SaltationDb } from '../../src/store/db';
import { newDeskBook, saveDeskBook } from '../../src/store/desk-books';
import { saveScenario } from '../../src/store/scenarios';
import { keepMine } from '../../src/sync/conflicts';
import type { SyncTransport } from '../../src/sync/protocol';
import { syncOnce } from '../../src/sync/sync-engine';

const api = apiFixture();

interface Person {
  user: TestUser;
  db: SaltationDb;
}

const transport = (user: TestUser): SyncTransport => ({
  push: async (mutations) => (await api.as(user).post('/api/sync/push', { mutations })).body,
  pull: async (since) =>
    (await api.as(user).get(`/api/sync/pull?since=${encodeURIComponent(since)}&books=1`)).body,
});
const sync = (p: Person) => syncOnce(p.db, transport(p.user), p.user.id);

async function join(lead: TestUser, deskId: string, user: TestUser, role: Role) {
  await api.as(lead).post(`/api/desks/${deskId}/invites`, { email: user.email, role });
  const link = await api.mail().linkFor(user.email, /invites you/);
  const token = new URL(link).searchParams.get('token');
  expect((await api.as(user).post('/api/invites/accept', { token })).status).toBe(200);
}

const put = (id: string, strike: number, quantity: number): Position => ({
  id,
  type: 'put',
  strike,
  expiry: 30 / 365,
  quantity,
  multiplier: 10,
  currency: 'EUR',
});

let lead: Person;
let trader: Person;
let analyst: Person;
let setId: string;
let bookId: string;

const person = async (label: string): Promise<Person> => ({
  user: await api.user(label),
  db: new SaltationDb(`books-${label}-${randomUUID()}`),
});
const bookOf = async (p: Person) => (await p.db.deskBooks.get(bookId))!;
/** the person's copy of the book with one leg's quantity changed (an edit on their device) */
async function editLeg(p: Person, leg: string, quantity: number) {
  const b = await bookOf(p);
  const positions = b.document.positions.map((x) => (x.id === leg ? { ...x, quantity } : x));
  await saveDeskBook(p.db, { ...b.document, positions }, b.setId);
}
const quantities = async (p: Person) =>
  Object.fromEntries((await bookOf(p)).document.positions.map((x) => [x.id, x.quantity]));

beforeAll(async () => {
  lead = await person('book-lead');
  trader = await person('book-trader');
  analyst = await person('book-analyst');
  const desk = await api.as(lead.user).post('/api/desks', { name: 'Book desk' });
  const deskId = desk.body.desk.id as string;
  await join(lead.user, deskId, trader.user, 'trader');
  await join(lead.user, deskId, analyst.user, 'analyst');
  const set = await api.as(lead.user).post('/api/sets', { name: 'Desk book set', deskId });
  setId = set.body.set.id;
  // the lead shares a scenario and a book over it
  const scenarioId = randomUUID();
  await saveScenario(lead.db, scenarioDoc(scenarioId, 'Desk base'), setId);
  const book: BookDocument = {
    ...newDeskBook('Short end', [scenarioId]),
    positions: [put('P4000', 4000, -20), put('P3800', 3800, 30)],
  };
  bookId = book.id;
  await saveDeskBook(lead.db, book, setId);
  const report = await sync(lead);
  expect(report.applied).toBe(2);
  for (const p of [trader, analyst]) await sync(p);
});

describe('a book shared in a desk set (issue: books shared with the desk)', () => {
  it('reaches every member with the set, writable for the trader and read-only for the analyst', async () => {
    for (const p of [lead, trader, analyst]) {
      const b = await bookOf(p);
      expect(b).toMatchObject({ setId, revision: 1, syncState: 'synced', name: 'Short end' });
      expect(b.document.positions[0]).toMatchObject({ multiplier: 10, currency: 'EUR' });
      // the scenario it names came too, so the book can be revalued on every device
      expect(await p.db.scenarios.get(b.document.scenarioIds[0])).toBeDefined();
    }
    expect((await trader.db.remoteSets.get(setId))?.canWrite).toBe(true);
    expect((await analyst.db.remoteSets.get(setId))?.canWrite).toBe(false);
  });

  it("carries the trader's offline edit to the lead after sync, with the trader named", async () => {
    await editLeg(trader, 'P4000', -25); // offline: only on the trader's device
    expect((await bookOf(trader)).syncState).toBe('pending');
    await sync(lead);
    expect((await quantities(lead)).P4000).toBe(-20);
    // back online
    expect((await sync(trader)).applied).toBe(1);
    await sync(lead);
    const seen = await bookOf(lead);
    expect(seen.revision).toBe(2);
    expect(seen.updatedBy).toBe('book-trader');
    expect((await quantities(lead)).P4000).toBe(-25);
  });

  it("refuses the analyst's edit and keeps it on the analyst's device only", async () => {
    await sync(analyst);
    await editLeg(analyst, 'P3800', 99);
    const report = await sync(analyst);
    expect(report.denied).toBe(1);
    // the service's copy is back in the desk book; the analyst's version is a device-only book
    expect((await quantities(analyst)).P3800).toBe(30);
    expect((await bookOf(analyst)).syncState).toBe('synced');
    const kept = await analyst.db.sets.toArray();
    expect(kept.map((b) => b.name)).toEqual(['Short end (my edit)']);
    expect(kept[0].positions.find((x) => x.id === 'P3800')?.quantity).toBe(99);
    // and straight at the service: denied, with the server's copy
    const direct = await api.as(analyst.user).post('/api/sync/push', {
      mutations: [
        {
          mutationId: randomUUID(),
          scenarioId: bookId,
          kind: 'book',
          setId,
          baseRevision: 2,
          document: { ...(await bookOf(analyst)).document, name: 'Renamed by the analyst' },
        },
      ],
    });
    expect(direct.body.results[0]).toMatchObject({ status: 'denied' });
    expect(direct.body.results[0].error).toMatch(/analyst may not change books/);
    expect(direct.body.results[0].current.revision).toBe(2);
  });

  it('surfaces two offline edits of one book as a conflict, and keeps mine on request', async () => {
    await sync(trader);
    await sync(lead);
    // both offline, each changing the book
    await editLeg(trader, 'P3800', 35);
    await editLeg(lead, 'P4000', -30);
    expect((await sync(trader)).applied).toBe(1); // first back: revision 3
    const report = await sync(lead);
    expect(report.conflicts).toBe(1);
    const clash = await bookOf(lead);
    expect(clash.syncState).toBe('conflict');
    expect(clash.conflict?.revision).toBe(3);
    expect(
      (clash.conflict?.document as BookDocument).positions.find((x) => x.id === 'P3800'),
    ).toMatchObject({ quantity: 35 });
    // nothing overwrote the lead's edit while the conflict waits
    expect((await quantities(lead)).P4000).toBe(-30);
    await keepMine(lead.db, bookId, 'book');
    expect((await sync(lead)).applied).toBe(1);
    await sync(trader);
    const after = await bookOf(trader);
    expect(after.revision).toBe(4);
    expect(await quantities(trader)).toEqual({ P4000: -30, P3800: 30 });
    // every revision is in the book's history, each by its author
    const history = await api.as(analyst.user).get(`/api/scenarios/${bookId}/revisions`);
    expect(history.body.revisions.map((r: { revision: number }) => r.revision)).toEqual([
      4, 3, 2, 1,
    ]);
  });

  it('checks a book as a book: its positions, its kind, and clients from before books', async () => {
    const bad = await api.as(trader.user).post('/api/sync/push', {
      mutations: [
        {
          mutationId: randomUUID(),
          scenarioId: randomUUID(),
          kind: 'book',
          setId,
          baseRevision: 0,
          document: {
            format: BOOK_FORMAT,
            id: randomUUID(),
            name: 'Bad',
            scenarioIds: [],
            baseScenarioId: null,
            positions: [{ id: 'x', type: 'put', quantity: 1, currency: 'euro' }],
          },
        },
      ],
    });
    expect(bad.body.results[0]).toMatchObject({ status: 'invalid' });
    expect(bad.body.results[0].error).toMatch(/^document\.positions\.0\./);
    // a scenario mutation cannot overwrite the book (an item never changes kind)
    const asScenario = await api.as(trader.user).post('/api/sync/push', {
      mutations: [
        {
          mutationId: randomUUID(),
          scenarioId: bookId,
          setId,
          baseRevision: 4,
          document: scenarioDoc(bookId, 'Not a book'),
        },
      ],
    });
    expect(asScenario.body.results[0]).toMatchObject({ status: 'invalid' });
    expect(asScenario.body.results[0].error).toMatch(/is a book on the service/);
    // a pull without books=1 (a client from before books) is sent no book
    const old = await api.as(trader.user).get('/api/sync/pull?since=0');
    expect(old.status).toBe(200);
    expect(old.body.changes.some((c: { scenarioId: string }) => c.scenarioId === bookId)).toBe(
      false,
    );
    const now = await api.as(trader.user).get('/api/sync/pull?since=0&books=1');
    expect(
      now.body.changes.find((c: { scenarioId: string }) => c.scenarioId === bookId),
    ).toMatchObject({ kind: 'book', revision: 4 });
    // the set's scenario count does not count its book
    const sets = await api.as(trader.user).get('/api/sets');
    expect(sets.body.sets.find((s: { id: string }) => s.id === setId).scenarios).toBe(1);
  });
});
