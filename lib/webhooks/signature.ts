import { createHmac, timingSafeEqual } from 'node:crypto';

/**
 * How a webhook delivery is signed, and how a receiver checks it. Every request carries
 *   Correlary-Webhook-Id:        the delivery number (the same for retries of one delivery)
 *   Correlary-Webhook-Event:     version.approved | version.superseded | version.withdrawn | calculation.flagged | ping
 *   Correlary-Webhook-Timestamp: Unix seconds when this attempt was sent
 *   Correlary-Webhook-Signature: v1=<hex HMAC-SHA-256 of "<timestamp>.<raw body>" with the endpoint's secret>
 * A receiver recomputes the HMAC over the raw body bytes, compares in constant time, refuses a timestamp more
 * than five minutes from its own clock (a captured request replayed later), and ignores an id it has already
 * processed (a replay within the window, or our own retry after a lost answer).
 */
export const SIGNATURE_TOLERANCE_S = 300;

export function signWebhook(secret: string, timestamp: number, body: string): string {
  return `v1=${createHmac('sha256', secret).update(`${timestamp}.${body}`).digest('hex')}`;
}

export function verifyWebhook({ secret, timestamp, signature, body, now = Date.now() / 1000, toleranceS = SIGNATURE_TOLERANCE_S }: {
  secret: string; timestamp: string | number; signature: string; body: string; now?: number; toleranceS?: number;
}): { ok: true } | { ok: false; reason: 'malformed' | 'stale' | 'mismatch' } {
  const t = Number(timestamp);
  if (!Number.isInteger(t) || !/^v1=[0-9a-f]{64}$/.test(signature)) return { ok: false, reason: 'malformed' };
  if (Math.abs(now - t) > toleranceS) return { ok: false, reason: 'stale' };
  const expected = Buffer.from(signWebhook(secret, t, body));
  const got = Buffer.from(signature);
  return expected.length === got.length && timingSafeEqual(expected, got) ? { ok: true } : { ok: false, reason: 'mismatch' };
}
