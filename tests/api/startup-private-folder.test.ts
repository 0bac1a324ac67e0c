/**
 * `npm start` from a checkout the `postgres` user cannot reach (a clone inside a 0700 folder,
 * as in root's home): the database cluster goes to /var/lib/saltation/<hash> and the service
 * reports its database up. Runs the start-up script itself (`npm start` runs it after the
 * dependency check), with the dependencies and the built client of this checkout linked in.
 * Only root meets the problem (PostgreSQL runs as `postgres` then), so it is skipped otherwise.
 */
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync, symlinkSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { freePort } from '../../server/bootstrap/postgres';

const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;
if (!isRoot)
  console.log('startup-private-folder: skipped, only root meets the private-folder case');

const repo = process.cwd();
let child: ChildProcess | undefined;
let folder: string | undefined;
let cluster: string | undefined;

afterAll(async () => {
  if (child && child.exitCode === null) {
    child.kill('SIGINT');
    await new Promise((resolve) => child!.once('exit', resolve));
  }
  if (cluster) rmSync(cluster, { recursive: true, force: true });
  if (folder) rmSync(folder, { recursive: true, force: true });
});

describe.skipIf(!isRoot)('npm start from a private folder', () => {
  it('keeps the cluster where postgres can reach it, says where, and serves /api/health', async () => {
    folder = mkdtempSync(join(tmpdir(), 'saltation-private-')); // mode 0700
    const clone = join(folder, 'saltation');
    expect(spawnSync('git', ['clone', '-q', repo, clone]).status).toBe(0);
    symlinkSync(join(repo, 'node_modules'), join(clone, 'node_modules'));
    if (existsSync(join(repo, 'dist'))) symlinkSync(join(repo, 'dist'), join(clone, 'dist'));
    const port = await freePort();
    const env: NodeJS.ProcessEnv = {
      ...process.env,
      PORT: String(port),
      SALTATION_SKIP_BUILD: '1',
    };
    delete env.DATABASE_URL;
    delete env.SALTATION_DATA_DIR;
    delete env.SALTATION_PG_PORT;
    child = spawn(process.execPath, ['--import', 'tsx', 'server/entry/start.ts'], {
      cwd: clone,
      env,
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    let out = '';
    child.stdout!.on('data', (d) => (out += d));
    child.stderr!.on('data', (d) => (out += d));
    await new Promise<void>((resolve, reject) => {
      const timer = setTimeout(() => reject(new Error(`no start in 90 s:\n${out}`)), 90_000);
      child!.stdout!.on('data', () => {
        if (out.includes('Saltation is running')) {
          clearTimeout(timer);
          resolve();
        }
      });
      child!.once('exit', (code) => reject(new Error(`exited ${code}:\n${out}`)));
    });
    const moved = out.match(/kept in (\/var\/lib\/saltation\/[0-9a-f]+)/);
    expect(moved, out).not.toBeNull();
    cluster = moved![1];
    expect(existsSync(join(cluster, 'pgdata', 'PG_VERSION'))).toBe(true);
    const health = await (await fetch(`http://127.0.0.1:${port}/api/health`)).json();
    expect(health).toEqual({ ok: true, database: 'up' });
  }, 120_000);
});
