import { Op, QueryTypes, type Transaction, type WhereOptions } from 'sequelize';
import { db } from '@/models';
import { userLabels } from '@/lib/auth/labels';
import { auditEventHash, GENESIS_HASH, type AuditEventContent } from './hash';

export type AuditInput = Omit<AuditEventContent, 'at' | 'beforeHash' | 'afterHash' | 'details'> & {
  beforeHash?: string | null;
  afterHash?: string | null;
  details?: Record<string, unknown>;
};

/**
 * Appends one event to the hash chain inside the caller's transaction. The chain head row is
 * locked, so concurrent writers are serialised and each event names its true predecessor.
 */
export async function appendAuditEvent({ transaction, event }: { transaction: Transaction; event: AuditInput }) {
  const { sequelize, AuditEvent } = db();
  const [head] = await sequelize.query<{ last_hash: string }>(
    'SELECT last_hash FROM audit_chain_head WHERE id = 1 FOR UPDATE',
    { type: QueryTypes.SELECT, transaction },
  );
  const prevHash = head?.last_hash ?? GENESIS_HASH;
  // The DATE(3) column keeps milliseconds, exactly what Date holds: the hashed value round-trips.
  const at = new Date();
  const content: AuditEventContent = {
    at, actorId: event.actorId, action: event.action, entityType: event.entityType, entityId: event.entityId,
    beforeHash: event.beforeHash ?? null, afterHash: event.afterHash ?? null, details: event.details ?? {},
  };
  const hash = auditEventHash(prevHash, content);
  const row = await AuditEvent.create({ ...content, prevHash, hash }, { transaction });
  await sequelize.query('UPDATE audit_chain_head SET last_hash = ? WHERE id = 1', {
    replacements: [hash], transaction, type: QueryTypes.UPDATE,
  });
  return row;
}

export interface ChainStatus {
  intact: boolean;
  events: number;
  firstBrokenId?: number;
  reason?: string;
}

/** Walks the chain from the first event and reports the first link whose hash does not hold. */
export async function verifyAuditChain(): Promise<ChainStatus> {
  const { AuditEvent, sequelize } = db();
  let prev = GENESIS_HASH;
  let count = 0;
  let lastId = 0;
  for (;;) {
    const batch = await AuditEvent.findAll({
      where: { id: { [Op.gt]: lastId } }, order: [['id', 'ASC']], limit: 1000,
    });
    if (batch.length === 0) break;
    for (const e of batch) {
      count++;
      if (e.prevHash !== prev) {
        return { intact: false, events: count, firstBrokenId: e.id, reason: 'previous-hash link does not match the event before it' };
      }
      const expected = auditEventHash(prev, e);
      if (expected !== e.hash) {
        return { intact: false, events: count, firstBrokenId: e.id, reason: 'event content does not match its hash' };
      }
      prev = e.hash;
      lastId = e.id;
    }
  }
  const [head] = await sequelize.query<{ last_hash: string }>('SELECT last_hash FROM audit_chain_head WHERE id = 1', {
    type: QueryTypes.SELECT,
  });
  if (head && head.last_hash !== prev) {
    return { intact: false, events: count, reason: 'the newest event(s) were removed: chain head does not match the last event' };
  }
  return { intact: true, events: count };
}

export interface AuditFilter {
  /** Action or its start: "version." finds every version event. */
  action?: string;
  /** The actor's e-mail (exact), or "system". */
  actor?: string;
  /** Part of the subject id: a slug, "slug@2", a calculation or user id. */
  subject?: string;
  from?: Date;
  to?: Date;
}

async function whereOf(filter: AuditFilter): Promise<WhereOptions | null> {
  const where: Record<string | symbol, unknown> = {};
  if (filter.action) where.action = { [Op.like]: `${filter.action.replace(/[%_\\]/g, '\\$&')}%` };
  if (filter.subject) where.entityId = { [Op.like]: `%${filter.subject.replace(/[%_\\]/g, '\\$&')}%` };
  if (filter.actor) {
    if (filter.actor === 'system') where.actorId = null;
    else {
      const user = await db().User.findOne({ where: { email: filter.actor.toLowerCase() }, attributes: ['id'] });
      if (!user) return null;
      where.actorId = user.id;
    }
  }
  if (filter.from || filter.to) where.at = { ...(filter.from ? { [Op.gte]: filter.from } : {}), ...(filter.to ? { [Op.lt]: filter.to } : {}) };
  return where as WhereOptions;
}

/** Newest first, with actor names; filtered by action, actor, subject and time. */
export async function listAuditEvents({ page, pageSize, filter = {} }: { page: number; pageSize: number; filter?: AuditFilter }) {
  const { AuditEvent } = db();
  const where = await whereOf(filter);
  if (!where) return { items: [], total: 0, page, pageSize };
  const { rows, count } = await AuditEvent.findAndCountAll({ where, order: [['id', 'DESC']], limit: pageSize, offset: (page - 1) * pageSize });
  const names = await userLabels({ ids: rows.map((e) => e.actorId), field: 'email' });
  return {
    items: rows.map((e) => ({
      id: e.id, at: e.at, actor: e.actorId ? names.get(e.actorId) ?? `user ${e.actorId}` : 'system', action: e.action,
      entity: `${e.entityType} ${e.entityId}`, entityType: e.entityType, entityId: e.entityId,
      beforeHash: e.beforeHash, afterHash: e.afterHash, details: e.details, hash: e.hash,
    })),
    total: count, page, pageSize,
  };
}
