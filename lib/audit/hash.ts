import { createHash } from 'node:crypto';
import { canonicalJson } from '@/lib/engine/canonical';

export const GENESIS_HASH = '0'.repeat(64);

export interface AuditEventContent {
  at: Date;
  actorId: number | null;
  action: string;
  entityType: string;
  entityId: string;
  beforeHash: string | null;
  afterHash: string | null;
  details: Record<string, unknown>;
}

/** Hash of one event, chained to the previous event's hash. */
export function auditEventHash(prevHash: string, e: AuditEventContent): string {
  const body = canonicalJson({
    at: e.at.toISOString(), actorId: e.actorId, action: e.action, entityType: e.entityType,
    entityId: e.entityId, beforeHash: e.beforeHash, afterHash: e.afterHash, details: e.details,
  });
  return createHash('sha256').update(prevHash).update('\n').update(body).digest('hex');
}
