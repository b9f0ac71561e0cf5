import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createHash } from 'node:crypto';
import { deflateSync } from 'node:zlib';
import { QueryTypes } from 'sequelize';
import { PutObjectCommand, S3Client } from '@aws-sdk/client-s3';
import { call, DEMO_PASSWORD, signIn } from '../support/http';
import { freshUser, plateCases, plateDefinition, FIXTURE_WAIVER } from '../support/fixtures';
import { db } from '@/models';
import { closeSequelize } from '@/lib/db/connection';
import { contentHash } from '@/lib/engine/canonical';
import { simplePdf } from '@/lib/evidence/demo-document';
import { storageSettings } from '@/lib/storage/objects';
import { verifyAllContent } from '@/lib/governance/content-check';
import { uploadAttachment } from '@/lib/evidence/attachments';

const b64 = (bytes: Uint8Array) => Buffer.from(bytes).toString('base64');
const sha = (bytes: Uint8Array) => createHash('sha256').update(bytes).digest('hex');

/** A real 1×1 PNG (signature, IHDR, IDAT, IEND with their CRCs), built here. */
function tinyPng(): Uint8Array {
  const crcTable = Array.from({ length: 256 }, (_, n) => { let c = n; for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1; return c >>> 0; });
  const crc = (buf: Buffer) => { let c = 0xffffffff; for (const b of buf) c = crcTable[(c ^ b) & 0xff] ^ (c >>> 8); return (c ^ 0xffffffff) >>> 0; };
  const chunk = (type: string, data: Buffer) => { const len = Buffer.alloc(4); len.writeUInt32BE(data.length); const td = Buffer.concat([Buffer.from(type, 'latin1'), data]); const c = Buffer.alloc(4); c.writeUInt32BE(crc(td)); return Buffer.concat([len, td, c]); };
  const ihdr = Buffer.from([0, 0, 0, 1, 0, 0, 0, 1, 8, 2, 0, 0, 0]);
  return new Uint8Array(Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), chunk('IHDR', ihdr), chunk('IDAT', deflateSync(Buffer.from([0, 255, 255, 255]))), chunk('IEND', Buffer.alloc(0))]));
}

async function countAttachments() {
  const [row] = await db().sequelize.query<{ n: number }>('SELECT COUNT(*) AS n FROM attachments', { type: QueryTypes.SELECT });
  return Number(row.n);
}

