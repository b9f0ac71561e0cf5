import { db } from '@/models';
import { AppError } from '@/lib/http/errors';
import { appendAuditEvent } from '@/lib/audit/log';
import { contentHash } from '@/lib/engine/canonical';
import { checkCasesOfVersion } from './check-cases';

/** Checked versions: id → when the check ran, the hash it confirmed and the exact stored definition text. */
const verified = new Map<number, { at: number; hash: string; text: unknown }>();
const RECHECK_MS = 30_000;

/** The parts of a version the integrity check reads: stored hash and the definition as stored (text). */
export interface FrozenContent {
  id: number;
  version: number;
  contentHash: string | null;
  definitionText: unknown;
}

async function raiseAlarm(v: FrozenContent, slug: string, actual: string) {
  const { sequelize } = db();
  await sequelize.transaction((transaction) => appendAuditEvent({ transaction, event: {
    actorId: null, action: 'integrity.hash-mismatch', entityType: 'version', entityId: `${slug}@${v.version}`,
    beforeHash: v.contentHash, afterHash: actual,
    details: { alarm: 'Stored definition or check cases do not match the frozen content hash; the version is not served.' },
  } }));
  console.error(`INTEGRITY ALARM: ${slug}@${v.version} content hash ${v.contentHash} but content hashes to ${actual}`);
}

/**
 * Re-computes a frozen version's content hash from what the database holds now. The full check
 * (definition and check cases) runs at most every RECHECK_MS per version and process, and at once
 * whenever the stored definition text differs from the one last verified. A mismatch raises an alarm
 * in the audit trail and refuses.
 */
export async function verifyFrozen(v: FrozenContent, slug: string): Promise<void> {
  if (!v.contentHash) return;
  const text = v.definitionText;
  const seen = verified.get(v.id);
  if (seen && seen.hash === v.contentHash && seen.text === text && Date.now() - seen.at < RECHECK_MS) return;
  // Requests that find the same check due share it (a busy version does not send every request to the database).
  const key = `${v.id}|${v.contentHash}`;
  let check = checking.get(key);
  if (!check || checkingText.get(key) !== text) {
    check = recheck(v, slug).finally(() => { if (checking.get(key) === check) { checking.delete(key); checkingText.delete(key); } });
    checking.set(key, check);
    checkingText.set(key, text);
  }
  return check;
}

const checking = new Map<string, Promise<void>>();
const checkingText = new Map<string, unknown>();

async function recheck(v: FrozenContent, slug: string): Promise<void> {
  const text = v.definitionText;
  const definition = typeof text === 'string' ? JSON.parse(text) : text;
  const actual = contentHash(definition, await checkCasesOfVersion(v.id));
  if (actual !== v.contentHash) {
    verified.delete(v.id);
    await raiseAlarm(v, slug, actual);
    throw new AppError('conflict:content-hash-mismatch', `Version ${v.version} of "${slug}" does not match its content hash and is not served; the incident is recorded in the audit trail.`);
  }
  verified.set(v.id, { at: Date.now(), hash: v.contentHash, text });
}

export async function assertIntact({ slug, version }: { slug: string; version: number }) {
  const { Correlation, CorrelationVersion } = db();
  const c = await Correlation.findOne({ where: { slug } });
  const v = c && await CorrelationVersion.findOne({ where: { correlationId: c.id, version } });
  if (v) await verifyFrozen(frozenContentOf(v), slug);
}

/** Adapts a Sequelize version row to what verifyFrozen reads. */
export function frozenContentOf(v: { id: number; version: number; contentHash: string | null; getDataValue(key: 'definition'): unknown }): FrozenContent {
  return { id: v.id, version: v.version, contentHash: v.contentHash, definitionText: v.getDataValue('definition') };
}
