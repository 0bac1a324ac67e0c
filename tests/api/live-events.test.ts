/**
 * The live-update stream answers only for spaces its user may see, and follows membership:
 * nothing from a desk before joining it, its changes once a member, nothing again after being
 * removed (each membership change itself is announced so the client pulls).
 */
import type { Server } from 'node:http';
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app';
import { freePort } from '../../server/bootstrap/postgres';
import { createLogger } from '../../server/logging';
import { ChangeEvents } from '../../server/sync/events';
import { testDatabaseUrl, testDb } from '../support/database';
import { testMail, type TestMail } from '../support/mail';
import { scenarioDoc } from '../support/scenario-doc';
import { call, signUp } from '../support/sync-simulation';

let server: Server;
let events: ChangeEvents;
let mail: TestMail;
let base: string;
const db = testDb();

beforeAll(async () => {
  mail = await testMail();
  const logger = createLogger(() => undefined);
  events = await ChangeEvents.start(testDatabaseUrl(), db, logger);
  const port = await freePort();
  base = `http://127.0.0.1:${port}`;
  const app = createApp({
    db,
    jwtSecret: 'events-secret',
    logger,
    events,
    rateLimitScope: `test-${Math.random().toString(36).slice(2)}:`,
    mailer: mail.mailer,
    appUrl: base,
  });
  server = await new Promise<Server>((resolve) => {
    const s = app.listen(port, '127.0.0.1', () => resolve(s));
  });
});

afterAll(async () => {
  await events.close();
  server.closeAllConnections();
  await new Promise<void>((resolve) => server.close(() => resolve()));
  await db.destroy();
  await mail.close();
});

/** A stream's events as they come; `next` waits at most `ms` for one. */
async function openStream(token: string) {
  const controller = new AbortController();
  const res = await fetch(`${base}/api/sync/events`, {
    headers: { Authorization: `Bearer ${token}` },
    signal: controller.signal,
  });
  const reader = res.body!.getReader();
  const decoder = new TextDecoder();
  const queue: string[] = [];
  let buffer = '';
  const waiting: { wake: (() => void) | null } = { wake: null };
  void (async () => {
    for (;;) {
      const { value, done } = await reader.read().catch(() => ({ value: undefined, done: true }));
      if (done) return;
      buffer += decoder.decode(value);
      let cut: number;
      while ((cut = buffer.indexOf('\n\n')) >= 0) {
        const block = buffer.slice(0, cut);
        buffer = buffer.slice(cut + 2);
        const data = block.match(/^event: change\ndata: (.*)$/m);
        if (data) queue.push(JSON.parse(data[1]).space as string);
        if (/^event: ready/m.test(block)) queue.push('ready');
        waiting.wake?.();
      }
    }
  })();
  const next = async (ms: number): Promise<string | null> => {
    if (queue.length === 0)
      await new Promise<void>((resolve) => {
        waiting.wake = resolve;
        setTimeout(resolve, ms);
      });
    waiting.wake = null;
    return queue.shift() ?? null;
  };
  return { next, close: () => controller.abort() };
}

describe('the live-update stream', () => {
  it('tells a user of a desk only while they belong to it', async () => {
    const lead = await signUp(base, 'events-lead');
    const other = await signUp(base, 'events-other');
    const { desk } = await call<{ desk: { id: string } }>(base, lead.token, 'POST', '/desks', {
      name: 'Events desk',
    });
    const { set } = await call<{ set: { id: string } }>(base, lead.token, 'POST', '/sets', {
      name: 'Events set',
      deskId: desk.id,
    });
    const push = () => {
      const id = randomUUID();
      return call(base, lead.token, 'POST', '/sync/push', {
        mutations: [
          {
            mutationId: randomUUID(),
            scenarioId: id,
            setId: set.id,
            baseRevision: 0,
            document: scenarioDoc(id, 'Desk scenario', 'x'),
          },
        ],
      });
    };
    const stream = await openStream(other.token);
    expect(await stream.next(5000)).toBe('ready');

    await push();
    expect(await stream.next(700)).toBeNull(); // not a member: nothing

    await call(base, lead.token, 'POST', `/desks/${desk.id}/invites`, {
      email: other.email,
      role: 'trader',
    });
    const token = new URL(await mail.linkFor(other.email, /invites you/)).searchParams.get('token');
    await call(base, other.token, 'POST', '/invites/accept', { token });
    expect(await stream.next(3000)).toBe('*'); // joined: pull everything you may now see

    await push();
    expect(await stream.next(3000)).toBe(`desk:${desk.id}`);

    await call(base, lead.token, 'DELETE', `/desks/${desk.id}/members/${other.id}`);
    expect(await stream.next(3000)).toBe('*'); // removed: pull, which drops the desk's sets
    await push();
    expect(await stream.next(700)).toBeNull();
    stream.close();
  });
});
