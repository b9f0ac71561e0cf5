import { createHash, randomUUID } from 'node:crypto';
import { QueryTypes, type Transaction } from 'sequelize';
import { fileTypeFromBuffer } from 'file-type';
import { db } from '@/models';
import type { AuthUser } from '@/lib/auth/users';
import { AppError } from '@/lib/http/errors';
import { appendAuditEvent } from '@/lib/audit/log';
import { canSeeVersion } from '@/lib/governance/access';
import type { CheckCase } from '@/lib/engine/types';
import { getObject, putObject } from '@/lib/storage/objects';

/** Evidence documents: a PDF excerpt or a scan of a table page behind a reference or a check case. */
export const ATTACHMENT_TYPES = ['application/pdf', 'image/png', 'image/jpeg'] as const;
export type AttachmentType = (typeof ATTACHMENT_TYPES)[number];
/** Largest accepted document, bytes (5 MiB): a page or an excerpt, not a book. */
export const MAX_ATTACHMENT_BYTES = 5 * 1024 * 1024;

export interface AttachmentRef { id: string; sha256: string; mediaType: string; name: string }

const sha256 = (bytes: Uint8Array) => createHash('sha256').update(bytes).digest('hex');

/** A file name fit to show and to send back: no path, no control characters, at most 200 characters. */
export function cleanName(name: string): string {
  const base = name.split(/[\\/]/).pop() ?? '';
  // eslint-disable-next-line no-control-regex
  return base.replace(/[\u0000-\u001f\u007f"<>]/g, '').trim().slice(0, 200);
}

/**
 * Stores an uploaded document: decoded, size-limited, its type detected from the content (never from the name),
 * kept in object storage under its SHA-256 and recorded with its uploader. Authors only.
 */
export async function uploadAttachment({ actor, name, content }: { actor: AuthUser; name: string; content: string }): Promise<AttachmentRef & { size: number }> {
  if (!actor.roles.includes('author')) throw new AppError('forbidden:role', 'Only methods engineers (authors) attach evidence documents.');
  const shown = cleanName(name);
  if (!shown) throw new AppError('invalid:body', 'Give the document a file name.', { issues: [{ path: 'name', message: 'required' }] });
  if (!/^[A-Za-z0-9+/]*={0,2}$/.test(content) || content.length % 4 !== 0) {
    throw new AppError('invalid:body', 'The document content must be base64-encoded bytes.', { issues: [{ path: 'content', message: 'not base64' }] });
  }
  const bytes = new Uint8Array(Buffer.from(content, 'base64'));
  if (bytes.byteLength === 0) throw new AppError('invalid:body', `"${shown}" is empty.`, { issues: [{ path: 'content', message: 'empty file' }] });
  if (bytes.byteLength > MAX_ATTACHMENT_BYTES) {
    throw new AppError('too_large:attachment', `"${shown}" is ${(bytes.byteLength / 1048576).toFixed(1)} MB; a document may be at most ${MAX_ATTACHMENT_BYTES / 1048576} MB (attach the page or excerpt that holds the value).`, { issues: [{ path: 'content', message: `larger than ${MAX_ATTACHMENT_BYTES} bytes` }] });
  }
  await assertUploadAllowance(actor, bytes.byteLength);
  const detected = await fileTypeFromBuffer(bytes);
  if (!detected || !(ATTACHMENT_TYPES as readonly string[]).includes(detected.mime)) {
    throw new AppError('invalid:attachment-type', `"${shown}" is ${detected ? `a ${detected.mime} file` : 'not a file type Correlary recognises'} by its content; attach a PDF, PNG or JPEG.`, { issues: [{ path: 'content', message: `detected type ${detected?.mime ?? 'unknown'}; allowed ${ATTACHMENT_TYPES.join(', ')}` }] });
  }
  const hash = sha256(bytes);
  const objectKey = `attachments/${hash}`;
  // The object first (named by its hash, so a retry or a second upload of the same bytes writes the same thing); then the row.
  await putObject(objectKey, bytes, detected.mime);
  const { sequelize, Attachment } = db();
  const row = await sequelize.transaction(async (transaction) => {
    const a = await Attachment.create({ id: randomUUID(), sha256: hash, mediaType: detected.mime, name: shown, size: bytes.byteLength, objectKey, uploadedBy: actor.id }, { transaction });
    await appendAuditEvent({ transaction, event: { actorId: actor.id, action: 'attachment.uploaded', entityType: 'attachment', entityId: a.id, afterHash: hash, details: { name: shown, mediaType: detected.mime, size: bytes.byteLength } } });
    return a;
  });
  return { id: row.id, sha256: row.sha256, mediaType: row.mediaType, name: row.name, size: row.size };
}

/**
 * Bounds what one person may put into the store in 24 hours (ATTACHMENTS_PER_DAY documents, default 200, and
 * ATTACHMENT_BYTES_PER_DAY, default 200 MB): evidence is a page or an excerpt, and a runaway script must not fill the store.
 */
async function assertUploadAllowance(actor: AuthUser, size: number) {
  const perDay = Number(process.env.ATTACHMENTS_PER_DAY ?? 200);
  const bytesPerDay = Number(process.env.ATTACHMENT_BYTES_PER_DAY ?? 200 * 1024 * 1024);
  const [used] = await db().sequelize.query<{ n: number; bytes: number | null }>(
    'SELECT COUNT(*) AS n, SUM(size) AS bytes FROM attachments WHERE uploaded_by = ? AND created_at > ?',
    { replacements: [actor.id, new Date(Date.now() - 24 * 3600 * 1000)], type: QueryTypes.SELECT });
  if (Number(used.n) + 1 > perDay || Number(used.bytes ?? 0) + size > bytesPerDay) {
    throw new AppError('rate_limited:attachments', `You have uploaded ${Number(used.n)} documents (${(Number(used.bytes ?? 0) / 1048576).toFixed(1)} MB) in the last 24 hours; the limit is ${perDay} documents and ${(bytesPerDay / 1048576).toFixed(0)} MB. Try again later or ask an admin.`, undefined, { 'Retry-After': '3600' });
  }
}

/**
 * Every attachment a version's check cases name must exist and match what was uploaded (hash and type); a reference
 * to someone else's unpublished upload is refused. Problems name the check case.
 */
export async function assertAttachmentRefs(actor: AuthUser, checkCases: unknown[], transaction?: Transaction): Promise<void> {
  const refs = (checkCases as CheckCase[]).map((c, i) => ({ i, ref: c?.source?.attachment })).filter((r) => r.ref);
  if (!refs.length) return;
  const { Attachment } = db();
  const rows = await Attachment.findAll({ where: { id: [...new Set(refs.map((r) => r.ref!.id))] }, transaction });
  const byId = new Map(rows.map((r) => [r.id, r]));
  // Someone else's uploads may be named only once a published version names them: looked up once per document.
  const published = new Set<string>();
  for (const r of rows) if (r.uploadedBy !== actor.id && (await isReferencedByPublished(r.id, transaction))) published.add(r.id);
  const issues: { path: string; message: string }[] = [];
  for (const { i, ref } of refs) {
    const row = byId.get(ref!.id);
    const path = `checkCases[${i}].source.attachment`;
    if (!row) issues.push({ path, message: `no uploaded document ${ref!.id}` });
    else if (row.sha256 !== ref!.sha256 || row.mediaType !== ref!.mediaType) issues.push({ path, message: 'does not match the uploaded document (hash or type)' });
    else if (row.uploadedBy !== actor.id && !published.has(row.id)) issues.push({ path, message: 'another person’s document that no published version uses yet' });
  }
  if (issues.length) throw new AppError('invalid:check-cases', `A check case names an evidence document that cannot be used: ${issues.map((x) => `${x.path}: ${x.message}`).join('; ')}`, { issues });
}

/** Versions whose check cases name the attachment (by its id, which is a UUID). */
async function versionsUsing(id: string, transaction?: Transaction) {
  const { sequelize } = db();
  return sequelize.query<{ id: number; status: string; author_id: number; slug: string; version: number }>(
    `SELECT DISTINCT v.id, v.status, v.author_id, c.slug, v.version FROM check_cases k JOIN correlation_versions v ON v.id = k.version_id
     JOIN correlations c ON c.id = v.correlation_id WHERE k.body LIKE ?`,
    { type: QueryTypes.SELECT, replacements: [`%"id":"${id}"%`], transaction });
}

async function isReferencedByPublished(id: string, transaction?: Transaction) {
  return (await versionsUsing(id, transaction)).some((v) => ['approved', 'superseded', 'withdrawn'].includes(v.status));
}

/**
 * The document's bytes for someone who may read a version that uses it (or its uploader), re-hashed from the store
 * before they leave: a stored object that no longer matches its hash raises the integrity alarm and is not served.
 */
export async function readAttachment({ actor, id }: { actor: AuthUser; id: string }) {
  const { sequelize, Attachment } = db();
  const row = await Attachment.findByPk(id);
  const uses = row ? await versionsUsing(id) : [];
  const mayRead = row && (row.uploadedBy === actor.id || actor.roles.includes('admin')
    || uses.some((v) => canSeeVersion(actor, { status: v.status as never, authorId: v.author_id })));
  // Unknown and not-yours answer alike: an id reveals nothing.
  if (!row || !mayRead) throw new AppError('not_found:attachment', `No evidence document ${id} that you may read.`);
  const bytes = await getObject(row.objectKey);
  const actual = bytes ? sha256(bytes) : null;
  if (actual !== row.sha256) {
    await sequelize.transaction((transaction) => appendAuditEvent({ transaction, event: {
      actorId: null, action: 'integrity.attachment-mismatch', entityType: 'attachment', entityId: row.id, beforeHash: row.sha256, afterHash: actual,
      details: { alarm: bytes ? 'The stored evidence document does not match its SHA-256; it is not served.' : 'The evidence document is missing from object storage.', name: row.name, usedBy: uses.map((v) => `${v.slug}@${v.version}`) },
    } }));
    console.error(`INTEGRITY ALARM: attachment ${row.id} (${row.name}) expected ${row.sha256} but the store holds ${actual ?? 'nothing'}`);
    throw new AppError('conflict:attachment-hash-mismatch', `The evidence document "${row.name}" does not match its recorded SHA-256 and is not served; the incident is recorded in the audit trail.`);
  }
  return { bytes: bytes!, mediaType: row.mediaType, name: row.name, sha256: row.sha256 };
}

/** Every attachment a frozen version names, re-hashed from the store (npm run audit:verify). */
export async function verifyAttachments(): Promise<{ checked: number; mismatches: string[] }> {
  const { sequelize, Attachment } = db();
  const used = await sequelize.query<{ body: string }>(
    `SELECT k.body FROM check_cases k JOIN correlation_versions v ON v.id = k.version_id WHERE v.content_hash IS NOT NULL AND k.body LIKE '%"attachment"%'`,
    { type: QueryTypes.SELECT });
  const ids = new Set<string>();
  for (const r of used) {
    const body = (typeof r.body === 'string' ? JSON.parse(r.body) : r.body) as CheckCase;
    if (body.source?.attachment?.id) ids.add(body.source.attachment.id);
  }
  const mismatches: string[] = [];
  for (const a of await Attachment.findAll({ where: { id: [...ids] } })) {
    const bytes = await getObject(a.objectKey);
    if (!bytes || sha256(bytes) !== a.sha256) mismatches.push(`evidence document ${a.id} (${a.name})${bytes ? '' : ': missing'}`);
  }
  return { checked: ids.size, mismatches };
}
