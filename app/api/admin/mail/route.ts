import { route } from '@/lib/http/handler';
import { listSentMail } from '@/lib/mail/outbox';

export const GET = route('GET /api/admin/mail', {}, async () => ({
  items: (await listSentMail()).map((n) => ({
    id: n.id, to: n.toEmail, subject: n.subject, body: n.body, kind: n.kind, status: n.status, error: n.error, createdAt: n.createdAt, sentAt: n.sentAt,
  })),
}));
