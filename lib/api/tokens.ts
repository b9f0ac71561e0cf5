import { randomBytes, createHash } from 'node:crypto';
import { QueryTypes } from 'sequelize';
import { db, type Role } from '@/models';
import { AppError } from '@/lib/http/errors';
import { appendAuditEvent } from '@/lib/audit/log';
import { userLabels } from '@/lib/auth/labels';
import { freshLoader } from '@/lib/cache/fresh';

/** read: look up; evaluate: evaluate and run (rate-limited); write: author drafts and save calculations. */
export const TOKEN_SCOPES = ['read', 'evaluate', 'write'] as const;
export type TokenScope = (typeof TOKEN_SCOPES)[number];
const TOKEN_PREFIX = 'crl_';

export const hashToken = (token: string) => createHash('sha256').update(token).digest('hex');

/** Creates a token; the plain value is returned once and only its hash is stored. */
export async function createApiToken({ actorId, userId, name, scopes, expiresAt }: {
  actorId: number | null; userId: number; name: string; scopes: TokenScope[]; expiresAt: Date | null;
}) {
  const { sequelize, ApiToken } = db();
  const plain = TOKEN_PREFIX + randomBytes(24).toString('base64url');
  const prefix = plain.slice(0, 12);
  return sequelize.transaction(async (transaction) => {
    const row = await ApiToken.create({
      userId, name, prefix, tokenHash: hashToken(plain), scopes: [...new Set(scopes)].sort().join(' '),
      expiresAt, revokedAt: null, lastUsedAt: null,
    }, { transaction });
    await appendAuditEvent({ transaction, event: { actorId, action: 'token.created', entityType: 'api_token', entityId: String(row.id), details: { userId, name, prefix, scopes, expiresAt: expiresAt?.toISOString() ?? null } } });
    return { id: row.id, token: plain, prefix, name, scopes, expiresAt };
  });
}

export async function revokeApiToken({ actorId, tokenId, isAdmin }: { actorId: number; tokenId: number; isAdmin: boolean }) {
  const { sequelize, ApiToken } = db();
  return sequelize.transaction(async (transaction) => {
    const row = await ApiToken.findByPk(tokenId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!row || (!isAdmin && row.userId !== actorId)) throw new AppError('not_found:api-token', `No API token with id ${tokenId}.`);
    if (row.revokedAt) return row;
    await row.update({ revokedAt: new Date() }, { transaction });
    await appendAuditEvent({ transaction, event: { actorId, action: 'token.revoked', entityType: 'api_token', entityId: String(row.id), details: { prefix: row.prefix } } });
    return row;
  }).finally(() => forgetCachedToken(tokenId));
}

export async function listApiTokens({ userId }: { userId?: number }) {
  const { ApiToken } = db();
  const rows = await ApiToken.findAll({ where: userId ? { userId } : {}, order: [['id', 'DESC']] });
  const users = await userLabels({ ids: rows.map((t) => t.userId), field: 'email' });
  return rows.map((t) => ({
    id: t.id, name: t.name, prefix: t.prefix, scopes: t.scopes.split(' '), userId: t.userId,
    userEmail: users.get(t.userId) ?? '?', expiresAt: t.expiresAt, revokedAt: t.revokedAt,
    lastUsedAt: t.lastUsedAt, createdAt: t.createdAt,
  }));
}

interface TokenRow {
  id: number; user_id: number; scopes: string; expires_at: Date | null; revoked_at: Date | null; last_used_at: Date | null;
  email: string; name: string; is_active: number; roles: string | null;
}
/** Token rows by hash, at most FRESHNESS_MS old (lib/cache/fresh.ts); unknown hashes are remembered too (`none`). */
const tokenCache = freshLoader<TokenRow | { none: true }>(async (hash) => {
  const [found] = await db().sequelize.query<TokenRow>(`SELECT t.id, t.user_id, t.scopes, t.expires_at, t.revoked_at, t.last_used_at, u.email, u.name, u.is_active,
      (SELECT GROUP_CONCAT(r.role ORDER BY r.role) FROM user_roles r WHERE r.user_id = u.id) AS roles
    FROM api_tokens t JOIN users u ON u.id = t.user_id WHERE t.token_hash = ?`, { replacements: [hash], type: QueryTypes.SELECT });
  return found ?? { none: true };
}, 20_000);

/** This instance forgets a token at once when it revokes it; the others within FRESHNESS_MS. */
export function forgetCachedToken(tokenId: number) {
  for (const [key, row] of tokenCache.entries()) if ('id' in row && row.id === tokenId) tokenCache.delete(key);
}

/** After a change to a user (deactivation, roles): this instance forgets their tokens at once. */
export function forgetCachedTokensOfUser(userId: number) {
  for (const [key, row] of tokenCache.entries()) if ('user_id' in row && row.user_id === userId) tokenCache.delete(key);
}

/**
 * Resolves a bearer token, with its user and roles: one query, then answered from memory for at most
 * FRESHNESS_MS (1 s by default), so a revoked or expired token, a deactivated user or a changed role takes effect
 * on every instance within that bound (at once on the instance that made the change). Expiry is checked on
 * every request against the clock.
 */
export async function resolveApiToken(plain: string) {
  const { ApiToken } = db();
  const cached = (await tokenCache.fetch(hashToken(plain)))!;
  const row = 'none' in cached ? undefined : cached;
  if (!row) throw new AppError('unauthenticated:token', 'The API token is not valid.');
  if (row.revoked_at) throw new AppError('unauthenticated:token-revoked', 'The API token was revoked.');
  if (row.expires_at && new Date(row.expires_at).getTime() <= Date.now()) {
    throw new AppError('unauthenticated:token-expired', 'The API token has expired.');
  }
  if (!row.is_active) throw new AppError('unauthenticated:token', 'The API token belongs to an inactive user.');
  // Last-used is advisory: written without waiting, at most once a minute per token.
  if (!row.last_used_at || Date.now() - new Date(row.last_used_at).getTime() > 60_000) {
    row.last_used_at = new Date();
    void ApiToken.update({ lastUsedAt: row.last_used_at }, { where: { id: row.id } }).catch(() => undefined);
  }
  return {
    id: row.id, scopes: row.scopes.split(' ') as TokenScope[],
    user: { id: row.user_id, email: row.email, name: row.name, roles: (row.roles ? row.roles.split(',') : []) as Role[] },
  };
}
