/**
 * Benchmark: the sync service on loopback with autocannon, against its own throwaway
 * PostgreSQL and service processes of its own (so the load generator does not share their
 * event loops). A desk of 500 scenarios; pulls with nothing new (what a polling client sends)
 * on one instance and spread over two; full pulls of all 500; pushes of one new scenario and
 * of 50 (one transaction each); and the delay from a push through one instance to the event
 * on a stream from the other. The peer is `GET /api/me` (a JWT-verified route with one indexed
 * query) measured in the same run.
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
  const spawnInstance = (port: number) =>
    spawn(process.execPath, ['--import', 'tsx', 'server/entry/serve-api.ts'], {
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
  const ports = [await freePort(), await freePort()];
  const services = ports.map(spawnInstance);
  try {
    const api = `http://127.0.0.1:${ports[0]}/api`;
    const api2 = `http://127.0.0.1:${ports[1]}/api`;
    await waitFor(`${api}/ready`);
    await waitFor(`${api2}/ready`);
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
    // the same, spread over two instances: 5 connections each against one with 10
    const split = await Promise.all([
      load(`${api}/sync/pull?since=${full.cursor}`, token, { connections: 5 }),
      load(`${api2}/sync/pull?since=${full.cursor}`, token, { connections: 5 }),
    ]);
    const splitRate = split[0].requests.average + split[1].requests.average;
    rows.push({
      case: 'pull, nothing new, spread over 2 instances (5 connections each)',
      'req/s': fmt(splitRate, 4),
      'p99 ms': fmt(Math.max(split[0].latency.p99, split[1].latency.p99), 3),
      errors: String(split.reduce((a, r) => a + r.errors + r.non2xx, 0)),
      note: `${fmt(splitRate / empty.requests.average, 3)}× one instance (2 cores shared by both, PostgreSQL and the load generator)`,
    });
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
    const batch = await load(`${api}/sync/push`, token, {
      method: 'POST',
      requests: [
        {
          setupRequest: (req) => ({
            ...req,
            body: JSON.stringify({
              mutations: Array.from({ length: 50 }, () => {
                const id = randomUUID();
                return {
                  mutationId: randomUUID(),
                  scenarioId: id,
                  setId: set.id,
                  baseRevision: 0,
                  document: newScenario(id, 'Pushed', '2026-12-02'),
                };
              }),
            }),
          }),
        },
      ],
    });
    rows.push({
      case: 'push, 50 new scenarios a request (one transaction)',
      'req/s': fmt(batch.requests.average, 4),
      'p99 ms': fmt(batch.latency.p99, 3),
      errors: String(batch.errors + batch.non2xx),
      note: `${fmt(50 * batch.requests.average, 4)} scenario writes/s (target ≥ 1000: ${50 * batch.requests.average >= 1000 ? 'met' : 'MISSED'})`,
    });
    const delays = await eventDelays(api, api2, token, set.id, 50);
    rows.push({
      case: 'event delay: push through instance 1, event on a stream from instance 2',
      'req/s': '',
      'p99 ms': fmt(delays.p99, 3),
      errors: '',
      note: `p50 ${fmt(delays.p50, 3)} ms over ${delays.n} pushes`,
    });
    rows.push({
      case: 'target',
      'req/s': '≥ 1000 pulls/s',
      'p99 ms': '< 50',
      errors: '',
      note: '',
    });
    return rows;
  } finally {
    services.forEach((s) => s.kill('SIGTERM'));
    pg.stop();
    rmSync(dir, { recursive: true, force: true });
  }
}

/** Pushes one scenario at a time through `api` and times the event on a stream from `api2`. */
async function eventDelays(api: string, api2: string, token: string, setId: string, n: number) {
  const controller = new AbortController();
  const stream = await fetch(`${api2}/sync/events`, {
    headers: { authorization: `Bearer ${token}` },
    signal: controller.signal,
  });
  const reader = stream.body!.getReader();
  const decoder = new TextDecoder();
  let text = '';
  const until = async (pattern: RegExp) => {
    while (!pattern.test(text)) {
      const { value, done } = await reader.read();
      if (done) throw new Error('the event stream ended');
      text += decoder.decode(value);
    }
    text = '';
  };
  await until(/event: ready/);
  const ms: number[] = [];
  for (let i = 0; i < n; i++) {
    const id = randomUUID();
    const started = performance.now();
    const seen = until(/event: change/);
    await fetch(`${api}/sync/push`, {
      method: 'POST',
      headers: { authorization: `Bearer ${token}`, 'content-type': 'application/json' },
      body: JSON.stringify({
        mutations: [
          {
            mutationId: randomUUID(),
            scenarioId: id,
            setId,
            baseRevision: 0,
            document: newScenario(id, 'Live', '2026-12-02'),
          },
        ],
      }),
    });
    await seen;
    ms.push(performance.now() - started);
  }
  controller.abort();
  ms.sort((a, b) => a - b);
  return { n, p50: ms[Math.floor(0.5 * n)], p99: ms[Math.min(n - 1, Math.floor(0.99 * n))] };
}
