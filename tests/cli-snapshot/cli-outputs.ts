/**
 * Runs every request of `requests.json` through the command line, as a user would, and returns
 * what it answered: exit code, response (with `elapsedMs` removed, the only field that may
 * differ between runs) and the error on stderr. The snapshot of these answers pins the CLI's
 * behaviour across refactors; `npm run snapshot:cli` records it again after a deliberate change
 * (with `ENGINE_VERSION` bumped).
 */
import { spawn } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { cpus } from 'node:os';

export const CLI_ENTRY = 'cli/main.ts';

export interface CliRequest {
  name: string;
  command: string;
  request: unknown;
}

export interface CliOutcome {
  name: string;
  exit: number | null;
  response: unknown;
  error: unknown;
}

export function loadRequests(): CliRequest[] {
  return JSON.parse(readFileSync(new URL('./requests.json', import.meta.url), 'utf8'));
}

function withoutElapsed(value: unknown): unknown {
  if (Array.isArray(value)) return value.map(withoutElapsed);
  if (value && typeof value === 'object')
    return Object.fromEntries(
      Object.entries(value)
        .filter(([k]) => k !== 'elapsedMs')
        .map(([k, v]) => [k, withoutElapsed(v)]),
    );
  return value;
}

function runOne(req: CliRequest): Promise<CliOutcome> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, ['--import', 'tsx', CLI_ENTRY, req.command], {
      stdio: ['pipe', 'pipe', 'pipe'],
    });
    let out = '';
    let err = '';
    child.stdout.on('data', (d) => (out += d));
    child.stderr.on('data', (d) => (err += d));
    child.on('error', reject);
    child.on('close', (exit) =>
      resolve({
        name: req.name,
        exit,
        response: out.trim() ? withoutElapsed(JSON.parse(out)) : null,
        error: err.trim() ? JSON.parse(err) : null,
      }),
    );
    child.stdin.end(JSON.stringify(req.request));
  });
}

/** Every request, a few at a time, answers in the order of `requests.json`. */
export async function runAll(requests = loadRequests()): Promise<CliOutcome[]> {
  const out: CliOutcome[] = new Array(requests.length);
  let next = 0;
  const lanes = Math.max(1, Math.min(4, cpus().length));
  await Promise.all(
    Array.from({ length: lanes }, async () => {
      while (next < requests.length) {
        const i = next++;
        out[i] = await runOne(requests[i]);
      }
    }),
  );
  return out;
}
