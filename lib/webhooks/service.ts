import { readSetting, saveSetting } from '@/lib/db/settings';
import { randomBytes } from 'node:crypto';
import { QueryTypes, type Transaction } from 'sequelize';
import { db } from '@/models';
import { AppError } from '@/lib/http/errors';
import type { AuthUser } from '@/lib/auth/users';
import { appendAuditEvent } from '@/lib/audit/log';

/**
 * Webhooks: an integrator registers an endpoint (URL on the admin's allow-list, the events it wants, the
 * correlations it follows) and receives signed deliveries when a version it depends on changes. Deliveries are
 * written to an outbox inside the transaction of the change (so a rolled-back change sends nothing) and sent by
 * lib/webhooks/dispatcher.ts with retries.
 */
import { WEBHOOK_EVENTS, type WebhookEvent } from './events';

export { WEBHOOK_EVENTS, type WebhookEvent };
const ALLOWLIST_KEY = 'webhook-allowlist';
const MAX_ENDPOINTS_PER_USER = 20;

export interface EndpointView {
  id: number; url: string; events: string[]; slugs: string[] | null; createdAt: string; userId: number;
  deliveries: { pending: number; delivered: number; failed: number };
}

/** URL prefixes an admin allows deliveries to (scheme, host, port and path prefix). Empty: no webhooks at all. */
export async function webhookAllowlist(): Promise<string[]> {
  return (await readSetting<string[]>(ALLOWLIST_KEY)) ?? [];
}

export function normalizeUrl(raw: string, path = 'url'): string {
  let u: URL;
  try { u = new URL(raw); } catch { throw new AppError('invalid:url', `"${raw.slice(0, 100)}" is not a URL.`, { issues: [{ path, message: 'Not a URL' }] }); }
  if (u.protocol !== 'https:' && u.protocol !== 'http:') throw new AppError('invalid:url', 'Only http and https URLs can receive webhooks.', { issues: [{ path, message: 'Use http or https' }] });
  if (u.username || u.password) throw new AppError('invalid:url', 'Put no credentials in the URL; the signature authenticates the sender.', { issues: [{ path, message: 'No user or password in the URL' }] });
  u.hash = '';
  return u.href;
}

export function isAllowed(url: string, allowlist: string[]): boolean {
  return allowlist.some((prefix) => url.startsWith(prefix));
}

export async function setWebhookAllowlist({ actor, prefixes }: { actor: AuthUser; prefixes: string[] }) {
  if (!actor.roles.includes('admin')) throw new AppError('forbidden:role', 'Only an admin changes the webhook allow-list.');
  const normalized = prefixes.map((p, i) => normalizeUrl(p, `prefixes.${i}`));
  const before = await webhookAllowlist();
  await saveSetting({ key: ALLOWLIST_KEY, value: normalized, before, actorId: actor.id, action: 'webhooks.allowlist-changed' });
  return { prefixes: normalized };
}

interface EndpointRow { id: number; user_id: number; url: string; events: string; slugs: string | null; secret: string; created_at: Date }

export async function registerEndpoint({ actor, url, events, slugs }: { actor: AuthUser; url: string; events: string[]; slugs?: string[] | null }) {
  const href = normalizeUrl(url);
  if (!isAllowed(href, await webhookAllowlist())) {
    throw new AppError('invalid:url-not-allowed', 'This URL is not on the allow-list an admin keeps for webhooks; ask an admin to add its prefix.', { issues: [{ path: 'url', message: 'Not on the webhook allow-list' }] });
  }
  const { sequelize } = db();
  const secret = `whsec_${randomBytes(24).toString('base64url')}`;
  const id = await sequelize.transaction(async (transaction) => {
    const [{ n }] = await sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM webhook_endpoints WHERE user_id = ? AND deleted_at IS NULL FOR UPDATE', { replacements: [actor.id], type: QueryTypes.SELECT, transaction });
    if (Number(n) >= MAX_ENDPOINTS_PER_USER) throw new AppError('conflict:too-many-endpoints', `At most ${MAX_ENDPOINTS_PER_USER} webhook endpoints per person; delete one first.`);
    const [insertId] = await sequelize.query('INSERT INTO webhook_endpoints (user_id, url, events, slugs, secret, created_at) VALUES (?, ?, ?, ?, ?, ?)',
      { replacements: [actor.id, href, JSON.stringify(events), slugs?.length ? JSON.stringify(slugs) : null, secret, new Date()], type: QueryTypes.INSERT, transaction });
    await appendAuditEvent({ transaction, event: { actorId: actor.id, action: 'webhooks.endpoint-registered', entityType: 'webhook', entityId: String(insertId), details: { url: href, events, slugs: slugs ?? null } } });
    return Number(insertId);
  });
  // The secret is shown once, at registration; the deliveries carry its signature, never the secret itself.
  return { id, url: href, events, slugs: slugs?.length ? slugs : null, secret };
}

