import { route } from '@/lib/http/handler';
import { listDeliveries } from '@/lib/webhooks/service';
import { webhookIdParams } from '../../schema';

export const GET = route('GET /api/webhooks/{id}/deliveries', { params: webhookIdParams }, async ({ caller, params }) => ({
  items: await listDeliveries({ actor: caller!.user, id: params.id }),
}));
