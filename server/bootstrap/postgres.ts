/**
 * A PostgreSQL cluster of the project's own, from Debian's packages: found (or installed with
 * apt-get when running as root), initialised on first use, started on 127.0.0.1 with its
 * socket in its own folder, and stopped cleanly. As root, every server binary runs as the
 * `postgres` user, since PostgreSQL refuses to run as root.
 */
import { execFileSync, spawnSync } from 'node:child_process';
import {
  chownSync,
  existsSync,
  mkdirSync,
  readdirSync,
  readFileSync,
  rmSync,
  statSync,
} from 'node:fs';
import { createServer } from 'node:net';
import { join } from 'node:path';

export class SetupError extends Error {}

const PG_ROOT = '/usr/lib/postgresql';

export function findPostgresBin(): string | null {
  if (!existsSync(PG_ROOT)) return null;
  const versions = readdirSync(PG_ROOT)
    .filter((v) => existsSync(join(PG_ROOT, v, 'bin', 'initdb')))
    .sort((a, b) => Number(b) - Number(a));
  return versions.length > 0 ? join(PG_ROOT, versions[0], 'bin') : null;
}

const isRoot = () => typeof process.getuid === 'function' && process.getuid() === 0;

/** The binaries, installing Debian's `postgresql` package first when root and missing. */
export function ensurePostgresBin(log: (line: string) => void = console.log): string {
  const found = findPostgresBin();
  if (found) return found;
  if (!isRoot()) {
    throw new SetupError(
      'PostgreSQL server binaries were not found in /usr/lib/postgresql.\n' +
        'Install them with:  sudo apt-get install -y postgresql\n' +
        'or point DATABASE_URL at an existing PostgreSQL.',
    );
  }
  log('PostgreSQL not found: installing Debian package "postgresql" (apt-get)…');
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  const update = spawnSync('apt-get', ['update', '-qq'], { stdio: 'inherit', env });
  const install = spawnSync('apt-get', ['install', '-y', '-qq', 'postgresql'], {
    stdio: 'inherit',
    env,
  });
  const bin = findPostgresBin();
  if (update.status !== 0 || install.status !== 0 || !bin) {
    throw new SetupError('apt-get could not install "postgresql"; install it by hand and retry.');
  }
  return bin;
}

export function portIsFree(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const srv = createServer();
    srv.once('error', () => resolve(false));
    srv.listen(port, '127.0.0.1', () => srv.close(() => resolve(true)));
  });
}

/** A free loopback port chosen by the OS. */
export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = createServer();
    srv.once('error', reject);
    srv.listen(0, '127.0.0.1', () => {
      const address = srv.address();
      const port = typeof address === 'object' && address ? address.port : 0;
      srv.close(() => resolve(port));
    });
  });
}

function pidAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (error) {
    return (error as NodeJS.ErrnoException).code === 'EPERM';
  }
}

export interface ClusterOptions {
  /** folder holding the cluster (`pgdata/`), its log and its socket */
  dir: string;
  port: number;
  database: string;
  /** throwaway clusters may skip fsync; never for real data */
  throwaway?: boolean;
  log?: (line: string) => void;
}

export class EmbeddedPostgres {
  readonly bin: string;
  private readonly pgdata: string;
  private started = false;

  constructor(private readonly opts: ClusterOptions) {
    this.bin = ensurePostgresBin(opts.log);
    this.pgdata = join(opts.dir, 'pgdata');
  }

  get url(): string {
    return `postgres://postgres@127.0.0.1:${this.opts.port}/${this.opts.database}`;
  }

  private run(tool: string, args: string[]): string {
    const cmd = join(this.bin, tool);
    const [file, argv] = isRoot()
      ? ['runuser', ['-u', 'postgres', '--', cmd, ...args]]
      : [cmd, args];
    try {
      return execFileSync(file, argv, { encoding: 'utf8', stdio: ['ignore', 'pipe', 'pipe'] });
    } catch (error) {
      const e = error as { stderr?: string; stdout?: string; message: string };
      throw new SetupError(`${tool} failed: ${(e.stderr || e.stdout || e.message).trim()}`);
    }
  }