async function ownedEndpoint(actor: AuthUser, id: number, transaction?: Transaction): Promise<EndpointRow> {
  const [row] = await db().sequelize.query<EndpointRow>('SELECT * FROM webhook_endpoints WHERE id = ? AND deleted_at IS NULL', { replacements: [id], type: QueryTypes.SELECT, transaction });
  // Another person's endpoint answers exactly like a missing one.
  if (!row || (row.user_id !== actor.id && !actor.roles.includes('admin'))) throw new AppError('not_found:webhook', `No webhook endpoint ${id}.`);
  return row;
}

export async function listEndpoints({ actor, all = false }: { actor: AuthUser; all?: boolean }): Promise<EndpointView[]> {
  const { sequelize } = db();
  const rows = await sequelize.query<EndpointRow & { pending: number; delivered: number; failed: number }>(`
    SELECT e.*, SUM(d.status IN ('pending', 'sending')) AS pending, SUM(d.status = 'delivered') AS delivered, SUM(d.status = 'failed') AS failed
    FROM webhook_endpoints e LEFT JOIN webhook_deliveries d ON d.endpoint_id = e.id
    WHERE e.deleted_at IS NULL ${all && actor.roles.includes('admin') ? '' : 'AND e.user_id = ?'}
    GROUP BY e.id ORDER BY e.id`, { replacements: all ? [] : [actor.id], type: QueryTypes.SELECT });
  return rows.map((r) => ({
    id: r.id, url: r.url, events: JSON.parse(r.events) as string[], slugs: r.slugs ? (JSON.parse(r.slugs) as string[]) : null,
    createdAt: new Date(r.created_at).toISOString(), userId: r.user_id,
    deliveries: { pending: Number(r.pending ?? 0), delivered: Number(r.delivered ?? 0), failed: Number(r.failed ?? 0) },
  }));
}

export async function deleteEndpoint({ actor, id }: { actor: AuthUser; id: number }) {
  const { sequelize } = db();
  await sequelize.transaction(async (transaction) => {
    const row = await ownedEndpoint(actor, id, transaction);
    await sequelize.query('UPDATE webhook_endpoints SET deleted_at = ? WHERE id = ?', { replacements: [new Date(), row.id], type: QueryTypes.UPDATE, transaction });
    // Nothing more leaves for a deleted endpoint.
    await sequelize.query("UPDATE webhook_deliveries SET status = 'failed', last_error = 'endpoint deleted' WHERE endpoint_id = ? AND status IN ('pending', 'sending')", { replacements: [row.id], type: QueryTypes.UPDATE, transaction });
    await appendAuditEvent({ transaction, event: { actorId: actor.id, action: 'webhooks.endpoint-deleted', entityType: 'webhook', entityId: String(row.id), details: { url: row.url } } });
  });
  return { id, deleted: true };
}

export interface DeliveryView {
  id: number; event: string; status: string; attempts: number; nextAttemptAt: string | null; lastStatus: number | null; lastError: string | null;
  deliveredAt: string | null; createdAt: string; replayOf: number | null; body: unknown;
}

export async function listDeliveries({ actor, id, limit = 100 }: { actor: AuthUser; id: number; limit?: number }): Promise<DeliveryView[]> {
  await ownedEndpoint(actor, id);
  const rows = await db().sequelize.query<{ id: number; event: string; status: string; attempts: number; next_attempt_at: Date; last_status: number | null; last_error: string | null; delivered_at: Date | null; created_at: Date; replay_of: number | null; body: string }>(
    'SELECT * FROM webhook_deliveries WHERE endpoint_id = ? ORDER BY id DESC LIMIT ?', { replacements: [id, Math.min(500, Math.max(1, limit))], type: QueryTypes.SELECT });
  return rows.map((r) => ({
    id: Number(r.id), event: r.event, status: r.status, attempts: r.attempts, nextAttemptAt: r.status === 'pending' ? new Date(r.next_attempt_at).toISOString() : null,
    lastStatus: r.last_status, lastError: r.last_error, deliveredAt: r.delivered_at ? new Date(r.delivered_at).toISOString() : null,
    createdAt: new Date(r.created_at).toISOString(), replayOf: r.replay_of ? Number(r.replay_of) : null, body: JSON.parse(r.body),
  }));
}

