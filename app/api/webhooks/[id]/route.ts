import { route } from '@/lib/http/handler';
import { deleteEndpoint } from '@/lib/webhooks/service';
import { webhookIdParams } from '../schema';

export const DELETE = route('DELETE /api/webhooks/{id}', { params: webhookIdParams }, async ({ caller, params }) => deleteEndpoint({ actor: caller!.user, id: params.id }));
