import { QueryTypes } from 'sequelize';
import { db } from '@/models';
import { signWebhook } from './signature';
import { isAllowed, webhookAllowlist } from './service';

/**
 * Sends queued webhook deliveries. Every app instance runs one dispatcher; a delivery is claimed with
 * SELECT … FOR UPDATE SKIP LOCKED and leased for a minute, so two instances never send it at once and a crashed
 * sender's lease runs out. A 2xx answer within the timeout delivers; anything else (another status, a redirect, a
 * network error, a timeout, a URL no longer on the allow-list) is retried after base × 2^(attempt − 1), at most
 * WEBHOOK_MAX_ATTEMPTS times, then marked failed (the delivery log shows it; it can be replayed).
 */
const POLL_MS = Number(process.env.WEBHOOK_POLL_MS ?? 1000);
const BASE_MS = Number(process.env.WEBHOOK_RETRY_BASE_MS ?? 30_000);
const MAX_ATTEMPTS = Number(process.env.WEBHOOK_MAX_ATTEMPTS ?? 8);
const MAX_DELAY_MS = 6 * 3_600_000;
const TIMEOUT_MS = 5_000;
const LEASE_S = 60;

let timer: NodeJS.Timeout | null = null;
let running = false;

export function retryDelayMs(attempt: number): number {
  return Math.min(MAX_DELAY_MS, BASE_MS * 2 ** Math.max(0, attempt - 1));
}

export function startWebhookDispatcher() {
  if (timer) return;
  timer = setInterval(() => { void dispatchDue().catch((err) => console.error('webhook dispatch failed', (err as Error).message)); }, POLL_MS);
  timer.unref();
}

export function stopWebhookDispatcher() {
  if (timer) clearInterval(timer);
  timer = null;
}

interface Claimed { id: number; endpoint_id: number; event: string; body: string; attempts: number; url: string; secret: string; deleted_at: Date | null }

/** One pass: claim what is due, send each, record the outcome. Returns how many were attempted. */
export async function dispatchDue(): Promise<number> {
  if (running) return 0;
  running = true;
  try {
    const { sequelize } = db();
    const claimed = await sequelize.transaction(async (transaction) => {
      const due = await sequelize.query<{ id: number }>(
        "SELECT id FROM webhook_deliveries WHERE status IN ('pending', 'sending') AND next_attempt_at <= NOW(3) ORDER BY next_attempt_at LIMIT 20 FOR UPDATE SKIP LOCKED",
        { type: QueryTypes.SELECT, transaction });
      if (!due.length) return [] as Claimed[];
      const ids = due.map((d) => d.id);
      await sequelize.query(`UPDATE webhook_deliveries SET status = 'sending', next_attempt_at = NOW(3) + INTERVAL ${LEASE_S} SECOND WHERE id IN (?)`, { replacements: [ids], type: QueryTypes.UPDATE, transaction });
      return sequelize.query<Claimed>(
        'SELECT d.id, d.endpoint_id, d.event, d.body, d.attempts, e.url, e.secret, e.deleted_at FROM webhook_deliveries d JOIN webhook_endpoints e ON e.id = d.endpoint_id WHERE d.id IN (?)',
        { replacements: [ids], type: QueryTypes.SELECT, transaction });
    });
    if (!claimed.length) return 0;
    const allowlist = await webhookAllowlist();
    await Promise.all(claimed.map((d) => send(d, allowlist)));
    return claimed.length;
  } finally {
    running = false;
  }
}

async function send(d: Claimed, allowlist: string[]) {
  const { sequelize } = db();
  const attempt = d.attempts + 1;
  let status: number | null = null;
  let error: string | null = null;
  if (d.deleted_at) error = 'endpoint deleted';
  else if (!isAllowed(d.url, allowlist)) error = 'URL no longer on the allow-list';
  else {
    const timestamp = Math.floor(Date.now() / 1000);
    try {
      const res = await fetch(d.url, {
        method: 'POST',
        headers: {
          'content-type': 'application/json', 'user-agent': 'Correlary-Webhooks/1',
          'correlary-webhook-id': String(d.id), 'correlary-webhook-event': d.event,
          'correlary-webhook-timestamp': String(timestamp), 'correlary-webhook-signature': signWebhook(d.secret, timestamp, d.body),
        },
        body: d.body,
        redirect: 'manual',
        signal: AbortSignal.timeout(TIMEOUT_MS),
      });
      status = res.status;
      await res.body?.cancel().catch(() => undefined);
      if (res.status < 200 || res.status >= 300) error = `answered ${res.status}`;
    } catch (err) {
      error = (err as Error).name === 'TimeoutError' ? `no answer within ${TIMEOUT_MS / 1000} s` : (err as Error).message.slice(0, 300);
    }
  }
  if (!error) {
    await sequelize.query("UPDATE webhook_deliveries SET status = 'delivered', attempts = ?, last_status = ?, last_error = NULL, delivered_at = NOW(3) WHERE id = ?",
      { replacements: [attempt, status, d.id], type: QueryTypes.UPDATE });
    return;
  }
  const final = attempt >= MAX_ATTEMPTS || d.deleted_at !== null;
  await sequelize.query(`UPDATE webhook_deliveries SET status = ?, attempts = ?, last_status = ?, last_error = ?, next_attempt_at = NOW(3) + INTERVAL ? MICROSECOND WHERE id = ?`,
    { replacements: [final ? 'failed' : 'pending', attempt, status, error, retryDelayMs(attempt) * 1000, d.id], type: QueryTypes.UPDATE });
}
