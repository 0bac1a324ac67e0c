/**
 * The authorization matrix of the roles (src/contracts/roles.ts): every route × caller (no desk, analyst,
 * trader, lead) × the caller's own desk or another desk. Unseen things answer 404 (as if
 * they did not exist), writes the role does not allow 403 ("denied" inside a push).
 */
import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { apiFixture, type TestUser } from '../support/api';
import { scenarioDoc } from '../support/scenario-doc';

const api = apiFixture();
type Role = 'lead' | 'trader' | 'analyst';
const ROLES: Role[] = ['analyst', 'trader', 'lead'];

let deskA: string;
let setA: string;
let scenarioA: string;
const own = {} as Record<Role, TestUser>;
const other = {} as Record<Role, TestUser>;
let stranger: TestUser;

/** Joins the way people do: the lead invites, the mail arrives, its link is accepted. */
async function join(lead: TestUser, deskId: string, user: TestUser, role: Role) {
  await api.as(lead).post(`/api/desks/${deskId}/invites`, { email: user.email, role });
  const link = await api.mail().linkFor(user.email, /invites you/);
  const token = new URL(link).searchParams.get('token');
  const accepted = await api.as(user).post('/api/invites/accept', { token });
  expect(accepted.status).toBe(200);
}

async function deskWith(lead: TestUser, members: [TestUser, Role][]) {
  const desk = await api.as(lead).post('/api/desks', { name: `Desk ${lead.name}` });
  for (const [user, role] of members)
    if (!(role === 'lead' && user === lead)) await join(lead, desk.body.desk.id, user, role);
  return desk.body.desk.id as string;
}

beforeAll(async () => {
  for (const r of ROLES) {
    own[r] = await api.user(`own-${r}`);
    other[r] = await api.user(`other-${r}`);
  }
  stranger = await api.user('stranger');
  deskA = await deskWith(
    own.lead,
    ROLES.map((r) => [own[r], r]),
  );
  await deskWith(
    other.lead,
    ROLES.map((r) => [other[r], r]),
  );
  setA = (await api.as(own.lead).post('/api/sets', { name: 'Desk A shared', deskId: deskA })).body
    .set.id;
  scenarioA = randomUUID();
  const created = await api.as(own.lead).post('/api/sync/push', {
    mutations: [
      {
        mutationId: randomUUID(),
        scenarioId: scenarioA,
        setId: setA,
        baseRevision: 0,
        document: scenarioDoc(scenarioA),
      },
    ],
  });
  expect(created.body.results[0].status).toBe('applied');
}, 60000);

const revisionOf = async () =>
  (await api.as(own.lead).get(`/api/scenarios/${scenarioA}/revisions`)).body.revisions[0]
    .revision as number;

type Caller = { who: string; user: () => TestUser; role: Role | null; ownDesk: boolean };
const callers: Caller[] = [
  { who: 'no desk', user: () => stranger, role: null, ownDesk: false },
  ...ROLES.map((r) => ({ who: `${r} of this desk`, user: () => own[r], role: r, ownDesk: true })),
  ...ROLES.map((r) => ({
    who: `${r} of another desk`,
    user: () => other[r],
    role: r,
    ownDesk: false,
  })),
];