  private prepareFolder(): void {
    mkdirSync(this.opts.dir, { recursive: true });
    if (!isRoot()) return;
    const pw = execFileSync('id', ['-u', 'postgres'], { encoding: 'utf8' }).trim();
    const gid = Number(execFileSync('id', ['-g', 'postgres'], { encoding: 'utf8' }).trim());
    chownSync(this.opts.dir, Number(pw), gid);
    const probe = spawnSync('runuser', ['-u', 'postgres', '--', 'test', '-w', this.opts.dir]);
    if (probe.status !== 0) {
      throw new SetupError(
        `The "postgres" user cannot write to ${this.opts.dir} (a parent folder is not open to it).\n` +
          'Set SALTATION_DATA_DIR to a folder it can reach, e.g. SALTATION_DATA_DIR=/var/tmp/saltation',
      );
    }
  }

  /** initdb on first use; returns true when a new cluster was created. */
  init(): boolean {
    this.prepareFolder();
    if (existsSync(join(this.pgdata, 'PG_VERSION'))) return false;
    this.opts.log?.(`Creating a PostgreSQL cluster in ${this.pgdata}`);
    this.run('initdb', [
      '-D',
      this.pgdata,
      '-U',
      'postgres',
      '--auth=trust',
      '-E',
      'UTF8',
      '--locale=C.UTF-8',
    ]);
    return true;
  }

  private clearStalePid(): void {
    const pidFile = join(this.pgdata, 'postmaster.pid');
    if (!existsSync(pidFile)) return;
    const pid = Number(readFileSync(pidFile, 'utf8').split('\n')[0]);
    if (Number.isInteger(pid) && pid > 0 && pidAlive(pid)) {
      // Callers check their own web port first, so a live postmaster here was left behind by an
      // earlier run that was killed rather than stopped: stop it cleanly and start afresh.
      this.opts.log?.(`Stopping a PostgreSQL left running by an earlier run (pid ${pid}).`);
      this.run('pg_ctl', ['-D', this.pgdata, '-m', 'fast', '-w', '-t', '30', 'stop']);
      return;
    }
    this.opts.log?.(`Removing a stale postmaster.pid left by pid ${pid} (not running).`);
    rmSync(pidFile);
  }

  async start(): Promise<void> {
    this.init();
    this.clearStalePid();
    if (!(await portIsFree(this.opts.port))) {
      throw new SetupError(
        `Port ${this.opts.port} on 127.0.0.1 is in use, so the database cannot start there.\n` +
          'Free it, or choose another with SALTATION_PG_PORT=…',
      );
    }
    const socketDir = this.opts.dir.length < 90 ? this.opts.dir : '';
    const settings = [
      `-c listen_addresses=127.0.0.1`,
      `-p ${this.opts.port}`,
      `-c unix_socket_directories='${socketDir}'`,
    ];
    if (this.opts.throwaway)
      settings.push('-c fsync=off', '-c synchronous_commit=off', '-c full_page_writes=off');
    this.run('pg_ctl', [
      '-D',
      this.pgdata,
      '-l',
      join(this.opts.dir, 'postgres.log'),
      '-w',
      '-t',
      '30',
      '-o',
      settings.join(' '),
      'start',
    ]);
    this.started = true;
    const exists = this.run('psql', [
      '-h',
      '127.0.0.1',
      '-p',
      String(this.opts.port),
      '-U',
      'postgres',
      '-tAc',
      `SELECT 1 FROM pg_database WHERE datname = '${this.opts.database}'`,
    ]);
    if (exists.trim() !== '1') {
      this.run('createdb', [
        '-h',
        '127.0.0.1',
        '-p',
        String(this.opts.port),
        '-U',
        'postgres',
        this.opts.database,
      ]);
    }
  }

  stop(): void {
    if (!this.started && !existsSync(join(this.pgdata, 'postmaster.pid'))) return;
    try {
      this.run('pg_ctl', ['-D', this.pgdata, '-m', 'fast', '-w', '-t', '30', 'stop']);
    } catch (error) {
      this.opts.log?.(`Stopping PostgreSQL: ${(error as Error).message}`);
    }
    this.started = false;
  }

  /** Whether a cluster folder is there already. */
  exists(): boolean {
    return existsSync(this.pgdata) && statSync(this.pgdata).isDirectory();
  }
}
