/** A service instance in its own process (server/entry/serve-api.ts), as a deployment runs it. */
import { spawn, type ChildProcess } from 'node:child_process';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('../..', import.meta.url));

export interface Instance {
  base: string;
  /** everything it wrote to stdout and stderr */
  output: () => string;
  /** SIGTERM, then wait for the exit (the instance drains first) */
  stop: () => Promise<void>;
  child: ChildProcess;
}

/** Spawns an instance; with `wait` false, resolves once it has exited (a refused start). */
export async function startInstance(
  port: number,
  env: NodeJS.ProcessEnv,
  wait = true,
): Promise<Instance> {
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/entry/serve-api.ts'], {
    cwd: root,
    env: { ...process.env, SALTATION_API_PORT: String(port), ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  const chunks: string[] = [];
  child.stdout!.on('data', (d: Buffer) => chunks.push(d.toString()));
  child.stderr!.on('data', (d: Buffer) => chunks.push(d.toString()));
  const exited = new Promise<void>((r) => child.once('exit', () => r()));
  const instance: Instance = {
    base: `http://127.0.0.1:${port}`,
    output: () => chunks.join(''),
    child,
    stop: async () => {
      if (child.exitCode !== null || child.signalCode !== null) return;
      child.kill('SIGTERM');
      await exited;
    },
  };
  if (!wait) {
    await exited;
    return instance;
  }
  for (let t = 0; t < 300; t++) {
    const ready = await fetch(`${instance.base}/api/ready`).catch(() => null);
    if (ready?.ok) return instance;
    if (child.exitCode !== null) break;
    await new Promise((r) => setTimeout(r, 100));
  }
  await instance.stop();
  throw new Error(`the instance on port ${port} did not become ready:\n${instance.output()}`);
}
