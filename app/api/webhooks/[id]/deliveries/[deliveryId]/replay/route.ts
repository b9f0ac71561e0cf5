import { route } from '@/lib/http/handler';
import { replayDelivery } from '@/lib/webhooks/service';
import { deliveryParams } from '../../../../schema';

export const POST = route('POST /api/webhooks/{id}/deliveries/{deliveryId}/replay', { params: deliveryParams }, async ({ caller, params }) => replayDelivery({ actor: caller!.user, id: params.id, deliveryId: params.deliveryId }));