/** Sends a delivery again as a new delivery (new id, signed afresh when it leaves). */
export async function replayDelivery({ actor, id, deliveryId }: { actor: AuthUser; id: number; deliveryId: number }) {
  const { sequelize } = db();
  return sequelize.transaction(async (transaction) => {
    const endpoint = await ownedEndpoint(actor, id, transaction);
    const [d] = await sequelize.query<{ event: string; body: string }>('SELECT event, body FROM webhook_deliveries WHERE id = ? AND endpoint_id = ?', { replacements: [deliveryId, endpoint.id], type: QueryTypes.SELECT, transaction });
    if (!d) throw new AppError('not_found:delivery', `No delivery ${deliveryId} for webhook endpoint ${id}.`);
    const now = new Date();
    const [newId] = await sequelize.query("INSERT INTO webhook_deliveries (endpoint_id, event, body, status, attempts, next_attempt_at, replay_of, created_at) VALUES (?, ?, ?, 'pending', 0, ?, ?, ?)",
      { replacements: [endpoint.id, d.event, d.body, now, deliveryId, now], type: QueryTypes.INSERT, transaction });
    await appendAuditEvent({ transaction, event: { actorId: actor.id, action: 'webhooks.delivery-replayed', entityType: 'webhook', entityId: String(endpoint.id), details: { deliveryId, replay: Number(newId) } } });
    return { id: Number(newId), replayOf: deliveryId, status: 'pending' };
  });
}

/** A test delivery to check the receiver and its signature check. */
export async function pingEndpoint({ actor, id }: { actor: AuthUser; id: number }) {
  const endpoint = await ownedEndpoint(actor, id);
  const { sequelize } = db();
  return sequelize.transaction(async (transaction) => {
    const [deliveryId] = await insertDeliveries([{ endpointId: endpoint.id, event: 'ping', data: { endpoint: endpoint.id, message: 'Correlary webhook test' } }], transaction);
    return { id: deliveryId, event: 'ping', status: 'pending' };
  });
}

async function insertDeliveries(rows: { endpointId: number; event: WebhookEvent; data: Record<string, unknown> }[], transaction: Transaction): Promise<number[]> {
  const { sequelize } = db();
  const ids: number[] = [];
  const now = new Date();
  for (const r of rows) {
    const body = JSON.stringify({ event: r.event, occurredAt: now.toISOString(), data: r.data });
    const [id] = await sequelize.query("INSERT INTO webhook_deliveries (endpoint_id, event, body, status, attempts, next_attempt_at, created_at) VALUES (?, ?, ?, 'pending', 0, ?, ?)",
      { replacements: [r.endpointId, r.event, body, now, now], type: QueryTypes.INSERT, transaction });
    ids.push(Number(id));
  }
  return ids;
}

/**
 * Queues deliveries of a version event inside the caller's transaction, to every endpoint that asked for the event
 * and follows the correlation: by naming its slug, or (naming none) because its owner's API tokens evaluated a
 * version of it. Calculation flags go to endpoints of the people who own or saved the flagged calculations.
 */
export async function enqueueVersionEvent({ transaction, event, slug, data, people = [] }: {
  transaction: Transaction; event: WebhookEvent; slug: string; data: Record<string, unknown>; people?: number[];
}) {
  const { sequelize } = db();
  const endpoints = await sequelize.query<{ id: number; user_id: number; events: string; slugs: string | null; used: number }>(`
    SELECT e.id, e.user_id, e.events, e.slugs,
      EXISTS (SELECT 1 FROM usage_records u JOIN correlation_versions v ON v.id = u.version_id JOIN correlations c ON c.id = v.correlation_id
              WHERE u.user_id = e.user_id AND u.token_id > 0 AND c.slug = ?) AS used
    FROM webhook_endpoints e WHERE e.deleted_at IS NULL`, { replacements: [slug], type: QueryTypes.SELECT, transaction });
  const targets = endpoints.filter((e) => {
    if (!(JSON.parse(e.events) as string[]).includes(event)) return false;
    if (event === 'calculation.flagged') return people.includes(e.user_id);
    const slugs = e.slugs ? (JSON.parse(e.slugs) as string[]) : null;
    return slugs ? slugs.includes(slug) : Boolean(Number(e.used));
  });
  if (targets.length) await insertDeliveries(targets.map((e) => ({ endpointId: e.id, event, data })), transaction);
  return targets.length;
}
