/** Debian's chromium for the browser tests: found, or installed with apt-get when root. */
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';

const CANDIDATES = ['/usr/bin/chromium', '/usr/bin/chromium-browser'];

export function ensureChromium(log: (line: string) => void): string {
  const fromEnv = process.env.SALTATION_CHROMIUM;
  if (fromEnv && existsSync(fromEnv)) return fromEnv;
  const found = CANDIDATES.find((c) => existsSync(c));
  if (found) return found;
  if (typeof process.getuid !== 'function' || process.getuid() !== 0) {
    throw new Error("The browser tests need Debian's chromium: sudo apt-get install -y chromium");
  }
  log('Installing Debian package "chromium" for the browser tests (apt-get)…');
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  spawnSync('apt-get', ['update', '-qq'], { stdio: 'inherit', env });
  const r = spawnSync('apt-get', ['install', '-y', '-qq', 'chromium'], { stdio: 'inherit', env });
  const installed = CANDIDATES.find((c) => existsSync(c));
  if (r.status !== 0 || !installed) throw new Error('apt-get could not install chromium');
  return installed;
}

/** Flags for a quiet, sandbox-free headless run on a machine with no outside network. */
export const CHROMIUM_ARGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
  '--no-first-run',
];