/** Each route: what it answers for a caller; `expected` gives the status (or push status). */
const routes: {
  name: string;
  run: (u: TestUser) => Promise<number | string>;
  expected: (c: Caller) => number | string;
}[] = [
  {
    name: 'GET /desks/:id/members',
    run: async (u) => (await api.as(u).get(`/api/desks/${deskA}/members`)).status,
    expected: (c) => (c.ownDesk ? 200 : 404),
  },
  {
    name: 'PATCH /desks/:id/members/:userId',
    run: async (u) =>
      (await api.as(u).patch(`/api/desks/${deskA}/members/${own.trader.id}`, { role: 'trader' }))
        .status,
    expected: (c) => (!c.ownDesk ? 404 : c.role === 'lead' ? 200 : 403),
  },
  {
    name: 'DELETE /desks/:id/members/:userId (someone else)',
    run: async (u) => {
      // a fresh member to remove each time
      const victim = await api.user('victim');
      await join(own.lead, deskA, victim, 'analyst');
      return (await api.as(u).delete(`/api/desks/${deskA}/members/${victim.id}`)).status;
    },
    expected: (c) => (!c.ownDesk ? 404 : c.role === 'lead' ? 200 : 403),
  },
  {
    name: 'GET /desks/:id/invites',
    run: async (u) => (await api.as(u).get(`/api/desks/${deskA}/invites`)).status,
    expected: (c) => (!c.ownDesk ? 404 : c.role === 'lead' ? 200 : 403),
  },
  {
    name: 'POST /desks/:id/invites',
    run: async (u) =>
      (
        await api.as(u).post(`/api/desks/${deskA}/invites`, {
          email: `x-${randomUUID()}@example.test`,
          role: 'analyst',
        })
      ).status,
    expected: (c) => (!c.ownDesk ? 404 : c.role === 'lead' ? 201 : 403),
  },
  {
    name: 'GET /sets lists the desk set',
    run: async (u) =>
      (await api.as(u).get('/api/sets')).body.sets.some((s: { id: string }) => s.id === setA)
        ? 'listed'
        : 'absent',
    expected: (c) => (c.ownDesk ? 'listed' : 'absent'),
  },
  {
    name: 'POST /sets on the desk',
    run: async (u) =>
      (await api.as(u).post('/api/sets', { name: 'New shared', deskId: deskA })).status,
    expected: (c) => (!c.ownDesk ? 404 : c.role === 'lead' ? 201 : 403),
  },
  {
    name: 'PATCH /sets/:id',
    run: async (u) =>
      (await api.as(u).patch(`/api/sets/${setA}`, { name: 'Desk A shared' })).status,
    expected: (c) => (!c.ownDesk ? 404 : c.role === 'lead' ? 200 : 403),
  },
  {
    name: 'DELETE /sets/:id',
    run: async (u) => {
      const throwaway = (
        await api.as(own.lead).post('/api/sets', { name: 'Throwaway', deskId: deskA })
      ).body.set.id;
      return (await api.as(u).delete(`/api/sets/${throwaway}`)).status;
    },
    expected: (c) => (!c.ownDesk ? 404 : c.role === 'lead' ? 200 : 403),
  },
  {
    name: 'push: create a scenario in the desk set',
    run: async (u) => {
      const id = randomUUID();
      const r = await api.as(u).post('/api/sync/push', {
        mutations: [
          {
            mutationId: randomUUID(),
            scenarioId: id,
            setId: setA,
            baseRevision: 0,
            document: scenarioDoc(id),
          },
        ],
      });
      return r.body.results[0].status;
    },
    expected: (c) => (c.ownDesk && c.role !== 'analyst' ? 'applied' : 'denied'),
  },
  {
    name: 'push: edit the shared scenario',
    run: async (u) => {
      const r = await api.as(u).post('/api/sync/push', {
        mutations: [
          {
            mutationId: randomUUID(),
            scenarioId: scenarioA,
            setId: setA,
            baseRevision: await revisionOf(),
            document: scenarioDoc(scenarioA, `edit by ${u.name}`),
          },
        ],
      });
      return r.body.results[0].status;
    },
    expected: (c) => (c.ownDesk && c.role !== 'analyst' ? 'applied' : 'denied'),
  },
  {
    name: 'push: delete a scenario of the desk set',
    run: async (u) => {
      const id = randomUUID();
      await api.as(own.lead).post('/api/sync/push', {
        mutations: [
          {
            mutationId: randomUUID(),
            scenarioId: id,
            setId: setA,
            baseRevision: 0,
            document: scenarioDoc(id),
          },
        ],
      });
      const r = await api.as(u).post('/api/sync/push', {
        mutations: [
          { mutationId: randomUUID(), scenarioId: id, setId: setA, baseRevision: 1, deleted: true },
        ],
      });
      return r.body.results[0].status;
    },
    expected: (c) => (c.ownDesk && c.role === 'lead' ? 'applied' : 'denied'),
  },
  {
    name: 'pull sees the shared scenario',
    run: async (u) =>
      (await api.as(u).get('/api/sync/pull?since=0')).body.changes.some(
        (ch: { scenarioId: string }) => ch.scenarioId === scenarioA,
      )
        ? 'seen'
        : 'unseen',
    expected: (c) => (c.ownDesk ? 'seen' : 'unseen'),
  },
  {
    name: 'GET /scenarios/:id/revisions',
    run: async (u) => (await api.as(u).get(`/api/scenarios/${scenarioA}/revisions`)).status,
    expected: (c) => (c.ownDesk ? 200 : 404),
  },
];