describe('evidence documents in object storage', () => {
  let author: Awaited<ReturnType<typeof freshUser>>;
  let otherAuthor: Awaited<ReturnType<typeof freshUser>>;
  let engineer: string;
  let approver: string;
  const pdf = simplePdf(['Test rig record (invented for a test)', 'Table 3: Nu_x at Re_x = 1e4, Pr = 0.7']);
  beforeAll(async () => {
    author = await freshUser(['author'], 'attach');
    otherAuthor = await freshUser(['author'], 'attach2');
    engineer = (await signIn('engineer@demo.example')).cookie!;
    approver = (await signIn('approver@demo.example')).cookie!;
  });
  afterAll(() => closeSequelize());

  it('stores a PDF and a PNG by their content, with the SHA-256 of the bytes', async () => {
    const up = await call('/api/attachments', { cookie: author.cookie, body: { name: 'C:\\scans\\rig table 3.pdf', content: b64(pdf) } });
    expect(up.status).toBe(200);
    expect(up.body).toMatchObject({ sha256: sha(pdf), mediaType: 'application/pdf', name: 'rig table 3.pdf', size: pdf.byteLength });
    const png = tinyPng();
    const img = await call('/api/attachments', { cookie: author.cookie, body: { name: 'figure.jpg', content: b64(png) } });
    // The name says JPEG, the bytes say PNG: the content decides.
    expect(img.body).toMatchObject({ mediaType: 'image/png', sha256: sha(png) });
  });

  it('refuses a wrong type and an oversize file with a message naming the field, and keeps nothing', async () => {
    const before = await countAttachments();
    const text = await call('/api/attachments', { cookie: author.cookie, body: { name: 'table.pdf', content: b64(new TextEncoder().encode('just some text, not a PDF at all\n')) } });
    expect(text.status).toBe(422);
    expect(text.body.error.code).toBe('invalid:attachment-type');
    expect(text.body.error.message).toContain('attach a PDF, PNG or JPEG');
    expect(text.body.error.details.issues[0].path).toBe('content');
    const big = new Uint8Array(5 * 1024 * 1024 + 1); big.set(pdf);
    const huge = await call('/api/attachments', { cookie: author.cookie, body: { name: 'book.pdf', content: b64(big) } });
    expect(huge.status).toBe(413);
    expect(huge.body.error.message).toMatch(/at most 5 MB/);
    const garbage = await call('/api/attachments', { cookie: author.cookie, body: { name: 'x.pdf', content: 'not base64!' } });
    expect(garbage.status).toBe(422);
    expect(garbage.body.error.details.issues[0].path).toBe('content');
    expect((await call('/api/attachments', { cookie: engineer, body: { name: 'x.pdf', content: b64(pdf) } })).status).toBe(403);
    expect(await countAttachments()).toBe(before);
  });

  it('bounds what one person may upload in a day, with the reason and when to retry', async () => {
    const previous = process.env.ATTACHMENTS_PER_DAY;
    process.env.ATTACHMENTS_PER_DAY = '2';
    try {
      const someone = await freshUser(['author'], 'quota');
      await uploadAttachment({ actor: someone.user, name: 'a.pdf', content: b64(simplePdf(['one'])) });
      await uploadAttachment({ actor: someone.user, name: 'b.pdf', content: b64(simplePdf(['two'])) });
      await expect(uploadAttachment({ actor: someone.user, name: 'c.pdf', content: b64(simplePdf(['three'])) })).rejects.toMatchObject({ code: 'rate_limited:attachments', headers: { 'Retry-After': '3600' } });
    } finally {
      if (previous === undefined) delete process.env.ATTACHMENTS_PER_DAY; else process.env.ATTACHMENTS_PER_DAY = previous;
    }
  });

  it('serves a document only to its uploader until a published version names it', async () => {
    const up = await call('/api/attachments', { cookie: author.cookie, body: { name: 'private.pdf', content: b64(simplePdf(['unpublished'])) } });
    expect((await call(`/api/attachments/${up.body.id}`, { cookie: author.cookie })).status).toBe(200);
    expect((await call(`/api/attachments/${up.body.id}`, { cookie: engineer })).status).toBe(404);
    expect((await call(`/api/attachments/${up.body.id}`, { cookie: otherAuthor.cookie })).status).toBe(404);
    expect((await call(`/api/attachments/${up.body.id}`)).status).toBe(401);
    expect((await call('/api/attachments/not-a-uuid', { cookie: author.cookie })).status).toBe(422);
    // Another author cannot name someone else's unpublished upload in their own check cases.
    const cases: { source: Record<string, unknown> }[] = plateCases();
    cases[0].source = { ...cases[0].source, attachment: { id: up.body.id, sha256: up.body.sha256, mediaType: up.body.mediaType, name: up.body.name } };
    const theft = await call('/api/correlations', { cookie: otherAuthor.cookie, body: { slug: `attach-theft-${Date.now()}`, definition: plateDefinition(), checkCases: cases } });
    expect(theft.status).toBe(422);
    expect(theft.body.error.details.issues[0].path).toBe('checkCases[0].source.attachment');
  });

  it('puts the document’s hash in the version’s content hash, serves it to readers, and raises the alarm when the stored object is swapped', async () => {
    const up = await call('/api/attachments', { cookie: author.cookie, body: { name: 'rig-table-3.pdf', content: b64(pdf) } });
    const ref = { id: up.body.id, sha256: up.body.sha256, mediaType: up.body.mediaType, name: up.body.name };
    const slug = `attach-${Date.now()}`;
    const cases: { source: Record<string, unknown> }[] = plateCases();
    // A reference that does not match the upload is refused, naming the case.
    cases[1].source = { ...cases[1].source, attachment: { ...ref, sha256: 'f'.repeat(64) } };
    const wrong = await call('/api/correlations', { cookie: author.cookie, body: { slug, definition: plateDefinition(), checkCases: cases } });
    expect(wrong.status).toBe(422);
    expect(wrong.body.error.details.issues[0].path).toBe('checkCases[1].source.attachment');
    cases[1].source = { ...cases[1].source, attachment: ref };
    expect((await call('/api/correlations', { cookie: author.cookie, body: { slug, definition: plateDefinition(), checkCases: cases } })).status).toBe(200);
    expect((await call(`/api/correlations/${slug}/versions/1/submit`, { cookie: author.cookie, method: 'POST' })).status).toBe(200);
    expect((await call(`/api/correlations/${slug}/versions/1/decision`, { cookie: approver, body: { decision: 'approve', waiver: FIXTURE_WAIVER, comment: 'ok', password: DEMO_PASSWORD } })).status).toBe(200);

    const version = await call(`/api/correlations/${slug}/versions/1`, { cookie: engineer });
    expect(version.body.checkCases[1].source.attachment).toEqual(ref);
    expect(version.body.contentHash).toBe(contentHash(version.body.definition, version.body.checkCases));
    // Another document in the same place would be another version: the hash changes with the document's.
    const swapped = version.body.checkCases.map((c: { source: Record<string, unknown> }, i: number) => (i === 1 ? { ...c, source: { ...c.source, attachment: { ...ref, sha256: sha(simplePdf(['forged'])) } } } : c));
    expect(contentHash(version.body.definition, swapped)).not.toBe(version.body.contentHash);

    const served = await call(`/api/attachments/${ref.id}`, { cookie: engineer });
    expect(served.status).toBe(200);
    expect(served.headers.get('content-type')).toBe('application/pdf');
    expect(served.headers.get('x-content-type-options')).toBe('nosniff');

    // Swap the stored object behind the app's back, through the same S3 API.
    const s = storageSettings();
    const s3 = new S3Client({ endpoint: s.endpoint, region: s.region, forcePathStyle: true, credentials: { accessKeyId: s.accessKeyId, secretAccessKey: s.secretAccessKey } });
    const key = `attachments/${ref.sha256}`;
    await s3.send(new PutObjectCommand({ Bucket: s.bucket, Key: key, Body: simplePdf(['forged table']), ContentType: 'application/pdf' }));
    try {
      const refused = await call(`/api/attachments/${ref.id}`, { cookie: engineer });
      expect(refused.status).toBe(409);
      expect(refused.body.error.code).toBe('conflict:attachment-hash-mismatch');
      const alarms = await db().sequelize.query<{ entity_id: string }>("SELECT entity_id FROM audit_events WHERE action = 'integrity.attachment-mismatch'", { type: QueryTypes.SELECT });
      expect(alarms.map((a) => a.entity_id)).toContain(ref.id);
      expect((await verifyAllContent()).mismatches).toContain(`evidence document ${ref.id} (rig-table-3.pdf)`);
    } finally {
      await s3.send(new PutObjectCommand({ Bucket: s.bucket, Key: key, Body: pdf, ContentType: 'application/pdf' }));
    }
    expect((await call(`/api/attachments/${ref.id}`, { cookie: engineer })).status).toBe(200);
    expect((await verifyAllContent()).mismatches).toEqual([]);
  });
});
