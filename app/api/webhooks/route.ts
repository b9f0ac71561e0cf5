import { route } from '@/lib/http/handler';
import { listEndpoints, registerEndpoint } from '@/lib/webhooks/service';
import { listWebhooksQuery, registerWebhookBody } from './schema';

export const GET = route('GET /api/webhooks', { query: listWebhooksQuery }, async ({ caller, query }) => ({
  items: await listEndpoints({ actor: caller!.user, all: query.all === '1' }),
}));

export const POST = route('POST /api/webhooks', { body: registerWebhookBody }, async ({ caller, body }) => registerEndpoint({ actor: caller!.user, url: body.url, events: body.events, slugs: body.slugs ?? null }));
