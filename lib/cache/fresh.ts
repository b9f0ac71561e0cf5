import { LRUCache } from 'lru-cache';

/**
 * Short-lived caches on the request path. What they hold may be at most FRESHNESS_MS old (default 1 s): that is the
 * stated bound within which a revoked token, a deactivated user, a withdrawn version or a new approval takes effect
 * on every app instance. The instance that makes such a change drops its own entries at once (`forget…`).
 */
export const FRESHNESS_MS = Math.max(0, Number(process.env.FRESHNESS_MS ?? 1000));

/**
 * A cache that loads what it misses with `load`, once: requests that miss the same key while it loads wait for
 * that one load instead of each querying the database (no stampede when a busy entry expires).
 */
export function freshLoader<V extends {}, C = unknown>(load: (key: string, context: C) => Promise<V>, max = 10_000): LRUCache<string, V, C> {
  return new LRUCache<string, V, C>({
    max, ttl: Math.max(1, FRESHNESS_MS), ttlAutopurge: false, allowStale: false,
    fetchMethod: (key, _stale, { context }) => load(key, context),
  });
}
