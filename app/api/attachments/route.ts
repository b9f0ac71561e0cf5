import { route } from '@/lib/http/handler';
import { attachmentBody } from '@/lib/api/contract';
import { uploadAttachment } from '@/lib/evidence/attachments';

/** Upload an evidence document (authors): PDF, PNG or JPEG by content, at most 5 MB, kept in object storage. */
export const POST = route('POST /api/attachments', { body: attachmentBody, maxBody: 7_100_000 }, async ({ caller, body }) =>
  uploadAttachment({ actor: caller!.user, name: body.name, content: body.content }));
