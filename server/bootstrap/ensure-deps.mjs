// Installs the project's dependencies when they are missing or older than the lockfile.
// Plain Node with no imports beyond its own modules: it runs before anything is installed.
import { execFileSync } from 'node:child_process';
import { existsSync, statSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const lock = join(root, 'package-lock.json');
const marker = join(root, 'node_modules', '.package-lock.json');

const [major, minor] = process.versions.node.split('.').map(Number);
if (major < 20 || (major === 20 && minor < 19)) {
  console.error(`Saltation needs Node.js 20.19 or newer; this is ${process.versions.node}.`);
  process.exit(1);
}

const stale = !existsSync(marker) || statSync(lock).mtimeMs > statSync(marker).mtimeMs + 1000;
// A registry that stalls mid-download fails npm ci now and then (an idle timeout): try again,
// a few seconds later, before giving up.
const ATTEMPTS = 3;
if (stale) {
  for (let attempt = 1; ; attempt++) {
    console.log(`Installing dependencies (npm ci)${attempt > 1 ? `, attempt ${attempt}` : ''}…`);
    try {
      execFileSync('npm', ['ci', '--no-audit', '--no-fund'], { cwd: root, stdio: 'inherit' });
      break;
    } catch {
      if (attempt === ATTEMPTS) {
        console.error(`npm ci failed ${ATTEMPTS} times; see the messages above.`);
        process.exit(1);
      }
      console.error('npm ci failed; trying again in 10 s.');
      execFileSync(process.execPath, ['-e', 'setTimeout(() => {}, 10000)']);
    }
  }
}

// argon2 loads a native prebuild; fail here with a clear message rather than mid-request.
try {
  createRequire(join(root, 'package.json'))('argon2');
} catch (error) {
  console.error(
    'The argon2 native module did not load:',
    error instanceof Error ? error.message : error,
  );
  console.error('Try: rm -rf node_modules && npm ci');
  process.exit(1);
}
