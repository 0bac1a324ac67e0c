/**
 * Benchmark: the sync service on loopback with autocannon, against its own throwaway
 * PostgreSQL and a service process of its own (so the load generator does not share its event
 * loop). A desk of 500 scenarios; pulls with nothing new (what a polling client sends), full
 * pulls of all 500, and pushes (each a new scenario, with its revision check); the peer is
 * `GET /api/me` (a JWT-verified route with one indexed query) measured in the same run.
 */
import autocannon from 'autocannon';
import { spawn } from 'node:child_process';
import { randomUUID } from 'node:crypto';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { EmbeddedPostgres, freePort } from '../../server/bootstrap/postgres';
import { DEMO_USERS } from '../../server/demo';
import { newScenario } from '../../src/engine/core';
import { fmt } from './timing';

const root = fileURLToPath(new URL('../..', import.meta.url));

async function waitFor(url: string) {
  for (let i = 0; i < 300; i++) {
    try {
      if ((await fetch(url)).ok) return;
    } catch {
      // not up yet
    }
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`the service did not come up at ${url}`);
}

function load(url: string, token: string, opts: Partial<autocannon.Options> = {}) {
  return autocannon({
    url,
    connections: 10,
    duration: 5,
    headers: { authorization: `Bearer ${token}`, 'content-type': 'application/json' },
    ...opts,
  });
}

export async function benchSync(): Promise<Record<string, string>[]> {
  const dir = mkdtempSync(join(tmpdir(), 'saltation-bench-'));
  const pg = new EmbeddedPostgres({
    dir,
    port: await freePort(),
    database: 'saltation_bench',
    throwaway: true,
    log: () => undefined,
  });
  await pg.start();
  const port = await freePort();
  const service = spawn(process.execPath, ['--import', 'tsx', 'server/entry/serve-api.ts'], {
    cwd: root,
    env: {
      ...process.env,
      DATABASE_URL: pg.url,
      SALTATION_API_PORT: String(port),
      SALTATION_DATA_DIR: dir,
      JWT_SECRET: 'bench',
    },
    stdio: 'ignore',
  });
  try {
    const api = `http://127.0.0.1:${port}/api`;
    await waitFor(`${api}/health`);
    const lead = DEMO_USERS[0];
    const signin = await fetch(`${api}/auth/signin`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ email: lead.email, password: lead.password }),
    });
    const { token } = (await signin.json()) as { token: string };
    const call = async (path: string, body?: unknown) =>
      (await fetch(`${api}${path}`, {
        method: body === undefined ? 'GET' : 'POST',
        headers: { authorization: `Bearer ${token}`, 'content-type': 'application/json' },
        body: body === undefined ? undefined : JSON.stringify(body),
      }).then((r) => r.json())) as Record<string, unknown>;
    const me = (await call('/me')) as { desks: { id: string }[] };
    const { set } = (await call('/sets', { name: 'Bench set', deskId: me.desks[0].id })) as {
      set: { id: string };
    };
    for (let b = 0; b < 5; b++) {
      const mutations = Array.from({ length: 100 }, (_, i) => {
        const id = randomUUID();
        return {
          mutationId: randomUUID(),
          scenarioId: id,
          setId: set.id,
          baseRevision: 0,
          document: newScenario(id, `Bench ${b * 100 + i}`, '2026-12-02'),
        };
      });
      await call('/sync/push', { mutations });
    }
    const full = (await call('/sync/pull?since=0')) as { cursor: string; changes: unknown[] };
    const rows: Record<string, string>[] = [];
    const row = (name: string, r: autocannon.Result, note = '') =>
      rows.push({
        case: name,
        'req/s': fmt(r.requests.average, 4),
        'p99 ms': fmt(r.latency.p99, 3),
        errors: String(r.errors + r.non2xx),
        note,
      });
    const peer = await load(`${api}/me`, token);
    row('GET /api/me (peer: session check, then the desks query)', peer);
    const empty = await load(`${api}/sync/pull?since=${full.cursor}`, token);
    row(
      'pull, nothing new (desk of 500 scenarios)',
      empty,
      `${fmt(empty.requests.average / peer.requests.average, 3)}× the peer`,
    );
    const all = await load(`${api}/sync/pull?since=0`, token, { connections: 4 });
    row(
      `pull everything (${full.changes.length} scenarios)`,
      all,
      `${fmt(all.throughput.average / 1e6, 3)} MB/s`,
    );
    const push = await load(`${api}/sync/push`, token, {
      method: 'POST',
      requests: [
        {
          setupRequest: (req) => {
            const id = randomUUID();
            return {
              ...req,
              body: JSON.stringify({
                mutations: [
                  {
                    mutationId: randomUUID(),
                    scenarioId: id,
                    setId: set.id,
                    baseRevision: 0,
                    document: newScenario(id, 'Pushed', '2026-12-02'),
                  },
                ],
              }),
            };
          },
        },
      ],
    });
    row('push, one new scenario a request (revision check, history row)', push);
    rows.push({
      case: 'target',
      'req/s': '≥ 1000 pulls/s',
      'p99 ms': '< 50',
      errors: '',
      note: '',
    });
    return rows;
  } finally {
    service.kill('SIGTERM');
    pg.stop();
    rmSync(dir, { recursive: true, force: true });
  }
}
