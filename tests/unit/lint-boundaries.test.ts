/**
 * The layer rules are enforced by lint, not by habit: each rule fails on a planted example.
 * The planted files are written into the source tree for the run (so the import resolver sees
 * them as it sees real code) and removed afterwards.
 */
import { mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { ESLint } from 'eslint';
import { afterAll, describe, expect, it } from 'vitest';

const eslint = new ESLint({ cwd: process.cwd() });
const planted: string[] = [];

function plant(path: string, text: string): string {
  mkdirSync(join(path, '..'), { recursive: true });
  writeFileSync(path, text);
  planted.push(path);
  return path;
}

async function rulesBroken(path: string): Promise<string[]> {
  const [result] = await eslint.lintFiles([path]);
  return result.messages.map((m) => m.ruleId ?? m.message);
}

afterAll(() => {
  for (const p of planted) rmSync(p, { force: true });
  rmSync('src/features/planted-cycle', { recursive: true, force: true });
});

describe('lint keeps the layers apart', () => {
  it('fails on a circular import', async () => {
    plant(
      'src/features/planted-cycle/a.ts',
      "import { b } from './b';\nexport const a = () => b;\n",
    );
    const b = plant(
      'src/features/planted-cycle/b.ts',
      "import { a } from './a';\nexport const b = () => a;\n",
    );
    expect(await rulesBroken(b)).toContain('import-x/no-cycle');
  }, 60_000);

  it('fails when a lower engine layer imports an upper one (core importing replay)', async () => {
    const f = plant(
      'src/engine/core/planted-upward.ts',
      "import { replay } from '../replay';\nexport const planted = replay;\n",
    );
    expect(await rulesBroken(f)).toContain('import-x/no-restricted-paths');
  }, 60_000);

  it('fails when one side of the engine imports its neighbour (fit importing paths)', async () => {
    const f = plant(
      'src/engine/fit/planted-sideways.ts',
      "import { simulate } from '../paths';\nexport const planted = simulate;\n",
    );
    expect(await rulesBroken(f)).toContain('import-x/no-restricted-paths');
  }, 60_000);

  it('fails when one feature imports another (book importing sketch)', async () => {
    const f = plant(
      'src/features/book/planted-feature.ts',
      "import { SketchPage } from '../sketch';\nexport const planted = SketchPage;\n",
    );
    expect(await rulesBroken(f)).toContain('import-x/no-restricted-paths');
  }, 60_000);

  it('fails when a shared component imports a route', async () => {
    const f = plant(
      'src/components/planted-route.ts',
      "import { router } from '../routes/router';\nexport const planted = router;\n",
    );
    expect(await rulesBroken(f)).toContain('import-x/no-restricted-paths');
  }, 60_000);

  it('fails when a component calls a worker directly instead of through a hook', async () => {
    const f = plant(
      'src/features/fit/components/PlantedWorker.tsx',
      "import { runFit } from '../../../workers/fit-client';\nexport const planted = runFit;\n",
    );
    expect(await rulesBroken(f)).toContain('@typescript-eslint/no-restricted-imports');
  }, 60_000);

  it('passes the same files where the import goes the allowed way (replay importing core)', async () => {
    const f = plant(
      'src/engine/replay/planted-downward.ts',
      "import { NO_STRESS } from '../core';\nexport const planted = NO_STRESS;\n",
    );
    expect(await rulesBroken(f)).toEqual([]);
  }, 60_000);
});
