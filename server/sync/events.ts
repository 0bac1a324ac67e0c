/**
 * Live updates: a server-sent events stream per signed-in client (`GET /api/sync/events`),
 * fed by PostgreSQL LISTEN/NOTIFY so that a change committed through any instance reaches the
 * clients of every instance. A client hears only of spaces it may see: its own and its desks',
 * read from the database when it connects and again whenever its memberships change. A comment
 * line every 15 s keeps proxies from closing the stream, and the session is checked again then
 * (a sign-out on any instance ends the stream). The client pulls on each event; its 20-second
 * poll stays as the fallback.
 */
import type { Request, Response } from 'express';
import type { Knex } from 'knex';
import pg from 'pg';
import { deskSpace, userSpace } from '../access';
import type { Logger } from '../logging';

const HEARTBEAT_MS = 15_000;

interface Subscriber {
  userId: string;
  issuedAtMs: number;
  spaces: Set<string>;
  res: Response;
  heartbeat: ReturnType<typeof setInterval>;
}

export class ChangeEvents {
  private readonly subscribers = new Set<Subscriber>();
  private listener: pg.Client | null = null;
  private closed = false;
  private retryMs = 500;

  private constructor(
    private readonly url: string,
    private readonly db: Knex,
    private readonly logger: Logger,
  ) {}

  /** Connects the LISTEN session (and reconnects it whenever it drops). */
  static async start(url: string, db: Knex, logger: Logger): Promise<ChangeEvents> {
    const events = new ChangeEvents(url, db, logger);
    await events.listen();
    return events;
  }

  get connections(): number {
    return this.subscribers.size;
  }

  private async listen(): Promise<void> {
    const client = new pg.Client({
      connectionString: this.url,
      application_name: 'saltation-events',
    });
    client.on('notification', (n) => void this.dispatch(n.channel, n.payload ?? ''));
    client.on('error', (e) => this.logger.warn({ err: e.message }, 'event listener lost'));
    client.on('end', () => {
      if (this.closed) return;
      this.listener = null;
      setTimeout(() => void this.listen().catch(() => undefined), this.retryMs);
      this.retryMs = Math.min(10_000, this.retryMs * 2);
    });
    await client.connect();
    await client.query('listen saltation_changes; listen saltation_members');
    this.listener = client;
    this.retryMs = 500;
    // anything committed while the listener was away: every client pulls once
    for (const s of this.subscribers) this.send(s, { space: '*' });
  }

  private async spacesOf(userId: string): Promise<Set<string>> {
    const rows = await this.db('desk_members').where({ user_id: userId }).select('desk_id');
    return new Set([
      userSpace(userId),
      ...rows.map((r: { desk_id: string }) => deskSpace(r.desk_id)),
    ]);
  }

  private send(s: Subscriber, data: { space: string }) {
    s.res.write(`event: change\ndata: ${JSON.stringify(data)}\n\n`);
  }

  private async dispatch(channel: string, payload: string): Promise<void> {
    if (channel === 'saltation_changes') {
      for (const s of this.subscribers) if (s.spaces.has(payload)) this.send(s, { space: payload });
      return;
    }
    // a membership changed: that user's streams see their desks afresh and pull once
    for (const s of this.subscribers) {
      if (s.userId !== payload) continue;
      s.spaces = await this.spacesOf(s.userId).catch(() => s.spaces);
      this.send(s, { space: '*' });
    }
  }

  /** The stream for a request that `requireUser` let through; `issuedAtMs` is its session's. */
  async subscribe(req: Request, res: Response, issuedAtMs: number): Promise<void> {
    const userId = req.user!.id;
    const spaces = await this.spacesOf(userId);
    res.writeHead(200, {
      'Content-Type': 'text/event-stream',
      'Cache-Control': 'no-cache, no-transform',
      Connection: 'keep-alive',
      'X-Accel-Buffering': 'no',
    });
    res.write('retry: 5000\n\nevent: ready\ndata: {}\n\n');
    const s: Subscriber = {
      userId,
      issuedAtMs,
      spaces,
      res,
      heartbeat: setInterval(() => void this.beat(s), HEARTBEAT_MS),
    };
    this.subscribers.add(s);
    req.on('close', () => this.drop(s));
  }

  private async beat(s: Subscriber): Promise<void> {
    const row = await this.db('users')
      .where({ id: s.userId })
      .first('tokens_valid_after')
      .catch(() => undefined);
    // signed out (on any instance) or gone: the stream ends
    if (row === undefined || new Date(row.tokens_valid_after).getTime() > s.issuedAtMs) {
      s.res.end();
      this.drop(s);
      return;
    }
    s.res.write(': ping\n\n');
  }

  private drop(s: Subscriber) {
    clearInterval(s.heartbeat);
    this.subscribers.delete(s);
  }

  /** Ends every stream (clients reconnect to another instance) and the LISTEN session. */
  async close(): Promise<void> {
    this.closed = true;
    for (const s of [...this.subscribers]) {
      s.res.end();
      this.drop(s);
    }
    await this.listener?.end().catch(() => undefined);
  }
}
