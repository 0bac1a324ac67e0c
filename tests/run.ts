/**
 * `npm test`: every check on a fresh machine. Starts a throwaway PostgreSQL on loopback in a
 * temporary folder, makes sure Debian's chromium is there for the browser tests, then runs the
 * type checks (client, server and CLI, tests), lint, the format check, a client build and every vitest project (unit, api, e2e) in one run, and
 * stops everything it started. Exits non-zero on any failure.
 */
import { spawn } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { EmbeddedPostgres, freePort, SetupError } from '../server/bootstrap/postgres';
import { createDb, migrate, seed } from '../server/db';
import { ensureChromium } from './e2e/chromium';

function step(
  title: string,
  cmd: string,
  args: string[],
  env: NodeJS.ProcessEnv = process.env,
): Promise<number> {
  console.log(`\n── ${title} ──`);
  return new Promise((resolve) => {
    const child = spawn(cmd, args, { stdio: 'inherit', env });
    child.on('exit', (code, signal) => resolve(code ?? (signal ? 1 : 0)));
  });
}

async function main(): Promise<number> {
  const bin = (name: string) => join('node_modules', '.bin', name);
  const chromium = ensureChromium((l) => console.log(l));
  const dir = mkdtempSync(join(tmpdir(), 'saltation-test-'));
  const pg = new EmbeddedPostgres({
    dir,
    port: await freePort(),
    database: 'saltation_test',
    throwaway: true,
    log: (l) => console.log(l),
  });
  let cleaned = false;
  const cleanup = () => {
    if (cleaned) return;
    cleaned = true;
    pg.stop();
    rmSync(dir, { recursive: true, force: true });
  };
  process.on('SIGINT', () => {
    cleanup();
    process.exit(130);
  });
  try {
    console.log('Starting a throwaway PostgreSQL…');
    await pg.start();
    const db = createDb(pg.url);
    try {
      await migrate(db);
      await seed(db);
    } finally {
      await db.destroy();
    }
    const env = {
      ...process.env,
      DATABASE_URL: pg.url,
      SALTATION_CHROMIUM: chromium,
      JWT_SECRET: 'test-only-secret',
    };
    // `npm test -- --quick some.test.ts`: no type check or lint, vitest on the named files
    const args = process.argv.slice(2);
    const quick = args.includes('--quick');
    const noBuild = args.includes('--no-build');
    const filters = args.filter((a) => a !== '--quick' && a !== '--no-build');
    const steps: [string, string, string[]][] = [
      ...(quick
        ? []
        : ([
            ...['tsconfig.json', 'tsconfig.node.json', 'tsconfig.test.json'].map(
              (project): [string, string, string[]] => [
                `type check (${project})`,
                bin('tsc'),
                ['--noEmit', '-p', project],
              ],
            ),
            ['lint', bin('eslint'), ['.', '--max-warnings', '0']],
            ['format check', bin('prettier'), ['--check', '.']],
          ] as [string, string, string[]][])),
      ...(noBuild
        ? []
        : ([['client build', bin('vite'), ['build', '--logLevel', 'warn']]] as [
            string,
            string,
            string[],
          ][])),
      ['tests (unit, api, e2e)', bin('vitest'), ['run', ...filters]],
    ];
    let failed = 0;
    for (const [title, cmd, args] of steps) {
      const code = await step(title, cmd, args, env);
      if (code !== 0) {
        console.error(`\n✗ ${title} failed (exit ${code})`);
        failed++;
        if (title === 'client build') break; // e2e cannot run without it
      }
    }
    console.log(failed === 0 ? '\nAll checks passed.' : `\n${failed} step(s) failed.`);
    return failed === 0 ? 0 : 1;
  } finally {
    cleanup();
  }
}

main()
  .then((code) => process.exit(code))
  .catch((error: unknown) => {
    console.error(error instanceof SetupError ? error.message : error);
    process.exit(1);
  });
