/**
 * One running instance: listens on the configured host and port and, on SIGTERM or SIGINT,
 * drains: ends the live-update streams (clients reconnect elsewhere), stops taking connections,
 * lets requests in flight finish (at most 10 s), then closes the database pool.
 */
import type { Express } from 'express';
import type { Server } from 'node:http';
import type { Knex } from 'knex';
import type { ChangeEvents } from './sync/events';

const DRAIN_MS = 10_000;

export async function listen(app: Express, host: string, port: number): Promise<Server> {
  const server = app.listen(port, host);
  await new Promise<void>((resolve, reject) => {
    server.once('listening', () => resolve());
    server.once('error', reject);
  });
  return server;
}

/** Stops the instance in order; resolves when everything is closed. */
export async function drain(
  server: Server | undefined,
  db: Knex,
  events?: ChangeEvents,
  extra: () => Promise<void> | void = () => undefined,
): Promise<void> {
  await events?.close();
  if (server) {
    const closed = new Promise<void>((resolve) => server.close(() => resolve()));
    server.closeIdleConnections();
    const timer = setTimeout(() => server.closeAllConnections(), DRAIN_MS);
    await closed;
    clearTimeout(timer);
  }
  await db.destroy().catch(() => undefined);
  await extra();
}
