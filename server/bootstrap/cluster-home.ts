/**
 * Where `npm start` keeps its PostgreSQL cluster and on which port. The cluster lives in the
 * data folder, unless the process is root and the `postgres` user cannot reach that folder (a
 * checkout in root's 0700 home, say): then it goes to /var/lib/saltation/<hash of the folder>,
 * owned by `postgres`. An explicit SALTATION_DATA_DIR is never moved. The port is PORT + 50000
 * (or 54310 above PORT 15535) unless that is taken, in which case a free one is chosen; the
 * choice is remembered beside the cluster so the next start finds it again.
 */
import { spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { readPort } from '../config';
import { EmbeddedPostgres, freePort, portIsFree } from './postgres';

export const SHARED_CLUSTERS = '/var/lib/saltation';

const isRoot = () => typeof process.getuid === 'function' && process.getuid() === 0;

/** Whether the `postgres` user can enter every folder on the way to `dir` (and write it). */
function postgresCanReach(dir: string): boolean {
  let probe = dir;
  while (!existsSync(probe)) probe = join(probe, '..');
  const r = spawnSync('runuser', ['-u', 'postgres', '--', 'test', '-x', probe]);
  return r.status === 0;
}

export function clusterDir(
  dataDir: string,
  explicit: boolean,
  log: (line: string) => void,
): string {
  const inDataDir = join(dataDir, 'postgres');
  const hash = createHash('sha256').update(dataDir).digest('hex').slice(0, 12);
  const dir = join(SHARED_CLUSTERS, hash);
  // a cluster made there by an earlier start stays where its data is
  const movedBefore = existsSync(join(dir, 'pgdata'));
  if (!movedBefore && (!isRoot() || explicit || postgresCanReach(inDataDir))) return inDataDir;
  mkdirSync(dir, { recursive: true });
  log(
    `The "postgres" user cannot reach ${dataDir}, so the database cluster is kept in ${dir} ` +
      '(set SALTATION_DATA_DIR to choose another folder).',
  );
  return dir;
}

/** The derived port, or the remembered one, or a free one when that is taken by something else. */
export async function clusterPort(
  dir: string,
  webPort: number,
  log: (line: string) => void,
): Promise<number> {
  const file = join(dir, 'port');
  const remembered = existsSync(file) ? Number(readFileSync(file, 'utf8').trim()) : NaN;
  const derived = webPort + 50000 > 65535 ? 54310 : webPort + 50000;
  let port = Number.isInteger(remembered) && remembered > 0 ? remembered : derived;
  // a postmaster of this cluster left running holds its own port: it is stopped, not avoided
  const ours = existsSync(join(dir, 'pgdata', 'postmaster.pid'));
  if (!ours && !(await portIsFree(port))) {
    const taken = port;
    port = await freePort();
    log(`Port ${taken} on 127.0.0.1 is in use; the database takes port ${port} instead.`);
  }
  mkdirSync(dir, { recursive: true });
  writeFileSync(file, `${port}\n`);
  return port;
}

/** The project's own cluster for `npm start` and `npm run dev`: placed, ported and started. */
export async function startProjectCluster(
  config: { dataDir: string; port: number },
  log: (line: string) => void,
): Promise<EmbeddedPostgres> {
  const dir = clusterDir(config.dataDir, Boolean(process.env.SALTATION_DATA_DIR), log);
  const port = process.env.SALTATION_PG_PORT
    ? readPort(process.env.SALTATION_PG_PORT, 0)
    : await clusterPort(dir, config.port, log);
  const pg = new EmbeddedPostgres({ dir, port, database: 'saltation', log });
  await pg.start();
  return pg;
}
