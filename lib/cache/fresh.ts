import { LRUCache } from 'lru-cache';

/**
 * Short-lived caches on the request path. What they hold may be at most FRESHNESS_MS old (default 1 s): that is the
 * stated bound within which a revoked token, a deactivated user, a withdrawn version or a new approval takes effect
 * on every app instance. The instance that makes such a change drops its own entries at once (`forget…`).
 */
export const FRESHNESS_MS = Math.max(0, Number(process.env.FRESHNESS_MS ?? 1000));

export function freshCache<V extends {}>(max = 10_000): LRUCache<string, V> {
  return new LRUCache<string, V>({ max, ttl: Math.max(1, FRESHNESS_MS), ttlAutopurge: false, allowStale: false });
}