describe('authorization matrix', () => {
  for (const route of routes)
    for (const c of callers)
      it(`${route.name} — ${c.who}`, async () => {
        expect(await route.run(c.user())).toBe(route.expected(c));
      });

  it('every route answers 401 without a session', async () => {
    const calls: [string, string][] = [
      ['get', '/api/me'],
      ['get', '/api/desks'],
      ['post', '/api/desks'],
      ['get', `/api/desks/${deskA}/members`],
      ['patch', `/api/desks/${deskA}/members/${own.trader.id}`],
      ['delete', `/api/desks/${deskA}/members/${own.trader.id}`],
      ['get', `/api/desks/${deskA}/invites`],
      ['post', `/api/desks/${deskA}/invites`],
      ['post', '/api/invites/accept'],
      ['get', '/api/sets'],
      ['post', '/api/sets'],
      ['patch', `/api/sets/${setA}`],
      ['delete', `/api/sets/${setA}`],
      ['post', '/api/sync/push'],
      ['get', '/api/sync/pull'],
      ['get', `/api/scenarios/${scenarioA}/revisions`],
      ['post', '/api/auth/password'],
      ['post', '/api/auth/signout'],
    ];
    for (const [method, url] of calls) {
      const r = await (
        request(api.app()) as unknown as Record<string, (u: string) => request.Test>
      )[method](url);
      expect([url, r.status]).toEqual([url, 401]);
    }
  });

  it('a role change takes effect on the next request (promise 7 of src/contracts/sync.ts)', async () => {
    const u = await api.user('demoted');
    await join(own.lead, deskA, u, 'trader');
    const edit = async () =>
      (
        await api.as(u).post('/api/sync/push', {
          mutations: [
            {
              mutationId: randomUUID(),
              scenarioId: scenarioA,
              setId: setA,
              baseRevision: await revisionOf(),
              document: scenarioDoc(scenarioA),
            },
          ],
        })
      ).body.results[0].status;
    expect(await edit()).toBe('applied');
    await api.as(own.lead).patch(`/api/desks/${deskA}/members/${u.id}`, { role: 'analyst' });
    expect(await edit()).toBe('denied');
  });

  it('an analyst forks a shared scenario into a personal set that only they can see or change', async () => {
    const analyst = own.analyst;
    const personal = await api.as(analyst).post('/api/sets', { name: 'My forks' });
    expect(personal.status).toBe(201);
    const shared = (await api.as(analyst).get(`/api/scenarios/${scenarioA}/revisions`)).body
      .revisions[0].document;
    const forkId = randomUUID();
    const fork = await api.as(analyst).post('/api/sync/push', {
      mutations: [
        {
          mutationId: randomUUID(),
          scenarioId: forkId,
          setId: personal.body.set.id,
          baseRevision: 0,
          document: { ...shared, id: forkId, name: 'My fork' },
        },
      ],
    });
    expect(fork.body.results[0]).toMatchObject({ status: 'applied', revision: 1 });
    const sees = async (u: TestUser) =>
      (await api.as(u).get('/api/sync/pull?since=0')).body.changes.some(
        (c: { scenarioId: string }) => c.scenarioId === forkId,
      );
    expect(await sees(analyst)).toBe(true);
    expect(await sees(own.lead)).toBe(false);
    expect((await api.as(own.lead).get(`/api/scenarios/${forkId}/revisions`)).status).toBe(404);
    const leadEdit = await api.as(own.lead).post('/api/sync/push', {
      mutations: [
        {
          mutationId: randomUUID(),
          scenarioId: forkId,
          setId: personal.body.set.id,
          baseRevision: 1,
          document: { ...shared, id: forkId },
        },
      ],
    });
    expect(leadEdit.body.results[0].status).toBe('denied');
  });
});
