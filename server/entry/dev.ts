/**
 * `npm run dev`: the project's PostgreSQL, the API with reload (tsx watch) on PORT + 1, and the
 * Vite dev server on PORT proxying /api to it.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { createServer } from 'vite';
import { startProjectCluster } from '../bootstrap/cluster-home';
import { portIsFree, SetupError, type EmbeddedPostgres } from '../bootstrap/postgres';
import { loadConfig } from '../config';

const root = fileURLToPath(new URL('../..', import.meta.url));

async function main() {
  const config = loadConfig();
  const apiPort = config.port + 1;
  for (const p of [config.port, apiPort]) {
    if (!(await portIsFree(p)))
      throw new SetupError(
        `Port ${p} on 127.0.0.1 is in use. Stop what holds it, or run: PORT=4320 npm run dev`,
      );
  }
  let pg: EmbeddedPostgres | undefined;
  let url = config.databaseUrl;
  if (!url) {
    pg = await startProjectCluster(config, console.log);
    url = pg.url;
  }
  const api: ChildProcess = spawn(
    process.execPath,
    ['--import', 'tsx', '--watch', 'server/entry/serve-api.ts'],
    {
      cwd: root,
      stdio: 'inherit',
      env: { ...process.env, DATABASE_URL: url, SALTATION_API_PORT: String(apiPort) },
    },
  );
  process.env.SALTATION_API_PORT = String(apiPort);
  const vite = await createServer({ root, server: { port: config.port, strictPort: true } });
  await vite.listen();
  console.log(`\nSaltation (development) at http://127.0.0.1:${config.port}/ — API on ${apiPort}`);
  const stop = async () => {
    api.kill('SIGTERM');
    await vite.close();
    pg?.stop();
    process.exit(0);
  };
  process.on('SIGINT', () => void stop());
  process.on('SIGTERM', () => void stop());
}

main().catch((error: unknown) => {
  console.error(error instanceof SetupError ? error.message : error);
  process.exit(1);
});
