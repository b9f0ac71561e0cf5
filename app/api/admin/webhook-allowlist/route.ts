import { route } from '@/lib/http/handler';
import { setWebhookAllowlist, webhookAllowlist } from '@/lib/webhooks/service';
import { allowlistBody } from '@/app/api/webhooks/schema';

export const GET = route('GET /api/admin/webhook-allowlist', {}, async () => ({ prefixes: await webhookAllowlist() }));
export const PUT = route('PUT /api/admin/webhook-allowlist', { body: allowlistBody }, async ({ caller, body }) => setWebhookAllowlist({ actor: caller!.user, prefixes: body.prefixes }));
