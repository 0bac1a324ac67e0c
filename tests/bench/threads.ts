/** Block-seeded work split round-robin across Node worker threads, answers back in block order. */
import { Worker } from 'node:worker_threads';

export async function blocksInThreads<T>(
  script: URL,
  workers: number,
  total: number,
  data: Record<string, unknown>,
): Promise<{ ms: number; blocks: T[] }> {
  const started = performance.now();
  const parts = await Promise.all(
    Array.from({ length: workers }, (_, w) => {
      const blocks = Array.from({ length: total }, (_, b) => b).filter((b) => b % workers === w);
      return new Promise<[number, T][]>((resolve, reject) => {
        const t = new Worker(script, { workerData: { ...data, blocks } });
        t.once('message', (m: [number, T][]) => {
          resolve(m);
          void t.terminate();
        });
        t.once('error', reject);
      });
    }),
  );
  const out: T[] = new Array(total);
  for (const part of parts) for (const [b, s] of part) out[b] = s;
  return { ms: performance.now() - started, blocks: out };
}
