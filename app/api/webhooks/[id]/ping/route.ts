import { route } from '@/lib/http/handler';
import { pingEndpoint } from '@/lib/webhooks/service';
import { webhookIdParams } from '../../schema';

export const POST = route('POST /api/webhooks/{id}/ping', { params: webhookIdParams }, async ({ caller, params }) => pingEndpoint({ actor: caller!.user, id: params.id }));
