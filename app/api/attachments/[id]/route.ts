import { route } from '@/lib/http/handler';
import { attachmentParam } from '@/lib/api/contract';
import { readAttachment } from '@/lib/evidence/attachments';

/** An evidence document, re-hashed before it is served, for those who may read a version that uses it. */
export const GET = route('GET /api/attachments/{id}', { params: attachmentParam }, async ({ caller, params }) => {
  const doc = await readAttachment({ actor: caller!.user, id: params.id });
  const headers: Record<string, string> = {
    'content-type': doc.mediaType,
    'content-length': String(doc.bytes.byteLength),
    'content-disposition': `inline; filename*=UTF-8''${encodeURIComponent(doc.name)}`,
    'x-content-type-options': 'nosniff',
    etag: `"${doc.sha256}"`,
    'cache-control': 'private, no-cache',
  };
  // Content-Security-Policy and framing (the app's own pages only) come from next.config.mjs for this path.
  return new Response(Buffer.from(doc.bytes), { headers });
});
