/**
 * Computed results kept in IndexedDB under a hash of their inputs (canonical JSON of scenario
 * parameters, settings and engine version), so opening the same run again is instant. The cache
 * has a size cap and evicts the least recently used entries; an entry is written whole, in one
 * transaction, or not at all.
 */
import { canonicalJson, ENGINE_VERSION } from '../engine/core';
import type { CachedResult, SaltationDb } from './db';

export const CACHE_CAP_BYTES = 64 * 1024 * 1024;

export async function cacheKey(kind: string, inputs: unknown): Promise<string> {
  const text = canonicalJson({ kind, inputs, engine: ENGINE_VERSION });
  const digest = await crypto.subtle.digest('SHA-256', new TextEncoder().encode(text));
  return `${kind}:${Array.from(new Uint8Array(digest), (b) => b.toString(16).padStart(2, '0')).join('')}`;
}

export async function getCached<T>(db: SaltationDb, key: string): Promise<T | undefined> {
  const hit = await db.results.get(key);
  if (!hit) return undefined;
  await db.results.update(key, { lastUsedAt: Date.now() });
  return hit.value as T;
}

export async function putCached(
  db: SaltationDb,
  key: string,
  kind: string,
  value: unknown,
  bytes: number,
  cap = CACHE_CAP_BYTES,
): Promise<void> {
  await db.transaction('rw', db.results, async () => {
    const now = Date.now();
    await db.results.put({ key, kind, value, bytes, createdAt: now, lastUsedAt: now });
    let total = 0;
    const all: CachedResult[] = await db.results.orderBy('lastUsedAt').toArray();
    for (const r of all) total += r.bytes;
    for (const r of all) {
      if (total <= cap) break;
      if (r.key === key) continue;
      await db.results.delete(r.key);
      total -= r.bytes;
    }
  });
}

export async function cacheSize(db: SaltationDb): Promise<{ entries: number; bytes: number }> {
  const all = await db.results.toArray();
  return { entries: all.length, bytes: all.reduce((a, r) => a + r.bytes, 0) };
}

export function clearCache(db: SaltationDb): Promise<void> {
  return db.results.clear();
}
